using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Quality;
using Placement.Relaxation;
using Placement.Samplers;
using Placement.Tessellation;
using Placement.Tests.Quality;
using Placement.Tests.Tessellation;
using Placement.Units;

namespace Placement.Tests.Relaxation;

public class VoronoiCellGradientsTests
{
    [Fact]
    public void VolumeGradient_MatchesFiniteDifferencesOfTheTessellation()
    {
        // 300 uniform random points in the unit box: the derivative formula must match central differences of the
        // tessellation's own volumes (V is smooth in the generators away from degenerate configurations).
        var (x, y, z) = TestPoints.Uniform(300, 5);
        var domain = TessellationDomain.Box(0, 0, 0, 1, 1, 1);
        var options = new TessellationOptions { KeepFaces = true };
        var cells = VoronoiTessellation.Compute(x, y, z, domain, options);
        var geo = new VoronoiCellGradients();
        geo.Update(x, y, z, cells);
        // Rebuilt face areas agree with the tessellation's (same polygons, different arithmetic).
        for (int f = 0; f < cells.FaceArea!.Length; f++)
            if (cells.FaceNeighbour![f] >= 0) Assert.Equal(cells.FaceArea[f], geo.FaceArea[f], 9);
        const double h = 1e-6;
        int checkedEntries = 0;
        for (int j = 0; j < 300; j += 37)
        {
            for (int axis = 0; axis < 3; axis++)
            {
                var c = axis == 0 ? x : axis == 1 ? y : z;
                double keep = c[j];
                c[j] = keep + h;
                var plus = (double[])VoronoiTessellation.Compute(x, y, z, domain).Volume.Clone();
                c[j] = keep - h;
                var minus = (double[])VoronoiTessellation.Compute(x, y, z, domain).Volume.Clone();
                c[j] = keep;
                // ∂V_j/∂x_j.
                double self = axis == 0 ? geo.SelfGradientX[j] : axis == 1 ? geo.SelfGradientY[j] : geo.SelfGradientZ[j];
                AssertClose((plus[j] - minus[j]) / (2 * h), self);
                // ∂V_i/∂x_j for every neighbour i of j, read from i's face toward j.
                for (int f = geo.FaceStart[j]; f < geo.FaceStart[j + 1]; f++)
                {
                    int i = geo.FaceNeighbour[f];
                    if (i < 0) continue;
                    int g = geo.ReverseFace[f];
                    Assert.True(g >= 0);
                    double nb = axis == 0 ? geo.NeighbourGradientX[g] : axis == 1 ? geo.NeighbourGradientY[g] : geo.NeighbourGradientZ[g];
                    AssertClose((plus[i] - minus[i]) / (2 * h), nb);
                    checkedEntries++;
                }
            }
        }
        Assert.True(checkedEntries > 100);

        // Central differences with h = 1e-6 on O(1) cells: truncation O(h²) ≈ 1e-12, rounding ≈ 1e-16/h = 1e-10 per volume.
        static void AssertClose(double fd, double exact) => Assert.True(Math.Abs(fd - exact) < 1e-6 + 1e-5 * Math.Abs(exact), $"finite difference {fd}, formula {exact}");
    }

