using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using Placement.Quality;
using Placement.Samplers;
using Spectre.Console;

namespace Placement.Commands.Verbs;

/// <summary><c>placement compare</c>: places the same profile with several samplers and tabulates speed and quality side by side.</summary>
internal static class CompareCommand
{
    public static Command Create(CliContext context)
    {
        var profile = new ProfileArguments();
        var sampling = new SamplingArguments(includeSampler: false);
        var samplers = new Option<string[]>("--samplers")
        {
            Description = "Samplers to compare (comma-separated or repeated); default: every catalogued sampler.",
            AllowMultipleArgumentsPerToken = true,
        };
        var neighbours = new Option<double>("--sph-neighbours")
        {
            Description = "Neighbour number N_H of the SPH density noise column (Wendland C2 kernel); 0 skips it.",
            DefaultValueFactory = _ => 64.0,
        };
        var command = new Command("compare", "Place one profile with several samplers (same N and seed) and compare time and quality side by side.");
        profile.AddTo(command);
        sampling.AddTo(command);
        command.Options.Add(samplers);
        command.Options.Add(neighbours);
        command.SetAction(parse =>
        {
            var body = profile.Load(parse, context);
            var catalog = SamplerCatalogs.For(context);
            var names = (parse.GetValue(samplers) ?? []).SelectMany(s => s.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)).ToList();
            if (names.Count == 0) names = [.. catalog.Names];
            double nh = parse.GetValue(neighbours);
            var rows = new List<CompareRow>();
            foreach (string name in names)
            {
                IPointSampler sampler;
                try
                {
                    sampler = catalog.Create(name);
                }
                catch (KeyNotFoundException ex)
                {
                    throw new CliException(ExitCodes.Usage, ex.Message);
                }
                var request = sampling.Request(parse, body, sampler, useParameters: false);
                var clock = Stopwatch.StartNew();
                var placed = context.Stage($"{name}: placing", _ => PointSampling.Place(sampler, request));
                double seconds = clock.Elapsed.TotalSeconds;
                var report = context.Stage($"{name}: tessellating and SPH densities", _ => QualityChecker.Evaluate(placed.Points, body,
                    options: QualityOptions.Default with { KeepPerPointValues = false, SphNeighbourNumber = nh }));
                double sphRms = report.Sph?.BodyRmsError ?? double.NaN, sphBias = report.Sph?.BodyBias ?? double.NaN;
                rows.Add(new CompareRow(name, placed.Points.Count, seconds, report.LogRatio.StandardDeviation,
                    report.LogRatioByRegion.BodyStandardDeviation, report.LogRatioByRegion.SurfaceStandardDeviation,
                    report.LogRatioByRegion.UncutStandardDeviation, report.RadialDensity.RmsError,
                    report.EnclosedMass.MaxRelativeError, report.Regularity.FractionCorrected, sphBias, sphRms,
                    report.Sph?.BodySmoothedRmsError ?? double.NaN, report.Sph?.ShellBodyRmsError ?? double.NaN));
            }
            if (context.Json)
            {
                context.Output.WriteLine(JsonSerializer.Serialize(rows, CliJson.Options));
                return ExitCodes.Ok;
            }
            var c = CultureInfo.InvariantCulture;
            var table = new Table().Title(Markup.Escape($"{names.Count} samplers, N = {parse.GetValue(sampling.Count):N0}, seed {parse.GetValue(sampling.Seed)}"))
                .AddColumns("sampler", "N", "place (s)", "std ln(Vρ/m)", "body", "surface", "not cut", "radial ρ rms", "encl. mass max", "mesh corrects", "SPH ρ bias", "SPH ρ rms", "SPH rms vs ρ̃", "SPH rms shells");
            foreach (var r in rows)
                table.AddRow(r.Sampler, r.Points.ToString("N0", c), r.PlaceSeconds.ToString("F3", c), r.LogRatioStd.ToString("F4", c),
                    r.LogRatioStdBody.ToString("F4", c), r.LogRatioStdSurface.ToString("F4", c), r.LogRatioStdUncut.ToString("F4", c),
                    r.RadialDensityRms.ToString("P2", c), r.EnclosedMassMax.ToString("P3", c), r.FractionCorrected.ToString("P1", c),
                    double.IsNaN(r.SphBias) ? "-" : r.SphBias.ToString("+0.00%;-0.00%", c), double.IsNaN(r.SphRms) ? "-" : r.SphRms.ToString("P2", c),
                    double.IsNaN(r.SphRmsSmoothed) ? "-" : r.SphRmsSmoothed.ToString("P2", c),
                    double.IsNaN(r.SphRmsShells) ? "-" : r.SphRmsShells.ToString("P2", c));
            context.Console.Write(table);
            context.Output.WriteLine("body / surface: std ln(Vρ/m) of the cells whose SPH kernel support lies inside / reaches past the outermost points (or the profile radius); not cut: every cell but the outermost layer cut by the boundary (the overall column keeps all).");
            context.Output.WriteLine("SPH columns: Wendland C2, points whose kernel support lies inside the outermost points (kernels cut by the edge read low by construction; see check --report); 'vs ρ̃' compares with the target seen through the same kernel and support, which removes the kernel's smoothing bias and leaves the placement's noise; 'shells' (sets on shells only) takes every shell but the outermost two.");
            return ExitCodes.Ok;
        });
        return command;
    }

    private sealed record CompareRow(string Sampler, int Points, double PlaceSeconds, double LogRatioStd, double LogRatioStdBody,
        double LogRatioStdSurface, double LogRatioStdUncut, double RadialDensityRms,
        double EnclosedMassMax, double FractionCorrected, double SphBias, double SphRms, double SphRmsSmoothed, double SphRmsShells);
}
