using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class DemoBodyTests
{
    [Fact]
    public void TwoZoneStar_IsValidLayeredBodyWithStepSteepEnvelopeAndZeroSurface()
    {
        var star = DemoBodies.TwoZoneStar();
        star.CheckValidity();
        Assert.Same(UnitSystem.Solar, star.Units);
        Assert.Equal(1.0, star.TotalMass, 1e-12);
        Assert.Equal(1.0, star.OuterRadius);
        // The invented step: density drops by 4 at r = 0.2 (by construction in DemoBodies).
        Assert.Equal(4.0, star.Density(0.2 - 1e-12) / star.Density(0.2), 1e-6);
        Assert.Equal(0.3, star.Quantity(DemoBodies.HydrogenFraction, 0.1), 12);
        Assert.Equal(0.7, star.Quantity(DemoBodies.HydrogenFraction, 0.5), 12);
        Assert.Equal(0.0, star.Density(1.0));
        var summary = ProfileSummary.Of(star);
        Assert.True(summary.DensityContrast > 1e9, $"contrast {summary.DensityContrast:E2}");
        Assert.Contains("P", summary.QuantityNames);
        // The step is a repeated radius in the table: the profile and its summary name it.
        Assert.Equal([0.2], star.DensitySteps);
        Assert.Equal([0.2], summary.DensitySteps!);
        Assert.Contains("density steps    0.2 R_sun", summary.ToString());
    }

    [Fact]
    public void TwoZoneStar_PressureIsHydrostatic()
    {
        // dP/dr = −G M ρ / r² (hydrostatic equilibrium), checked by central differences of the carried pressure at
        // radii away from the step. The pressure is PCHIP-interpolated between 400 rows, so derivatives carry the
        // interpolation error: measured worst 1.0e-3 relative over these radii; we require 3e-3.
        var star = DemoBodies.TwoZoneStar();
        foreach (double r in new[] { 0.05, 0.1, 0.15, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 0.99 })
        {
            double h = 1e-4 * r;
            double dp = (star.Quantity("P", r + h) - star.Quantity("P", r - h)) / (2 * h);
            double rhs = -star.EnclosedMass(r) * star.Density(r) / (r * r);
            Assert.True(Math.Abs(dp / rhs - 1) < 3e-3, $"at r = {r}: dP/dr = {dp:E4}, −GMρ/r² = {rhs:E4}");
        }
    }

    [Fact]
    public void Summary_OfUniformSphere_MatchesClosedForms()
    {
        // Uniform sphere: ρ_c = ρ̄ = 3M/(4πR³), contrast 1, r(f M) = R f^(1/3) (definition).
        var s = ProfileSummary.Of(new UniformSphere(2.0, 3.0, UnitSystem.Cgs));
        double rho = 3 * 2.0 / (4 * Math.PI * 27);
        Assert.Equal(rho, s.CentralDensity, 1e-15);
        Assert.Equal(rho, s.MeanDensity, 1e-15);
        Assert.Equal(1.0, s.DensityContrast, 1e-12);
        Assert.Equal(3.0 * Math.Cbrt(0.5), s.HalfMassRadius, 1e-12);
        Assert.Equal(3.0 * Math.Cbrt(0.1), s.Radius10, 1e-12);
        Assert.Contains("g/cm^3", s.ToString(), StringComparison.Ordinal);
    }
}