    [Fact]
    public void WeightedCentroid_OfAUniformWeight_IsThePlainCentroid_AndMovesUpTheGradientOtherwise()
    {
        var (x, y, z) = TestPoints.UniformBall(400, 9, 1.0);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.Sphere(0, 0, 0, 1.0), new TessellationOptions { KeepFaces = true });
        var geo = new VoronoiCellGradients();
        geo.Update(x, y, z, cells, new UniformSphere(1.0, 1.0), 5.0 / 3.0);
        for (int i = 0; i < 400; i++)
        {
            if (cells.CutByDomain[i]) continue;
            // Constant weight: the exact tetrahedron moments give the centroid to rounding.
            Assert.Equal(cells.CentroidX[i], geo.WeightedCentroidX[i], 10);
            Assert.Equal(cells.CentroidZ[i], geo.WeightedCentroidZ[i], 10);
        }
        // A weight falling outward (Plummer density) pulls every interior cell's weighted centroid inward of its plain one.
        geo.Update(x, y, z, cells, new TruncatedPlummer(1.0, 0.3, 1.0), 5.0 / 3.0);
        int inward = 0, interior = 0;
        for (int i = 0; i < 400; i++)
        {
            if (cells.CutByDomain[i]) continue;
            interior++;
            double rw = Math.Sqrt(geo.WeightedCentroidX[i] * geo.WeightedCentroidX[i] + geo.WeightedCentroidY[i] * geo.WeightedCentroidY[i] + geo.WeightedCentroidZ[i] * geo.WeightedCentroidZ[i]);
            double rc = Math.Sqrt(cells.CentroidX[i] * cells.CentroidX[i] + cells.CentroidY[i] * cells.CentroidY[i] + cells.CentroidZ[i] * cells.CentroidZ[i]);
            if (rw < rc) inward++;
        }
        Assert.Equal(interior, inward);
    }
}

