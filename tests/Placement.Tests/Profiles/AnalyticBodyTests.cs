using Placement.Numerics;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class AnalyticBodyTests
{
    [Theory]
    [InlineData(0.1)]
    [InlineData(1.0)]
    [InlineData(20.0)]
    public void Plummer_EnclosedMass_MatchesClosedFormAndQuadrature(double outer)
    {
        // Plummer M(r) = M∞ r³/(r² + a²)^(3/2) (Binney & Tremaine 2008, eq. 2.44b), truncated so M(R) = user mass.
        // Cross-check against our adaptive quadrature of 4πr²ρ (1e-13): agreement 1e-10 relative as the issue requires.
        var p = new PlummerSphere(3.0, 0.7, outer);
        Assert.Equal(3.0, p.EnclosedMass(outer), 1e-15);
        AssertMassClosedFormQuadratureAndInverse(p, 1e-4 * outer, 1.9,
            r => p.UntruncatedMass * r * r * r / Math.Pow(r * r + 0.49, 1.5),
            r => AdaptiveQuadrature.Integrate(s => 4 * Math.PI * s * s * p.Density(s), 0, r, 1e-14).Value);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(10.0)]
    public void Hernquist_EnclosedMass_MatchesClosedFormAndQuadrature_WithCusp(double outer)
    {
        // Hernquist M(r) = M∞ r²/(r + a)² (Hernquist 1990, ApJ 356, 359, eq. 3); ρ ∝ 1/r at the centre.
        var p = new HernquistSphere(2.0, 1.3, outer);
        Assert.Equal(2.0, p.EnclosedMass(outer), 1e-15);
        Assert.True(double.IsPositiveInfinity(p.Density(0)));
        // Substituting s = t² removes the 1/s cusp so Gauss–Legendre converges.
        AssertMassClosedFormQuadratureAndInverse(p, 1e-5 * outer, 2.3,
            r => p.UntruncatedMass * r * r / ((r + 1.3) * (r + 1.3)),
            r => AdaptiveQuadrature.Integrate(t => 2 * t * 4 * Math.PI * t * t * t * t * p.Density(t * t), 0, Math.Sqrt(r), 1e-14).Value);
    }

    private static void AssertMassClosedFormQuadratureAndInverse(IRadialProfile p, double from, double factor,
        Func<double, double> closedForm, Func<double, double> quadrature)
    {
        // Closed form to 1e-13 (rounding only), independent quadrature to 1e-10 (the requirement), inverse to 1e-12.
        for (double r = from; r < p.OuterRadius; r *= factor)
        {
            double closed = closedForm(r);
            Assert.True(Math.Abs(p.EnclosedMass(r) / closed - 1) < 1e-13, $"closed form at {r}");
            Assert.True(Math.Abs(quadrature(r) / closed - 1) < 1e-10, $"quadrature at {r}");
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(closed) / r - 1) < 1e-12, $"inverse at {r}");
        }
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    public void Polytrope_EnclosedMass_MatchesClosedForms_To1e10(double n)
    {
        // n = 0: M = M (r/R)³; n = 1: M(r) = M (sin ξ − ξ cos ξ)/π, ξ = πr/R (Chandrasekhar 1939, ch. IV).
        var p = new Polytrope(n, 2.0, 3.0);
        for (double r = 1e-4; r < 3.0; r *= 1.23)
        {
            double xi = Math.PI * r / 3.0;
            double exact = n == 0 ? 2.0 * Math.Pow(r / 3.0, 3) : 2.0 * (Math.Sin(xi) - xi * Math.Cos(xi)) / Math.PI;
            if (n == 1 && xi < 1e-2) exact = 2.0 * xi * xi * xi / 3 * (1 - xi * xi / 10 + xi * xi * xi * xi / 280) / Math.PI;
            Assert.True(Math.Abs(p.EnclosedMass(r) / exact - 1) < 1e-10, $"M at {r}: {p.EnclosedMass(r):R} vs {exact:R}");
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(exact) / r - 1) < 1e-10, $"r(M) at {r}");
        }
    }

    [Theory]
    [InlineData(1.5)]
    [InlineData(3.0)]
    public void Polytrope_PressureSatisfiesHydrostaticEquilibrium_AndPolytropicRelation(double n)
    {
        // dP/dr = −G M(r) ρ / r² (hydrostatic equilibrium) by a central difference of our pressure, and P = Kρ^(1+1/n)
        // (definition). Solar units (G = 1). Central differences with step 1e-5 R: truncation ~1e-10, so 1e-6 relative.
        var p = new Polytrope(n, 1.0, 1.0, UnitSystem.Solar);
        Assert.Equal("P", p.Quantities[0].Name);
        for (double r = 0.05; r < 0.95; r += 0.1)
        {
            const double h = 1e-5;
            double dp = (p.Pressure(r + h) - p.Pressure(r - h)) / (2 * h);
            double rhs = -UnitSystem.Solar.GravitationalConstant * p.EnclosedMass(r) * p.Density(r) / (r * r);
            Assert.True(Math.Abs(dp / rhs - 1) < 1e-6, $"hydrostatic at {r}");
            Assert.True(((IRadialProfile)p).TryQuantity("P", r, out double pr));
            Assert.Equal(p.PolytropicConstant * Math.Pow(p.Density(r), 1 + 1 / n), pr, 1e-12 * p.CentralPressure);
        }
    }

    [Fact]
    public void Polytrope_IndexZero_PressureIsIncompressibleClosedForm()
    {
        // P = (2π/3) G ρ² (R² − r²) for a uniform sphere in hydrostatic equilibrium (textbook result, e.g. Poisson & Will 2014 §2.4).
        var p = new Polytrope(0, 2.0, 1.5);
        double rho = p.Density(0.3);
        Assert.Equal(2 * Math.PI / 3 * rho * rho * (1.5 * 1.5 - 0.09), p.Pressure(0.3), 1e-12);
    }

    [Fact]
    public void AnalyticBodies_RejectBadParameters()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new PlummerSphere(-1, 1, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new HernquistSphere(1, 0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new Polytrope(5, 1, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new Polytrope(1, 1, double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => new PlummerSphere(1, 1, 1).RadiusOfEnclosedMass(1.5));
    }
}
