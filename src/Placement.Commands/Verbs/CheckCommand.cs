using System.CommandLine;
using Placement.Commands.Reports;
using Placement.IO;
using Placement.Quality;

namespace Placement.Commands.Verbs;

/// <summary><c>placement check</c>: measures an existing point file against its profile.</summary>
internal static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var profile = new ProfileArguments();
        var points = new Option<string>("--points")
        {
            Description = "Point file to check (a Placement HDF5 file, .h5/.hdf5).",
            Required = true,
        };
        var seed = new Option<ulong>("--seed")
        {
            Description = "Seed of the Poisson baseline.",
            DefaultValueFactory = _ => 1UL,
        };
        var threads = new Option<int>("--threads")
        {
            Description = "Worker threads (0 = one per processor). Never changes the result.",
            DefaultValueFactory = _ => 0,
        };
        var outputs = new OutputArguments();
        var core = new CoreReplacementArguments();
        var command = new Command("check", "Measure a point file against its profile on its Voronoi cells: cell-volume scatter, radial density, enclosed mass, mesh regularity, with a Poisson baseline.");
        command.Options.Add(points);
        profile.AddTo(command);
        command.Options.Add(seed);
        command.Options.Add(threads);
        core.AddTo(command, withWriteProfile: false);
        outputs.AddTo(command);
        command.SetAction(parse =>
        {
            outputs.CheckReportOutputs(parse);
            string path = parse.GetValue(points)!;
            if (!File.Exists(path)) throw new CliException(ExitCodes.BadInput, $"point file '{path}' does not exist.");
            PointTable table;
            try
            {
                table = context.Stage($"reading {path}", _ => PointFiles.Read(path));
            }
            catch (PointFileFormatException ex)
            {
                throw new CliException(ExitCodes.BadInput, ex.Message, ex);
            }
            var (body, _) = core.Apply(parse, profile.Load(parse, context));
            if (table.Points.Units.Name != body.Units.Name)
                throw new CliException(ExitCodes.BadInput,
                    $"'{path}' is in '{table.Points.Units.Name}' units but the profile is in '{body.Units.Name}'; pass --units {table.Points.Units.Name}.");
            int t = parse.GetValue(threads);
            var parallel = new Parallelism.ParallelSettings { MaxDegreeOfParallelism = t <= 0 ? -1 : t };
            var placed = table.Points;
            if (Bodies.PlacedBody.IsEmbedded(table))
            {
                // A file from `place --companion/--background`: measure the body alone, about its own centre.
                placed = Bodies.PlacedBody.Of(table);
                context.Info($"measuring the body's {placed.Count:N0} points about its own centre (background points and the centre-of-mass shift left out)");
            }
            var report = QualityRun.Evaluate(context, placed, body, !parse.GetValue(outputs.NoBaseline), parse.GetValue(seed), parallel);
            QualityRun.WriteOutputs(context, report, placed, body, parse.GetValue(outputs.Report), parse.GetValue(outputs.Plots), parse.GetValue(outputs.Overwrite));
            if (context.Json) context.Output.WriteLine(QualityJson.Serialize(report with { PerPointLogRatio = null, Baseline = report.Baseline is null ? null : report.Baseline with { PerPointLogRatio = null } }));
            else QualityTables.Write(context.Console, report, $"quality of {path}, N = {placed.Count:N0}");
            return ExitCodes.Ok;
        });
        return command;
    }
}