public class VoronoiRelaxationTests
{
    private static PointSet Start(IRadialProfile body, string sampler, int n) =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create(sampler), new SamplingRequest(body, n) { Seed = 11 }).Points;

    private static QualityReport Check(PointSet p, IRadialProfile body) =>
        QualityChecker.Evaluate(p, body, options: QualityOptions.Default with { KeepPerPointValues = false, SphNeighbourNumber = 0 });

    private static double[] SortedRadii(PointSet p)
    {
        var r = new double[p.Count];
        for (int i = 0; i < p.Count; i++) r[i] = p.Radius(i);
        Array.Sort(r);
        return r;
    }

    /// <summary>
    /// std of ln(Vρ/m) over the cells whose generator lies farther than two target spacings (m/ρ)^{1/3} from the surface
    /// and from the density step at <paramref name="step"/> (if any): the cells where V ρ(r_i) = m is attainable.
    /// </summary>
    private static double SmoothBodyStd(PointSet p, IRadialProfile body, double step)
    {
        var report = QualityChecker.Evaluate(p, body, options: QualityOptions.Default with { SphNeighbourNumber = 0 });
        double sum = 0, sum2 = 0;
        int m = 0;
        for (int i = 0; i < p.Count; i++)
        {
            double r = p.Radius(i), v = report.PerPointLogRatio![i];
            double h = 2 * Math.Cbrt(p.Mass[i] / body.Density(r));
            if (!double.IsFinite(v) || r + h >= body.OuterRadius || Math.Abs(r - step) < h) continue;
            sum += v; sum2 += v * v; m++;
        }
        Assert.True(m > p.Count / 4);
        return Math.Sqrt(sum2 / m - (sum / m) * (sum / m));
    }

    [Theory]
    [InlineData("polytrope")]
    [InlineData("two-layer")]
    public void Relaxation_LowersTheCellVolumeScatter_BelowTheStartAndTheKernelRelaxation(string name)
    {
        // "two-layer" is an INVENTED body: a uniform core 30× denser than its uniform mantle, a density step at 0.4 R.
        // Polytrope: HEALPix shells, radii kept. Two-layer: a rank-stretched glass, radii rank-stretched (as the kernel relaxation does).
        bool poly = name == "polytrope";
        IRadialProfile body = poly ? new Polytrope(1.5, 1.0, 1.0, UnitSystem.Dimensionless) : new TwoLayerSphere(30.0, 1.0, 0.4, 1.0);
        double step = poly ? double.NaN : 0.4;
        string sampler = poly ? "healpix-shells" : "glass";
        const int n = 3000;
        var start = Start(body, sampler, n);
        var kernel = Start(body, sampler, n);
        var voronoi = Start(body, sampler, n);
        var radiiBefore = SortedRadii(voronoi);
        KernelRelaxation.Relax(kernel, body, new RelaxationSettings { MaxIterations = 10 });
        var history = VoronoiRelaxation.Relax(voronoi, body, new VoronoiRelaxationSettings
        {
            MaxIterations = 10,
            Radial = poly ? RadialConstraint.KeepRadii : RadialConstraint.RankStretch,
        });
        voronoi.CheckValidity();
        // Polytrope: the checker's body region (what reports and the README quote). Two-layer: cells away from the surface
        // and the step by two spacings. Measured on this machine (seed 11, N = 3000): polytrope 0.0327 start, 0.0707
        // kernel, 0.0271 Voronoi; two-layer 0.033, 0.036, 0.0048 (at N = 2000 the two-layer case failed this check).
        // Known limitation: on the polytrope the cells within two spacings of the steep surface, which the relaxation does
        // not target (ρ changes by more than e across them), get worse: on the polytrope the two-spacing measure went
        // 0.049 -> 0.070 with shells closed by predicted error (0.131 -> 0.058 with the older, rougher shells). Require 10 % below the
        // start and below the kernel relaxation of the same start.
        double Measure(PointSet p) => poly ? Check(p, body).LogRatioByRegion.BodyStandardDeviation : SmoothBodyStd(p, body, step);
        double s0 = Measure(start), sk = Measure(kernel), sv = Measure(voronoi);
        Assert.True(sv < 0.9 * s0 && sv < sk, $"{name}: body std ln(Vρ/m): start {s0:F4}, kernel {sk:F4}, Voronoi {sv:F4}");
        // Radii kept exactly (polytrope), or rank-stretched: the enclosed mass is exact either way.
        var radiiAfter = SortedRadii(voronoi);
        if (poly) for (int k = 0; k < n; k++) Assert.Equal(radiiBefore[k], radiiAfter[k], 12);
        Assert.True(Check(voronoi, body).EnclosedMass.MaxRelativeError < 1e-9);
        // The history has one entry per iteration plus the result, and the targeted scatter ends below where it began.
        Assert.Equal(history.Iterations + 1, history.LogRatioStd.Length);
        Assert.True(history.InteriorLogRatioStd[^1] < history.InteriorLogRatioStd[0]);
    }

    [Fact]
    public void Relaxation_OfAStepAwareShellStart_HoldsTheShellsFlankingTheStep_AndLowersTheScatter()
    {
        // The INVENTED two-zone demo star (a tabulated step at 0.2 R). HEALPix shells end a shell on the step with equal
        // thicknesses on both sides; those two shells must keep their points exactly (their shared Voronoi face is on
        // the step), while the rest relaxes. Measured: body std 0.059 -> 0.058 at N = 2e4 (15 iterations; 0.070 -> 0.062
        // before shells were closed by predicted cell-volume error).
        var star = DemoBodies.TwoZoneStar();
        double step = Assert.Single(star.DensitySteps);
        var p = Start(star, "healpix-shells", 6000);
        double inner = 0, outer = double.PositiveInfinity;
        for (int i = 0; i < p.Count; i++)
        {
            double r = p.Radius(i);
            if (r < step) inner = Math.Max(inner, r); else outer = Math.Min(outer, r);
        }
        // A shell's radii agree to rounding (each shell is rotated), so group within 1e-9 relative.
        var flank = Enumerable.Range(0, p.Count).Where(i => Math.Abs(p.Radius(i) - inner) <= 1e-9 * inner || Math.Abs(p.Radius(i) - outer) <= 1e-9 * outer).ToArray();
        var before = flank.Select(i => (p.X[i], p.Y[i], p.Z[i])).ToArray();
        double std0 = Check(p, star).LogRatioByRegion.BodyStandardDeviation;
        VoronoiRelaxation.Relax(p, star, new VoronoiRelaxationSettings { MaxIterations = 8 });
        Assert.True(flank.Length > 100);
        Assert.Equal(before, flank.Select(i => (p.X[i], p.Y[i], p.Z[i])).ToArray());
        double std1 = Check(p, star).LogRatioByRegion.BodyStandardDeviation;
        Assert.True(std1 < std0, $"body std {std0:F4} -> {std1:F4}");
    }

    [Fact]
    public void Relaxation_WithRankStretch_KeepsEnclosedMassExactFromAPoissonStart()
    {
        var body = new Polytrope(3.0, 1.0, 1.0, UnitSystem.Dimensionless);
        var p = Start(body, "poisson", 2000);
        double before = Check(p, body).LogRatioByRegion.BodyStandardDeviation;
        VoronoiRelaxation.Relax(p, body, new VoronoiRelaxationSettings { MaxIterations = 6, Radial = RadialConstraint.RankStretch });
        var report = Check(p, body);
        // Rank stretch: the k-th radius encloses (k + ½)/N of the mass, so the checker's enclosed-mass error vanishes to rounding.
        Assert.True(report.EnclosedMass.MaxRelativeError < 1e-9);
        // A Poisson start (body std ≈ 0.4–0.5, reference §9) must come down at least 2-fold in 6 steps.
        Assert.True(report.LogRatioByRegion.BodyStandardDeviation < before / 2, $"{before:F4} -> {report.LogRatioByRegion.BodyStandardDeviation:F4}");
    }

    [Fact]
    public void Relaxation_IsIdenticalOnOneAndTwoThreads()
    {
        // Same chunking (the tessellation's gather radius carries from cell to cell within a chunk), different thread counts.
        var body = new Polytrope(3.0, 1.0, 1.0, UnitSystem.Dimensionless);
        var a = Start(body, "healpix-shells", 2000);
        var b = Start(body, "healpix-shells", 2000);
        var settings = new VoronoiRelaxationSettings { MaxIterations = 3 };
        VoronoiRelaxation.Relax(a, body, settings, new ParallelSettings { MaxDegreeOfParallelism = 1, MinimumChunk = 64 });
        VoronoiRelaxation.Relax(b, body, settings, new ParallelSettings { MaxDegreeOfParallelism = 2, MinimumChunk = 64 });
        Assert.Equal(a.X, b.X);
        Assert.Equal(a.Y, b.Y);
        Assert.Equal(a.Z, b.Z);
    }
}

