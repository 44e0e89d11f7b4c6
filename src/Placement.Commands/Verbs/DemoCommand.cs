using System.CommandLine;
using System.Globalization;
using Placement.Commands.Reports;
using Placement.IO;
using Placement.Parallelism;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Commands.Verbs;

/// <summary><c>placement demo</c>: the whole job on the built-in invented demo star, with no input file.</summary>
internal static class DemoCommand
{
    public static Command Create(CliContext context)
    {
        var directory = new Option<string>("--output-dir", "-o")
        {
            Description = "Directory for the demo's point file, report and figures.",
            DefaultValueFactory = _ => "placement-demo",
        };
        var count = new Option<int>("--count", "-n")
        {
            Description = "Number of points.",
            DefaultValueFactory = _ => 50_000,
        };
        var sampler = new Option<string>("--sampler", "-s")
        {
            Description = "Sampler name (see 'placement samplers').",
            DefaultValueFactory = _ => "healpix-shells",
        };
        var overwrite = new Option<bool>("--overwrite") { Description = "Replace files a previous demo run left in the directory." };
        var command = new Command("demo",
            "Run the whole job on the built-in demo body (an INVENTED two-zone star with a density step and a steep envelope, not a real star): place points, write HDF5 and VTK files, check them, write the report and figures.");
        command.Options.Add(directory);
        command.Options.Add(count);
        command.Options.Add(sampler);
        command.Options.Add(overwrite);
        command.SetAction(parse =>
        {
            string dir = parse.GetValue(directory)!;
            bool replace = parse.GetValue(overwrite);
            int n = parse.GetValue(count);
            if (n < 1) throw new CliException(ExitCodes.Usage, $"--count must be >= 1, got {n}.");
            string h5 = Path.Combine(dir, "demo-star.h5"), vtu = Path.Combine(dir, "demo-star.vtu"), report = Path.Combine(dir, "demo-star.report.json");
            string figures = Path.Combine(dir, "figures");
            if (File.Exists(dir))
                throw new CliException(ExitCodes.OutputRefused, $"--output-dir '{dir}' is a file; the demo writes its files into a directory there.");
            Directory.CreateDirectory(dir);
            OutputArguments.CheckWritable(replace, h5, vtu, report);
            QualityRun.CheckPlotsWritable(figures, replace);

            var body = DemoBody.Create(UnitSystem.Solar);
            var s = SamplerCatalogs.Create(context, parse.GetValue(sampler)!);
            var request = new SamplingRequest(body, n) { Seed = 1, Parallel = ParallelSettings.Default };
            var placed = context.Stage($"placing {n:N0} points with {s.Name}", _ => PointSampling.Place(s, request));
            var table = new PointTable(placed.Points);
            context.Stage("writing point files", _ =>
            {
                PointFiles.Write(table, h5, replace);
                PointFiles.Write(table, vtu, replace);
                return 0;
            });
            var quality = QualityRun.Evaluate(context, placed.Points, body, baseline: true, request.Seed, ParallelSettings.Default);
            QualityRun.WriteOutputs(context, quality, placed.Points, body, report, figures, replace);
            var c = CultureInfo.InvariantCulture;
            context.Output.WriteLine("Demo body: an invented two-zone star (solar units, G = 1; not a real stellar model).");
            context.Output.WriteLine(string.Create(c, $"placed {placed.Points.Count:N0} points with {s.Name}; wrote {h5}, {vtu}, {report} and figures in {figures}"));
            QualityTables.Write(context.Console, quality, $"quality of the demo placement, N = {placed.Points.Count:N0}");
            return ExitCodes.Ok;
        });
        return command;
    }
}
