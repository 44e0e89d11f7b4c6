using Placement.Points;
using Placement.Profiles;
using Placement.Quality;
using Placement.Random;
using Placement.Tessellation;
using Placement.Tests.Tessellation;
using Placement.Units;

namespace Placement.Tests.Quality;

public class QualityCheckerTests
{
    private static PointSet Set((double[] X, double[] Y, double[] Z) p, double mass)
    {
        var set = new PointSet(p.X.Length, UnitSystem.Dimensionless);
        p.X.CopyTo(set.X, 0); p.Y.CopyTo(set.Y, 0); p.Z.CopyTo(set.Z, 0);
        Array.Fill(set.Mass, mass);
        return set;
    }

    // Points drawn from the profile itself: r = r(uM) (inverse of M) and a uniform direction, keyed by index.
    private static PointSet SampleProfile(IRadialProfile profile, int n, ulong seed)
    {
        var set = new PointSet(n, UnitSystem.Dimensionless);
        for (int i = 0; i < n; i++)
        {
            var rng = new KeyedRandom(seed, (ulong)i);
            double r = profile.RadiusOfEnclosedMass(profile.TotalMass * rng.NextDouble());
            double cz = 2 * rng.NextDouble() - 1, phi = 2 * Math.PI * rng.NextDouble(), s = Math.Sqrt(1 - cz * cz);
            set.X[i] = r * s * Math.Cos(phi); set.Y[i] = r * s * Math.Sin(phi); set.Z[i] = r * cz;
            set.Mass[i] = profile.TotalMass / n;
        }
        return set;
    }

    [Fact]
    public void BccLattice_InUniformDensity_HasZeroLogRatioAndKnownFaceAngles_PoissonBaselineDoesNot()
    {
        // A uniform sphere large enough to cover the periodic box [0, 6)³: ρ constant in the box.
        var profile = new UniformSphere(1000.0, 20.0);
        double rho = profile.Density(0);
        const int m = 6;
        var lattice = Set(TestPoints.Lattice(m, TestPoints.Bcc, 0.25), rho * 0.5); // BCC cell volume 1/2 (a = 1)
        var poisson = Set(TestPoints.Uniform(lattice.Count, 71, 0, m), rho * 0.5);
        var report = QualityChecker.Evaluate(lattice, profile, TessellationDomain.PeriodicBox(0, 0, 0, m, m, m), baseline: poisson);

        Assert.Equal(lattice.Count, report.LogRatio.Count);
        Assert.True(report.LogRatio.MaxAbsolute < 1e-12);
        Assert.Equal(0.0, report.Regularity.FractionCorrected);
        Assert.True(report.Regularity.OffsetMax < 1e-12);
        // BCC hexagonal face: area (3√3/2)(√2/4)² at distance √3/4 ⇒ √(A/π)/h = 0.742517 [computed].
        double hexArea = 1.5 * Math.Sqrt(3) * 0.125, expected = Math.Sqrt(hexArea / Math.PI) / (Math.Sqrt(3) / 4);
        Assert.Equal(expected, report.Regularity.FaceAngleMax, 10);
        Assert.Equal(14.0, report.Regularity.MeanFaces, 12);

        var b = report.Baseline!;
        // Poisson–Voronoi volumes: var(V/<V>) ≈ 0.179 (reference notes §9) ⇒ sd of ln V ≈ 0.44 under the usual
        // gamma approximation (approximate, so only a loose range is asserted).
        Assert.InRange(b.LogRatio.StandardDeviation, 0.3, 0.6);
        Assert.True(b.Regularity.FractionCorrected > 0.5);
        Assert.Null(b.Baseline);
    }

    [Fact]
    public void PointsDrawnFromPlummer_MatchDensityAndEnclosedMassWithinSamplingNoise()
    {
        var profile = new TruncatedPlummer(1.0, 0.25, 1.0);
        const int n = 20000;
        var points = SampleProfile(profile, n, 73);
        var report = QualityChecker.Evaluate(points, profile);
        // Radii drawn independently from M(r): a bin's point count (≈ 1000) has Poisson noise 1/√1000 = 3.2 %, and
        // the bin's cells share the bin's volume, so each bin's Σm/Σ∫ρdV scatters by about that; allow 4.5 % rms
        // and 11 % max (3.5 sigma over 20 bins).
        Assert.InRange(report.RadialDensity.RmsError, 0, 0.045);
        Assert.InRange(report.RadialDensity.MaxError, 0, 0.11);
        // Enclosed mass of radii drawn from M(r): sup deviation ~ 1.36/√N = 0.0096 at 95 % (Kolmogorov); allow 0.02.
        Assert.InRange(report.EnclosedMass.MaxErrorOfTotal, 0, 0.02);
        // ln(Vρ/m) of a Poisson-like set centres near zero with sd ≈ 0.4–0.5.
        Assert.InRange(report.LogRatio.StandardDeviation, 0.3, 0.7);
        Assert.Equal("point masses", report.MassSource);
        Assert.Equal(20, report.RadialDensity.Target.Length);
        Assert.Equal(n, report.PerPointLogRatio!.Length);
        int histogramTotal = report.LogRatioHistogram.Counts.Sum() + report.LogRatioHistogram.Below + report.LogRatioHistogram.Above;
        Assert.Equal(report.LogRatio.Count, histogramTotal);
    }