public class VoronoiRelaxedSamplerTests
{
    [Fact]
    public void VoronoiRelaxedSampler_PlacesExactlyN_WithExactMass_AndReportsItsHistory()
    {
        var body = new Polytrope(3.0, 2.0, 1.5, UnitSystem.Solar);
        var sampler = SamplerCatalog.CreateDefault().Create("voronoi-relaxed");
        var request = new SamplingRequest(body, 2500)
        {
            Seed = 4,
            Parameters = sampler.Describe().Parse(new Dictionary<string, string> { ["iterations"] = "3", ["tolerance"] = "0" }),
        };
        var result = PointSampling.Place(sampler, request);
        result.Points.CheckValidity();
        Assert.Equal(2.0, result.Points.TotalMass(), 12);
        var plan = Assert.IsType<Placement.Samplers.Relaxed.VoronoiRelaxedPlan>(result.Plan);
        Assert.Equal(3, plan.History.Iterations);
        Assert.Contains("healpix-shells", plan.Notes[0]);
        // The second note lists one overall/interior pair per history entry.
        Assert.Equal(plan.History.LogRatioStd.Length, plan.Notes[1].Split(' ').Count(t => t.Length > 0 && char.IsDigit(t[0]) && t.Contains('/', StringComparison.Ordinal)));
        Assert.Equal("voronoi-relaxed", result.Points.Provenance.Sampler);
    }

    [Fact]
    public void History_ResultIsTheLastKeptState()
    {
        // An undone step sends the set back; the result is the last state whose step was kept, not the undone one
        // (the sampler's note used to quote the undone state's scatter as the result).
        var history = new VoronoiRelaxationHistory([9.0, 8.9, 9.0, 8.95], [0.022, 0.096, 0.022, 0.070], [1, 1, 1, 1],
            [0.1, 0.1, 0.1, 0], [1, 1, 1, 1], [false, true, false, true], false);
        Assert.Equal(2, history.ResultIndex);
        var kept = history with { Undone = [false, false, false, false] };
        Assert.Equal(3, kept.ResultIndex);
    }
}
