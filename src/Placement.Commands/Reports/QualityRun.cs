using Placement.IO;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Quality;
using Placement.Samplers;

namespace Placement.Commands.Reports;

/// <summary>The check step shared by <c>place</c>, <c>check</c>, <c>compare</c> and <c>demo</c>: evaluate, then write what was asked.</summary>
internal static class QualityRun
{
    /// <summary>Seed offset of the Poisson baseline, so it never coincides with the set's own stream.</summary>
    private const ulong BaselineSeedOffset = 0x5EED_BA5E;

    /// <summary>A Poisson set of the same N for the baseline columns.</summary>
    public static PointSet PoissonBaseline(IRadialProfile profile, int count, ulong seed, ParallelSettings parallel) =>
        PointSampling.Place(new PoissonSampler(), new SamplingRequest(profile, count) { Seed = seed + BaselineSeedOffset, Parallel = parallel }).Points;

    public static QualityReport Evaluate(CliContext context, PointSet points, IRadialProfile profile, bool baseline, ulong seed, ParallelSettings parallel)
    {
        var base_ = baseline ? context.Stage("placing the Poisson baseline", _ => PoissonBaseline(profile, points.Count, seed, parallel)) : null;
        return context.Stage($"tessellating {points.Count:N0} cells{(baseline ? " (and the baseline)" : "")}", _ => QualityChecker.Evaluate(points, profile, baseline: base_));
    }

    /// <summary>Writes the JSON report and the figures where asked (atomically; existing files only with overwrite).</summary>
    /// <remarks>With <paramref name="body"/> (place only) the JSON report gains a top-level "body" property.</remarks>
    public static void WriteOutputs(CliContext context, QualityReport report, PointSet points, IRadialProfile profile, string? reportPath, string? plotsDirectory, bool overwrite,
        BodyReport? body = null)
    {
        if (reportPath is not null)
        {
            string json = body is null ? QualityJson.Serialize(report) : BodyTables.ReportJson(QualityJson.Serialize(report), body, report.PointCount);
            AtomicFile.Write(reportPath, overwrite, stream =>
            {
                using var writer = new StreamWriter(stream, leaveOpen: true);
                writer.Write(json);
            });
            context.Info($"wrote quality report {reportPath}");
        }
        if (plotsDirectory is not null)
        {
            var files = context.Stage($"drawing figures into {plotsDirectory}", _ => QualityFigures.Save(plotsDirectory, report, points, profile, overwrite));
            context.Info($"wrote {files.Count} figure files into {plotsDirectory}");
        }
    }

    /// <summary>Refuses up front when a figure file exists and overwrite was not asked for.</summary>
    public static void CheckPlotsWritable(string? directory, bool overwrite)
    {
        if (directory is null) return;
        // A file where the figures' directory should go cannot be replaced by one, --overwrite or not; found late it left
        // the point file written and said only ".NET: the file already exists".
        if (File.Exists(directory))
            throw new CliException(ExitCodes.OutputRefused, $"--plots '{directory}' is a file; the figures need a directory there.");
        if (overwrite || !Directory.Exists(directory)) return;
        foreach (string name in QualityFigures.Names)
            foreach (string ext in new[] { ".png", ".svg" })
                if (File.Exists(Path.Combine(directory, name + ext)))
                    throw new CliException(ExitCodes.OutputRefused, $"figure '{Path.Combine(directory, name + ext)}' exists; pass --overwrite to replace it.");
    }
}
