using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using Placement.Commands.Reports;
using Placement.IO;
using Placement.Quality;
using Placement.Samplers;
using Placement.Tessellation;

namespace Placement.Commands.Verbs;

/// <summary><c>placement place</c>: places points for a profile and writes a point file.</summary>
internal static class PlaceCommand
{
    public static Command Create(CliContext context)
    {
        var profile = new ProfileArguments();
        var sampling = new SamplingArguments();
        var output = new Option<string>("--output", "-o")
        {
            Description = "Point file to write; the format follows the extension: .h5/.hdf5 (HDF5), .vtu (VTK XML), .csv.",
            Required = true,
        };
        var outputs = new OutputArguments();
        var core = new CoreReplacementArguments();
        var bodyOptions = new BodyArguments();
        var systemArguments = new CompanionBackgroundArguments();
        var rotation = new Option<string?>("--rotation")
        {
            Description = RotationArguments.Help,
        };
        var command = new Command("place", "Place points (SPH particles or mesh generators) for a profile and write them to a point file; optionally check them (--report, --plots).");
        profile.AddTo(command);
        sampling.AddTo(command);
        command.Options.Add(output);
        command.Options.Add(rotation);
        core.AddTo(command, withWriteProfile: false);
        systemArguments.AddTo(command);
        outputs.AddTo(command);
        bodyOptions.AddTo(command);
        command.SetAction(parse =>
        {
            string path = parse.GetValue(output)!;
            bool replace = parse.GetValue(outputs.Overwrite);
            try
            {
                PointFiles.FormatOf(path);
            }
            catch (ArgumentException ex)
            {
                throw new CliException(ExitCodes.Usage, ex.Message);
            }
            OutputArguments.CheckWritable(replace, path);
            outputs.CheckReportOutputs(parse);
            var loaded = context.Stage("loading profile", _ => profile.Load(parse));
            ProfileArguments.Notify(context, loaded);
            var (body, replaced) = core.Apply(parse, loaded);
            var bodyRequest = bodyOptions.Parse(parse, body, sampling.ModeOf(parse) == SamplingMode.MeshGenerators);
            bool check = outputs.WantsQuality(parse) && !bodyOptions.SkipsCheck(parse);
            if (bodyOptions.SkipsCheck(parse) && (parse.GetValue(outputs.Plots) is not null || bodyRequest is null))
                throw new CliException(ExitCodes.Usage, "--no-check skips the quality check: it goes with --report and a body option (--gamma, --resolution, --energy), not with --plots.");
            var sampler = SamplerCatalogs.Create(context, parse.GetValue(sampling.Sampler)!);
            var request = sampling.Request(parse, body, sampler);
            var assembly = systemArguments.Request(parse, request);
            var clock = Stopwatch.StartNew();
            var result = context.Stage($"placing {request.Count:N0} points with {sampler.Name}", _ => PointSampling.Place(sampler, request));
            double seconds = clock.Elapsed.TotalSeconds;
            result.Points.CheckValidity();
            var table = new PointTable(result.Points);
            if (replaced?.Core is { } pointMass) table.PointMasses.Add(pointMass);
            if (request.Mode == SamplingMode.MeshGenerators && assembly?.Background is null)
            {
                // Mesh generators: each point's mass becomes the profile mass of its own Voronoi cell (∫ρ dV by quadrature),
                // so the set starts with the exact mass in every cell; the cell volumes go into the file too.
                double reach = body.OuterRadius;
                for (int i = 0; i < result.Points.Count; i++) reach = Math.Max(reach, result.Points.Radius(i));
                var cells = context.Stage("integrating the profile mass of every Voronoi cell", _ =>
                    CellMasses.Integrate(result.Points, TessellationDomain.Sphere(0, 0, 0, reach * (1 + 1e-9)), body,
                        new TessellationOptions { Parallel = request.Parallel }));
                cells.Mass!.CopyTo(result.Points.Mass, 0);
                table.Add(PointColumnNames.CellVolume, cells.Volume, QuantityDimension.Volume, "Voronoi cell volume (ball domain of the profile radius)");
            }
            var notes = new List<string>(result.Plan.Notes);
            Func<double, double>? angularVelocity = null;
            if (parse.GetValue(rotation) is { } spec)
            {
                var (omega, description, note) = RotationArguments.Parse(spec, body);
                angularVelocity = omega;
                var (vx, vy, vz) = Bodies.Rotation.Velocities(result.Points, omega, null, request.Parallel);
                table.Add(PointColumn.Vector(PointColumnNames.Velocity, vx, vy, vz, QuantityDimension.Velocity, result.Points.Units, description));
                if (note is not null) notes.Add(note);
            }
            var bodyReport = bodyRequest is null ? null : BodyRun.Run(context, bodyRequest, table, body, request.Parallel!, angularVelocity);
            Bodies.BodyAssemblySummary? added = null;
            if (assembly is not null)
            {
                // The medium's own columns: u from the background pressure with the run's γ, SPH columns and carried
                // profile quantities by the rule in BodyRun.
                if (assembly.Background is { } medium)
                    assembly = assembly with
                    {
                        BackgroundInternalEnergy = bodyRequest?.Thermodynamics is { } thermo ? medium.Pressure / ((thermo.Gamma - 1) * medium.Density) : double.NaN,
                        BackgroundColumn = BodyRun.BackgroundColumns(body, bodyReport),
                    };
                (table, added) = CompanionBackgroundArguments.Assemble(context, table, body, assembly);
            }
            context.Stage($"writing {path}", _ =>
            {
                PointFiles.Write(table, path, replace);
                return 0;
            });
            QualityReport? quality = null;
            if (check)
            {
                quality = QualityRun.Evaluate(context, result.Points, body, !parse.GetValue(outputs.NoBaseline), request.Seed, request.Parallel!);
                QualityRun.WriteOutputs(context, quality, result.Points, body, parse.GetValue(outputs.Report), parse.GetValue(outputs.Plots), replace, bodyReport);
            }
            else if (bodyReport is not null && parse.GetValue(outputs.Report) is { } reportPath)
                BodyTables.WriteReport(context, reportPath, bodyReport, result.Points.Count, replace);
            var summary = new PlaceSummary(
                path, sampler.Name, result.Points.Count, request.Count, request.Seed, result.Points.Units.Name,
                result.Points.TotalMass(), body.TotalMass, seconds, notes.ToArray(),
                replaced is null ? null : CoreReplacementArguments.Json(replaced), bodyReport, added);
            if (context.Json) context.Output.WriteLine(JsonSerializer.Serialize(summary, CliJson.Options));
            else if (!context.Quiet)
            {
                context.Output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"wrote {table.Count:N0} points ({summary.Sampler}, seed {summary.Seed}) to {path} in {seconds:F2} s; total mass {summary.TotalMass:G10} of {summary.ProfileMass:G10} {result.Points.Units.MassUnitName}"));
                foreach (string note in summary.Notes) context.Output.WriteLine($"note: {note}");
                if (replaced is not null) foreach (string line in CoreReplacementArguments.Lines(replaced)) context.Output.WriteLine(line);
                if (bodyReport is not null) BodyTables.Write(context.Console, bodyReport);
                if (added is not null) foreach (string line in CompanionBackgroundArguments.Describe(added, result.Points.Units)) context.Output.WriteLine(line);
                if (quality is not null) QualityTables.Write(context.Console, quality, $"quality of {sampler.Name}, N = {result.Points.Count:N0}");
            }
            return ExitCodes.Ok;
        });
        return command;
    }

    private sealed record PlaceSummary(
        string Output, string Sampler, int Points, int RequestedPoints, ulong Seed, string Units,
        double TotalMass, double ProfileMass, double Seconds, string[] Notes, object? CoreReplacement, BodyReport? Body,
        Bodies.BodyAssemblySummary? System);
}