    [Fact]
    public void ZeroMasses_UseEqualSharesOfTheProfileMass()
    {
        var profile = new TruncatedPlummer(1.0, 0.25, 1.0);
        var points = SampleProfile(profile, 3000, 79);
        Array.Clear(points.Mass);
        var report = QualityChecker.Evaluate(points, profile);
        Assert.Equal("equal shares of the profile mass", report.MassSource);
        // The outermost point counts half at its own radius (symmetric convention of EnclosedMassComparison).
        Assert.Equal(1.0 - 0.5 / 3000, report.EnclosedMass.PointMass[^1] / profile.TotalMass, 12);
    }

    [Fact]
    public void Report_RoundTripsThroughJson()
    {
        var profile = new TruncatedPlummer(1.0, 0.25, 1.0);
        var points = SampleProfile(profile, 2000, 83);
        var baseline = SampleProfile(new UniformSphere(profile.TotalMass, 1.0), 2000, 89);
        var report = QualityChecker.Evaluate(points, profile, baseline: baseline);
        string json = QualityJson.Serialize(report);
        Assert.Contains("\"logRatio\"", json, StringComparison.Ordinal);
        Assert.Contains("\"baseline\"", json, StringComparison.Ordinal);
        var back = QualityJson.Deserialize(json);
        Assert.Equal(report.LogRatio.Mean, back.LogRatio.Mean);
        Assert.Equal(report.RadialDensity.Measured, back.RadialDensity.Measured);
        Assert.Equal(report.Baseline!.Regularity.FractionCorrected, back.Baseline!.Regularity.FractionCorrected);
        Assert.Equal(report.LogRatio.Worst.Length, back.LogRatio.Worst.Length);
        Assert.Equal(report.LogRatio.Worst[0], back.LogRatio.Worst[0]);
    }

    [Fact]
    public void LogRatioSplit_PartitionsTheCells_AndCombinesToTheOverallStatistics()
    {
        var profile = new TruncatedPlummer(1.0, 0.25, 1.0);
        var points = SampleProfile(profile, 4000, 97);
        var withSph = QualityChecker.Evaluate(points, profile);
        var withoutSph = QualityChecker.Evaluate(points, profile, options: QualityOptions.Default with { SphNeighbourNumber = 0 });
        foreach (var report in new[] { withSph, withoutSph })
        {
            var split = report.LogRatioByRegion;
            Assert.Equal(report.LogRatio.Count, split.BodyCells + split.SurfaceCells);
            Assert.True(split.BodyCells > 0 && split.SurfaceCells > 0);
            // The two regions' means, weighted by their counts, give the overall mean (exact identity, to rounding).
            double mean = (split.BodyMean * split.BodyCells + split.SurfaceMean * split.SurfaceCells) / report.LogRatio.Count;
            Assert.Equal(report.LogRatio.Mean, mean, 12);
            // Pooled variance = within-region variances + between-region spread (exact identity, to rounding).
            double pooled = (split.BodyCells * (split.BodyStandardDeviation * split.BodyStandardDeviation + Math.Pow(split.BodyMean - mean, 2))
                + split.SurfaceCells * (split.SurfaceStandardDeviation * split.SurfaceStandardDeviation + Math.Pow(split.SurfaceMean - mean, 2)))
                / report.LogRatio.Count;
            Assert.Equal(report.LogRatio.StandardDeviation, Math.Sqrt(pooled), 10);
            // The cut cells are the outermost layer: a minority of the cells.
            Assert.True(split.CutCells > 0 && split.CutCells < report.LogRatio.Count / 2);
            Assert.True(double.IsFinite(split.CutMean) && double.IsFinite(split.UncutStandardDeviation));
        }
        Assert.Equal("sph", withSph.LogRatioByRegion.SupportSource);
        Assert.Equal("target", withoutSph.LogRatioByRegion.SupportSource);
        // The SPH split uses exactly the SPH comparison's body set.
        Assert.Equal(withSph.Sph!.BodyPoints, withSph.LogRatioByRegion.BodyCells);
        var back = QualityJson.Deserialize(QualityJson.Serialize(withSph));
        Assert.Equal(withSph.LogRatioByRegion, back.LogRatioByRegion);
    }

