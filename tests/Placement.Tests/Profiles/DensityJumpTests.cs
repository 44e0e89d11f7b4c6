using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class DensityJumpTests
{
    // Invented for these tests: ρ = 10 (1 − x/2) inside x = 0.4, then over one table row of width `width` down to
    // ρ = 2 (1 − x²)/(1 − 0.16) (a drop by 4.76 at the row), R = 1; rows every 0.01 elsewhere.
    internal static TabulatedProfile OneRowStep(double width = 4e-4)
    {
        var r = new List<double>();
        var rho = new List<double>();
        for (int i = 0; i <= 40; i++) { double x = 0.01 * i; r.Add(x); rho.Add(10 * (1 - 0.5 * x)); }
        double start = 0.4 + width;
        for (int i = 0; i <= 60; i++)
        {
            double x = start + (1 - start) * i / 60;
            r.Add(x);
            rho.Add(Math.Max(2 * (1 - x * x) / (1 - 0.16), 1e-3));
        }
        return new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
    }

    // Invented: a table of ln ρ = ln ρ0 − f(x) on 2001 rows, R = 1.
    private static TabulatedProfile Table(Func<double, double> logDensity)
    {
        var r = new List<double>();
        var rho = new List<double>();
        for (int i = 0; i <= 2000; i++) { double x = i / 2000.0; r.Add(x); rho.Add(Math.Exp(logDensity(x))); }
        return new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
    }

    public static TheoryData<string> SmoothBodies =>
        ["polytrope-1.5", "polytrope-3", "plummer", "hernquist", "steep-envelope", "exponential-atmosphere", "gaussian-15-decades"];

    private static IRadialProfile Smooth(string name) => name switch
    {
        // Lane–Emden polytropes (Chandrasekhar 1939, ch. IV), Plummer (1911), Hernquist (1990) with its r⁻¹ cusp.
        "polytrope-1.5" => new Polytrope(1.5, 1, 1),
        "polytrope-3" => new Polytrope(3, 1, 1),
        "plummer" => new PlummerSphere(1, 0.2, 2),
        "hernquist" => new HernquistSphere(1, 0.2, 5),
        // Invented: a uniform core under an r⁻⁸ envelope (10.4 decades, a kink in ln ρ at r = 0.05).
        "steep-envelope" => Samplers.TestProfiles.SteepEnvelope(),
        // Invented: an isothermal-like atmosphere, ln ρ linear in r with a scale height of 5e-3 R (below the
        // spacing of the point sets here; 43 decades), and ln ρ = −34.5 x² (15 decades).
        "exponential-atmosphere" => Table(x => x < 0.5 ? 0 : -(x - 0.5) / 5e-3),
        "gaussian-15-decades" => Table(x => -15 * Math.Log(10) * x * x),
        _ => throw new ArgumentException(name),
    };

    [Theory]
    [MemberData(nameof(SmoothBodies))]
    public void SmoothBodies_HaveNoJumps_HoweverSteep(string name)
    {
        // A smooth profile is never a step at any resolution: where ln ρ is locally linear the drop over the wide window
        // is four times the narrow one's, and where it steepens outward (a surface) more. A test on the contrast
        // alone would flag all of these (the atmosphere falls by e per 0.005 R; the gaussian by 1e15).
        var profile = Smooth(name);
        foreach (int n in new[] { 1_000, 100_000, 10_000_000 })
        {
            var jumps = DensityJumps.Find(profile, profile.TotalMass / n);
            Assert.True(jumps.Count == 0, $"{name}, N = {n}: jump at r = {(jumps.Count > 0 ? jumps[0].Radius : 0)}");
        }
    }

    [Fact]
    public void AStepOverOneTableRow_IsFound_WhereThePointsCannotResolveIt()
    {
        var profile = OneRowStep();
        Assert.Empty(profile.DensitySteps);
        // 2e4 points: spacing near the step (m/ρ)^(1/3) ≈ 0.03, 75 times the row.
        var jumps = DensityJumps.Find(profile, profile.TotalMass / 20_000);
        var jump = Assert.Single(jumps);
        Assert.False(jump.Declared);
        Assert.InRange(jump.Radius, 0.4, 0.4004);
        Assert.InRange(jump.Width, 0, 4e-4);
        // Side densities are read at the detection window's ends, up to half a spacing from the step, so the smooth slopes
        // on both sides add to the 4.76 of the row itself (measured 4.11 here).
        Assert.InRange(jump.InnerDensity / jump.OuterDensity, 3.8, 5.2);
    }

    [Fact]
    public void AnUndeclaredDiscontinuity_IsFoundWhereItIs()
    {
        // The invented layered test body: ρ drops by 100 at r = 0.1 (a discontinuity the analytic profile does not
        // declare); its kink at r = 0.5 (r⁻² to r⁻¹² at equal density) is not a jump. Bisection puts the jump on the
        // discontinuity to rounding.
        var layered = Samplers.TestProfiles.Layered();
        var jump = Assert.Single(DensityJumps.Find(layered, layered.TotalMass / 100_000));
        Assert.Equal(0.1, jump.Radius, 1e-9);
        // The side densities come from the detection window's ends, so the r⁻¹ and r⁻² slopes add to the 100 of the
        // discontinuity (measured 118).
        Assert.InRange(jump.InnerDensity / jump.OuterDensity, 100, 140);
    }

    [Fact]
    public void AStepWiderThanTheSpacing_IsLeftToTheSmoothTreatment()
    {
        // The same row at 1e13 points: spacing near the step ≈ 2e-5, the row 20 spacings wide, which shells follow.
        var profile = OneRowStep();
        Assert.Empty(DensityJumps.Find(profile, profile.TotalMass / 1e13));
    }

    [Fact]
    public void DeclaredSteps_AreReturnedOnce_WithTheirSideDensities()
    {
        var star = DemoBodies.TwoZoneStar();
        double step = Assert.Single(star.DensitySteps);
        var jump = Assert.Single(DensityJumps.Find(star, star.TotalMass / 20_000));
        Assert.True(jump.Declared);
        Assert.Equal(step, jump.Radius);
        Assert.Equal(0, jump.Width);
        Assert.True(jump.InnerDensity > jump.OuterDensity);
        Assert.Throws<ArgumentOutOfRangeException>(() => DensityJumps.Find(star, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => DensityJumps.Find(star, 1, minimumContrast: 0.5));
    }
}
