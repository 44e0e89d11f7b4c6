using System.Globalization;
using Placement.Quality;
using Spectre.Console;

namespace Placement.Commands.Reports;

/// <summary>Renders a quality report as a readable terminal table, with the baseline beside it.</summary>
internal static class QualityTables
{
    private static readonly CultureInfo C = CultureInfo.InvariantCulture;

    public static void Write(IAnsiConsole console, QualityReport report, string title)
    {
        var b = report.Baseline;
        var table = new Table().Title(Markup.Escape(title)).AddColumns("measure", "this set", b is null ? "" : "Poisson baseline", "meaning");
        void Row(string name, Func<QualityReport, double> value, string format, string meaning) =>
            table.AddRow(name, value(report).ToString(format, C), b is null ? "" : value(b).ToString(format, C), Markup.Escape(meaning));
        Row("std ln(Vρ/m)", r => r.LogRatio.StandardDeviation, "F4", "cell-volume scatter (0 = every cell holds its mass)");
        Row("std ln(Vρ/m) body", r => r.LogRatioByRegion.BodyStandardDeviation, "F4",
            string.Create(C, $"cells whose kernel support (N_H = {report.LogRatioByRegion.NeighbourNumber:G3}) lies inside the body"));
        Row("std ln(Vρ/m) surface", r => r.LogRatioByRegion.SurfaceStandardDeviation, "F4", "cells within a kernel support of the surface");
        Row("std ln(Vρ/m) not cut", r => r.LogRatioByRegion.UncutStandardDeviation, "F4", "cells not cut by the domain boundary");
        Row("mean ln(Vρ/m) cut", r => r.LogRatioByRegion.CutMean, "F4",
            string.Create(C, $"the {report.LogRatioByRegion.CutCells} outermost cells, cut by the boundary"));
        Row("mean ln(Vρ/m)", r => r.LogRatio.Mean, "F4", "bias of cell volumes");
        Row("p1 / p99 ln(Vρ/m)", r => r.LogRatio.PercentileValues[^1] - r.LogRatio.PercentileValues[0], "F4", "width of the 1-99 % range");
        Row("radial density rms", r => r.RadialDensity.RmsError, "P2", "Voronoi vs target density, equal-mass bins");
        Row("radial density max", r => r.RadialDensity.MaxError, "P2", "worst bin");
        Row("enclosed mass max", r => r.EnclosedMass.MaxRelativeError, "P3", "max |M_points(<r)/M(r) - 1| at every point radius with >= 100 points inside");
        Row("offset d/R mean", r => r.Regularity.OffsetMean, "F4", "generator-centroid offset over cell radius");
        Row("face-angle ratio p95", r => r.Regularity.FaceAngleP95, "F3", "95th percentile of max sqrt(A/pi)/h");
        Row("cells a mesh code corrects", r => r.Regularity.FractionCorrected, "P2",
            string.Create(C, $"d/R > {report.Regularity.OffsetThreshold:G3} or face ratio > {report.Regularity.FaceAngleThreshold:G3}"));
        Row("mean faces", r => r.Regularity.MeanFaces, "F2", "Poisson-Voronoi: 15.54");
        if (report.Sph is { } sph)
        {
            Row("SPH ρ bias (body)", r => r.Sph?.BodyBias ?? double.NaN, "P2", $"mean ρ_SPH/ρ - 1, {sph.Kernel}, N_H = {sph.NeighbourNumber:G3}");
            Row("SPH ρ rms (body)", r => r.Sph?.BodyRmsError ?? double.NaN, "P2", "rms of ρ_SPH/ρ - 1 where the kernel lies inside the body");
            Row("SPH ρ rms (surface)", r => r.Sph?.SurfaceRmsError ?? double.NaN, "P2", "kernels cut by the surface read low by construction");
            if (sph.ShellBodyPoints > 0)
            {
                Row("SPH ρ rms (shells)", r => r.Sph?.ShellBodyRmsError ?? double.NaN, "P2",
                    string.Create(C, $"all shells but the outermost two ({sph.ShellBodyPoints:N0} points)"));
                Row("SPH ρ rms (outer 2 shells)", r => r.Sph?.OuterShellRmsError ?? double.NaN, "P2",
                    string.Create(C, $"the outermost two shells ({sph.OuterShellPoints:N0} points)"));
            }
            if (!double.IsNaN(sph.BodySmoothedRmsError))
            {
                Row("SPH ρ rms vs ρ̃ (body)", r => r.Sph?.BodySmoothedRmsError ?? double.NaN, "P2", "against the target seen through the same kernel: placement noise without smoothing bias");
                Row("SPH ρ rms vs ρ̃ (surface)", r => r.Sph?.SurfaceSmoothedRmsError ?? double.NaN, "P2", "ρ̃ truncates at the surface like the kernel sum");
                if (sph.ShellBodyPoints > 0)
                    Row("SPH ρ rms vs ρ̃ (shells)", r => r.Sph?.ShellBodySmoothedRmsError ?? double.NaN, "P2", "all shells but the outermost two, against ρ̃");
            }
        }
        console.Write(table);
    }
}
