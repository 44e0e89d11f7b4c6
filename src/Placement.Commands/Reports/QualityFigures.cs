using Placement.Plots;
using Placement.Points;
using Placement.Profiles;
using Placement.Quality;

namespace Placement.Commands.Reports;

/// <summary>Turns a quality report into the four standard figures and saves them as PNG and SVG.</summary>
internal static class QualityFigures
{
    /// <summary>The file names written into a plots directory, without extension.</summary>
    public static readonly string[] Names = ["density-profile", "enclosed-mass-error", "cell-volume-histogram", "slice", "sph-density"];

    /// <summary>Writes every figure as <c>name.png</c> and <c>name.svg</c> into <paramref name="directory"/>.</summary>
    public static IReadOnlyList<string> Save(string directory, QualityReport report, PointSet points, IRadialProfile profile, bool overwrite)
    {
        Directory.CreateDirectory(directory);
        var units = profile.Units;
        var written = new List<string>();
        void Write(string name, ScottPlot.Plot plot)
        {
            foreach (string ext in new[] { ".png", ".svg" })
            {
                string path = Path.Combine(directory, name + ext);
                FigureFile.Save(plot, path, overwrite);
                written.Add(path);
            }
        }

        // Target curve over the radii the measurement covers (a zero-density surface would otherwise stretch the
        // density axis over tens of decades), on radii spaced by profile sampling so steep envelopes are resolved.
        var rd = report.RadialDensity;
        int bins = rd.Target.Length;
        var mr = new double[bins];
        double minMeasured = double.PositiveInfinity;
        for (int k = 0; k < bins; k++)
        {
            // Bin radius: geometric mean of its edges (the innermost bin starts at 0: use a third of its outer edge).
            mr[k] = rd.InnerRadius[k] > 0 ? Math.Sqrt(rd.InnerRadius[k] * rd.OuterRadius[k]) : rd.OuterRadius[k] / 3;
            if (rd.Measured[k] > 0) minMeasured = Math.Min(minMeasured, Math.Min(rd.Measured[k], rd.Target[k]));
        }
        double rMin = bins > 0 ? mr[0] / 3 : 0;
        double rhoFloor = double.IsFinite(minMeasured) ? minMeasured / 30 : 0;
        var targetR = new List<double>();
        var targetRho = new List<double>();
        foreach (double r in ProfileSampling.Radii(profile, 600))
        {
            if (!(r >= rMin) || !(r > 0)) continue;
            double rho = profile.Density(r);
            if (rho > rhoFloor) { targetR.Add(r); targetRho.Add(rho); }
        }
        var densityPlot = DensityProfileFigure.Create(new DensityProfileData([.. targetR], [.. targetRho], mr, rd.Measured, null, null, units)
        {
            Title = "Voronoi density against the target",
            MeasuredLabel = "Voronoi density (equal-mass bins)",
        });
        densityPlot.Legend.Alignment = ScottPlot.Alignment.LowerLeft;
        Write(Names[0], densityPlot);
        Write(Names[1], EnclosedMassErrorFigure.Create(new EnclosedMassErrorData(report.EnclosedMass.Radius, report.EnclosedMass.RelativeError, units)));
        var baseline = report.Baseline?.PerPointLogRatio ?? [];
        Write(Names[2], CellVolumeHistogramFigure.Create(new CellVolumeHistogramData(report.PerPointLogRatio ?? [], baseline)));
        if (report.PerPointLogRatio is { } values)
        {
            // A slab about three mean spacings thick at the half-mass radius shows enough points to see structure.
            double half = profile.RadiusOfEnclosedMass(0.5 * profile.TotalMass);
            double slab = 1.5 * Math.Cbrt(4.0 / 3.0 * Math.PI * half * half * half / Math.Max(1, points.Count / 2.0));
            Write(Names[3], SliceScatterFigure.Create(new SliceScatterData(points.X, points.Y, points.Z, values, slab, units)));
        }
        if (report.Sph is { } sph)
        {
            // SPH density bias per equal-mass bin (at the bins' geometric-mean radii), ±1 % drawn as a band.
            var radii = new double[sph.Bias.Length];
            for (int k = 0; k < radii.Length; k++)
                radii[k] = sph.InnerRadius[k] > 0 ? Math.Sqrt(sph.InnerRadius[k] * sph.OuterRadius[k]) : sph.OuterRadius[k] / 3;
            Write(Names[4], EnclosedMassErrorFigure.Create(new EnclosedMassErrorData(radii, sph.Bias, units)
            {
                Title = $"SPH density bias ({sph.Kernel}, N_H = {sph.NeighbourNumber:G3})",
                YLabel = "⟨ρ_SPH/ρ⟩ − 1 [%]",
                Label = "mean per equal-mass bin",
                Tolerance = 0.01,
            }));
        }
        return written;
    }
}
