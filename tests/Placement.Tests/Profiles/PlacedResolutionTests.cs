using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Tessellation;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class PlacedResolutionTests
{
    private static PointSet Shells(IRadialProfile body, int n) =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(body, n) { Seed = 7 }).Points;

    private static double[] TargetVolumes(PointSet points, IRadialProfile body)
    {
        var v = new double[points.Count];
        for (int i = 0; i < v.Length; i++) v[i] = points.Mass[i] / body.Density(points.Radius(i));
        return v;
    }

    [Fact]
    public void WithTheTargetVolumePerPoint_AgreesWithTheProfilePrediction()
    {
        // Same definition of spacing (cube of the volume per point) and H_P: the placed report at a bin's mean radius must
        // reproduce the profile-only prediction there. Bins inside one shell (all points at one radius) agree to rounding;
        // bins straddling two shells differ by the spread of ρ between them (measured up to 7.3 % in the outer shells).
        var body = new Polytrope(3, 1, 1, UnitSystem.Solar);
        var points = Shells(body, 10_000);
        var placed = ScaleHeights.PlacedResolution(body, points, TargetVolumes(points, body), 8);
        Assert.Equal(50, placed.Radius.Length);
        int exact = 0;
        for (int b = 0; b < placed.Radius.Length; b++)
        {
            double r = placed.Radius[b];
            double predicted = ScaleHeights.PressureScaleHeight(body, r) / Math.Cbrt(body.TotalMass / (points.Count * body.Density(r)));
            double deviation = Math.Abs(placed.CellsPerScaleHeight[b] / predicted - 1);
            Assert.True(deviation < 0.08, $"bin {b} at r = {r}: {deviation:P2}");
            if (deviation < 1e-9) exact++;
            Assert.Equal(points.Count * Math.Pow(8 / placed.CellsPerScaleHeight[b], 3), placed.PointsNeeded[b], 1e-9 * placed.PointsNeeded[b]);
        }
        Assert.True(exact >= 25, $"only {exact} of 50 bins agree to rounding");
        Assert.Equal(placed.MinimumCellsPerScaleHeight, placed.CellsPerScaleHeight.Min());
        Assert.Equal(points.Count * Math.Pow(8 / placed.MinimumCellsPerScaleHeight, 3), placed.MaxPointsNeeded, 1e-9 * placed.MaxPointsNeeded);
    }

    [Fact]
    public void PlacingThePointsItAsksFor_ReachesTheThresholdEverywhere_WithVoronoiVolumes()
    {
        // Ask what N gives 1.6 × the cells per H_P that 4000 points give, place that many and measure again (Voronoi cells).
        var body = DemoBodies.TwoZoneStar();
        var domain = TessellationDomain.Sphere(0, 0, 0, body.OuterRadius * 1.000001);
        var coarse = Shells(body, 4000);
        var first = ScaleHeights.PlacedResolution(body, coarse, VoronoiTessellation.Compute(coarse, domain).Volume, null, innerRadius: 0.05, bins: 20);
        Assert.True(double.IsNaN(first.MaxPointsNeeded) && double.IsNaN(first.PointsNeeded[0]));
        Assert.All(first.Radius, r => Assert.True(r >= 0.05));
        double wanted = 1.6 * first.MinimumCellsPerScaleHeight;
        var asked = ScaleHeights.PlacedResolution(body, coarse, VoronoiTessellation.Compute(coarse, domain).Volume, wanted, innerRadius: 0.05, bins: 20);
        int n = (int)Math.Ceiling(asked.MaxPointsNeeded);
        Assert.InRange(n, 15_000, 18_000); // 4000 × 1.6³ = 16 384
        var fine = Shells(body, n);
        var second = ScaleHeights.PlacedResolution(body, fine, VoronoiTessellation.Compute(fine, domain).Volume, wanted, innerRadius: 0.05, bins: 20);
        // Spacing follows N^(-1/3) up to the shell layout's rounding of N_side per shell: within 5 % of the wanted value.
        Assert.True(second.MinimumCellsPerScaleHeight > 0.95 * wanted, $"{second.MinimumCellsPerScaleHeight} vs wanted {wanted}");
    }

    [Fact]
    public void BadArguments_AreRefused()
    {
        var body = new Polytrope(1.5, 1, 1, UnitSystem.Solar);
        var points = Shells(body, 500);
        var volumes = TargetVolumes(points, body);
        Assert.Throws<ArgumentOutOfRangeException>(() => ScaleHeights.PlacedResolution(body, points, volumes, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => ScaleHeights.PlacedResolution(body, points, volumes, 5, innerRadius: -1));
        Assert.Throws<ArgumentException>(() => ScaleHeights.PlacedResolution(body, points, volumes, 5, innerRadius: 2));
        volumes[3] = double.NaN;
        Assert.Contains("Point 3", Assert.Throws<ArgumentException>(() => ScaleHeights.PlacedResolution(body, points, volumes, 5)).Message);
        var uniform = new UniformSphere(1, 1);
        Assert.Throws<InvalidOperationException>(() => ScaleHeights.PlacedResolution(uniform, Shells(uniform, 100), new double[100], 5));
    }
}
