using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class ScaleHeightTests
{
    [Fact]
    public void PolytropeN1_ScaleHeight_MatchesLaneEmdenClosedForm()
    {
        var p = new Polytrope(1.0, 1.0, 1.0, UnitSystem.Solar);
        Assert.Equal("P", ScaleHeights.PressureQuantity(p));
        // n = 1: θ = sin ξ / ξ (closed form, Poisson & Will 2014 §2), r = α ξ with α = R/π. With P = P_c θ^(n+1),
        // H_P = -P/(dP/dr) = -α θ / ((n+1) θ'), θ' = (ξ cos ξ - sin ξ)/ξ².
        double alpha = 1.0 / Math.PI;
        foreach (double r in new[] { 0.05, 0.2, 0.5, 0.8, 0.95 })
        {
            double xi = r / alpha;
            double theta = Math.Sin(xi) / xi, dtheta = (xi * Math.Cos(xi) - Math.Sin(xi)) / (xi * xi);
            double expected = -alpha * theta / (2 * dtheta);
            Assert.Equal(expected, ScaleHeights.PressureScaleHeight(p, r), 1e-7 * expected + 1e-12);
        }
    }

    [Fact]
    public void Resolution_NeededPoints_GiveExactlyTheWantedCells()
    {
        var p = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        var report = ScaleHeights.Resolution(p, 100_000, 8.0, 0.9, 50);
        for (int i = 0; i < report.Radius.Length; i++)
        {
            // Δ = (M/(Nρ))^(1/3) by definition of equal-mass points; N_needed must give exactly 8 cells per H_P.
            double rho = p.Density(report.Radius[i]);
            double spacing = Math.Cbrt(p.TotalMass / (report.PointsNeeded[i] * rho));
            Assert.Equal(8.0, report.ScaleHeight[i] / spacing, 1e-9);
            Assert.True(report.PointsNeeded[i] <= report.MaxPointsNeeded);
        }
        // Scale heights shrink toward the surface, so the outermost radius limits the requirement.
        Assert.Equal(report.Radius[^1], report.LimitingRadius);
        Assert.Throws<InvalidOperationException>(() => ScaleHeights.Resolution(new UniformSphere(1, 1), 10, 4));
    }
}