    [Fact]
    public void BodySurfaceSplit_FollowsTheOutermostPoints_WhenASteepEnvelopeEndsWellInsideR()
    {
        // An n = 3 polytrope with 3000 HEALPix-shell points: the envelope beyond ~0.6 R holds less than one layer, so
        // the outermost shell lies far inside R (checked below). Measured from R no kernel would reach the surface and
        // the outermost shells, whose kernels see vacuum beyond them, would count as body.
        var profile = new Polytrope(3, 1, 1);
        var points = Placement.Samplers.PointSampling.Place(new Placement.Samplers.Shells.HealpixShellSampler(), new Placement.Samplers.SamplingRequest(profile, 3000)).Points;
        var report = QualityChecker.Evaluate(points, profile, options: QualityOptions.Default with { SphSmoothedTarget = false });
        double outermost = 0;
        for (int i = 0; i < points.Count; i++) outermost = Math.Max(outermost, points.Radius(i));
        Assert.True(outermost < 0.9 * profile.OuterRadius, $"outermost point at {outermost}");
        var sph = report.Sph!;
        Assert.Equal(outermost, sph.EdgeRadius, 15);
        Assert.Equal(outermost, report.LogRatioByRegion.EdgeRadius, 15);
        // Recount with the SPH supports of the same estimate: surface = kernel reaches past the outermost point.
        var estimate = Placement.Sph.SphDensity.Compute(points, Placement.Sph.SphKernel.WendlandC2, QualityOptions.Default.SphNeighbourNumber);
        int surface = 0, outerShell = 0;
        for (int i = 0; i < points.Count; i++)
        {
            double r = points.Radius(i);
            if (r + estimate.Support[i] >= outermost) surface++;
            if (r >= outermost * (1 - 1e-9)) outerShell++;
        }
        Assert.Equal(surface, sph.SurfacePoints);
        Assert.Equal(points.Count - surface, sph.BodyPoints);
        Assert.True(sph.SurfacePoints >= outerShell && outerShell > 0);
        Assert.True(sph.BodyPoints > 0);
    }

    [Fact]
    public void SphSplitByShells_ExcludesTheOutermostTwoShells_OnlyForSetsOnShells()
    {
        // A HEALPix-shell set of the n = 3/2 polytrope: its layers are shells, so the SPH error is also quoted over all
        // shells but the outermost two, and over those two apart. Recomputed here from the same SPH estimate.
        var profile = new Polytrope(1.5, 1, 1);
        var points = Placement.Samplers.PointSampling.Place(new Placement.Samplers.Shells.HealpixShellSampler(), new Placement.Samplers.SamplingRequest(profile, 4000)).Points;
        var options = QualityOptions.Default with { SphSmoothedTarget = false };
        var report = QualityChecker.Evaluate(points, profile, options: options);
        var sph = report.Sph!;
        var estimate = Placement.Sph.SphDensity.Compute(points, Placement.Sph.SphKernel.WendlandC2, options.SphNeighbourNumber);
        int top = points.Layer.Max();
        double inner = 0, outer = 0; int nInner = 0, nOuter = 0;
        for (int i = 0; i < points.Count; i++)
        {
            double e = estimate.Density[i] / profile.Density(points.Radius(i)) - 1;
            if (points.Layer[i] >= top - 1) { outer += e * e; nOuter++; } else { inner += e * e; nInner++; }
        }
        Assert.True(nOuter > 0 && nInner > nOuter);
        Assert.Equal(nInner, sph.ShellBodyPoints);
        Assert.Equal(nOuter, sph.OuterShellPoints);
        Assert.Equal(Math.Sqrt(inner / nInner), sph.ShellBodyRmsError, 12);
        Assert.Equal(Math.Sqrt(outer / nOuter), sph.OuterShellRmsError, 12);
        Assert.True(double.IsNaN(sph.ShellBodySmoothedRmsError)); // ρ̃ switched off
        var back = QualityJson.Deserialize(QualityJson.Serialize(report)).Sph!;
        Assert.Equal((sph.ShellBodyPoints, sph.ShellBodyRmsError, sph.OuterShellRmsError), (back.ShellBodyPoints, back.ShellBodyRmsError, back.OuterShellRmsError));

        // The same points with one point moved off its shell's radius: no longer a set on shells, nothing split by shells.
        points.X[0] *= 1.01; points.Y[0] *= 1.01; points.Z[0] *= 1.01;
        var moved = QualityChecker.Evaluate(points, profile, options: options).Sph!;
        Assert.Equal(0, moved.ShellBodyPoints);
        Assert.True(double.IsNaN(moved.ShellBodyRmsError) && double.IsNaN(moved.OuterShellRmsError));
    }
}
