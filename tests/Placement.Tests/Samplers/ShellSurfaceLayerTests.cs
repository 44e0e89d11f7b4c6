using Placement.Profiles;
using Placement.Quality;
using Placement.Samplers;
using Placement.Samplers.Shells;
using Placement.Units;

namespace Placement.Tests.Samplers;

public class ShellSurfaceLayerTests
{
    /// <summary>
    /// INVENTED layered planet (not a real body; lengths in 1000 km, densities in g/cm³, dimensionless units): a core
    /// 12 − 2(r/3)² to r = 3, a mantle 4.5 − 1.1(r − 3)/3 to r = 6, and an envelope 0.02(1 − (r − 6)/0.6)² to 6.6 that holds
    /// about 5e-4 of the mass, too little for a shell of its own at 1e5 points, so it is merged into the mantle's segment.
    /// </summary>
    private static TabulatedProfile PlanetWithThinEnvelope()
    {
        var r = new List<double>();
        var rho = new List<double>();
        for (int i = 0; i <= 60; i++) { double x = 3.0 * i / 60; r.Add(x); rho.Add(12 - 2 * (x / 3) * (x / 3)); }
        for (int i = 0; i <= 60; i++) { double x = 3 + 3.0 * i / 60; r.Add(x); rho.Add(4.5 - 1.1 * (x - 3) / 3); }
        for (int i = 0; i <= 30; i++) { double x = 6 + 0.6 * i / 30; double u = 1 - (x - 6) / 0.6; r.Add(x); rho.Add(0.02 * u * u); }
        return new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
    }

    [Fact]
    public void LightEnvelopeMergedIntoTheLastSegment_DoesNotSwellAThinSurfaceShell()
    {
        // The surface shell's cells reach R through the merged envelope. Scored only by mass (which a surface shell always
        // holds exactly), the closing once ended the mantle with a 2352-point shell whose cells were ~10× too large
        // (ln(Vρ/m) ≈ +2.3): std ln(Vρ/m) of the cells not cut by the ball 0.146, 6.4 % of cells a moving-mesh code
        // would correct. Scored by volume where the density above its points drops by more than 10×: 0.033 and 0.0 %.
        var profile = PlanetWithThinEnvelope();
        var points = PointSampling.Place(new HealpixShellSampler(), new SamplingRequest(profile, 100_000) { Seed = 1 }).Points;
        var report = QualityChecker.Evaluate(points, profile, options: QualityOptions.Default with { SphNeighbourNumber = 0 });
        Assert.True(report.LogRatioByRegion.UncutStandardDeviation < 0.06, $"uncut std {report.LogRatioByRegion.UncutStandardDeviation}");
        Assert.True(report.Regularity.FractionCorrected < 0.02, $"corrected {report.Regularity.FractionCorrected}");
        Assert.True(report.RadialDensity.RmsError < 0.03, $"radial rms {report.RadialDensity.RmsError}");
    }
}
