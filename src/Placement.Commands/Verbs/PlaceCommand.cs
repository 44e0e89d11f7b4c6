using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using Placement.IO;
using Placement.Samplers;

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
        var overwrite = OutputArguments.Overwrite();
        var command = new Command("place", "Place points (SPH particles or mesh generators) for a profile and write them to a point file.");
        profile.AddTo(command);
        sampling.AddTo(command);
        command.Options.Add(output);
        command.Options.Add(overwrite);
        command.SetAction(parse =>
        {
            string path = parse.GetValue(output)!;
            bool replace = parse.GetValue(overwrite);
            try
            {
                PointFiles.FormatOf(path);
            }
            catch (ArgumentException ex)
            {
                throw new CliException(ExitCodes.Usage, ex.Message);
            }
            OutputArguments.CheckWritable(replace, path);
            var body = context.Stage("loading profile", _ => profile.Load(parse));
            var sampler = SamplerCatalogs.Create(context, parse.GetValue(sampling.Sampler)!);
            var request = sampling.Request(parse, body, sampler);
            var clock = Stopwatch.StartNew();
            var result = context.Stage($"placing {request.Count:N0} points with {sampler.Name}", _ => PointSampling.Place(sampler, request));
            double seconds = clock.Elapsed.TotalSeconds;
            result.Points.CheckValidity();
            context.Stage($"writing {path}", _ =>
            {
                PointFiles.Write(new PointTable(result.Points), path, replace);
                return 0;
            });
            var summary = new PlaceSummary(
                path, sampler.Name, result.Points.Count, request.Count, request.Seed, result.Points.Units.Name,
                result.Points.TotalMass(), body.TotalMass, seconds, result.Plan.Notes.ToArray());
            if (context.Json) context.Output.WriteLine(JsonSerializer.Serialize(summary, CliJson.Options));
            else if (!context.Quiet)
            {
                context.Output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"wrote {summary.Points:N0} points ({summary.Sampler}, seed {summary.Seed}) to {path} in {seconds:F2} s; total mass {summary.TotalMass:G10} of {summary.ProfileMass:G10} {result.Points.Units.MassUnitName}"));
                foreach (string note in summary.Notes) context.Output.WriteLine($"note: {note}");
            }
            return ExitCodes.Ok;
        });
        return command;
    }

    private sealed record PlaceSummary(
        string Output, string Sampler, int Points, int RequestedPoints, ulong Seed, string Units,
        double TotalMass, double ProfileMass, double Seconds, string[] Notes);
}
