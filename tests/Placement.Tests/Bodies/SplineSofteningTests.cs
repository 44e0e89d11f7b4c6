using Placement.Bodies;
using Placement.Numerics;
using Placement.Sph;

namespace Placement.Tests.Bodies;

public class SplineSofteningTests
{
    private const double G = 1.7, M = 2.3, H = 0.9; // arbitrary units: nothing may depend on G = M = h = 1

    private static double[] Samples()
    {
        var u = new List<double>();
        for (double x = 0.013; x < 1.6; x += 0.0371) u.Add(x);
        return [.. u];
    }

    [Fact]
    public void Acceleration_EqualsMinusNumericalGradientOfThePotential()
    {
        // Five-point central difference, step 1e-4 r (truncation ~1e-16, rounding ~1e-12 relative); stencils that would
        // straddle the kernel's joins at u = 1/2 and 1 (where the third derivative jumps) are skipped.
        foreach (double u in Samples())
        {
            double r = u * H, d = 1e-4 * r;
            if (Math.Abs(u - 0.5) < 3e-4 || Math.Abs(u - 1) < 3e-4) continue;
            double phi(double x) => SplineSoftening.Potential(x, M, H, G);
            double dphi = (phi(r - 2 * d) - 8 * phi(r - d) + 8 * phi(r + d) - phi(r + 2 * d)) / (12 * d);
            double a = SplineSoftening.RadialAcceleration(r, M, H, G);
            Assert.True(Math.Abs(-dphi - a) <= 1e-9 * Math.Abs(a), $"u = {u}: -dΦ/dr = {-dphi:R}, a = {a:R}");
        }
    }

    [Fact]
    public void MassFraction_EqualsTheIntegralOfTheCubicSplineDensity()
    {
        // Independent density: the SPH cubic B-spline of support h (SphKernel, our separate implementation of the
        // Monaghan & Lattanzio 1985 kernel), integrated as ∫4πs²W ds by adaptive Gauss–Legendre to 1e-14.
        foreach (double u in Samples())
        {
            double r = u * H;
            double expected = 0;
            foreach (var (a, b) in new[] { (0.0, Math.Min(r, 0.5 * H)), (0.5 * H, Math.Min(r, H)) })
                if (b > a) expected += AdaptiveQuadrature.Integrate(s => 4 * Math.PI * s * s * SphKernel.CubicSpline.Value(s, H), a, b, 1e-14).Value;
            Assert.Equal(expected, SplineSoftening.MassFraction(u), 1e-13);
            Assert.Equal(M * expected, SplineSoftening.EnclosedMass(r, M, H), 1e-12);
        }
        Assert.Equal(1.0, SplineSoftening.MassFraction(1.0), 1e-15);
        Assert.Equal(1.0, SplineSoftening.MassFraction(7.0));
    }

    [Fact]
    public void Potential_EqualsThePotentialOfTheSplineDensityByQuadrature()
    {
        // Φ(r) = −G [M(<r)/r + 4π ∫_r^h ρ(s) s ds] for a spherical mass of support h (Newton's shell theorem, common
        // practice), with ρ from SphKernel's cubic spline; M(<r) by quadrature as well.
        foreach (double u in Samples())
        {
            double r = u * H;
            double Rho(double s) => M * SphKernel.CubicSpline.Value(s, H);
            // Pieces split at the kernel's join h/2, where its third derivative jumps.
            double Piecewise(Func<double, double> f, double a, double b)
            {
                double sum = 0;
                foreach (var (lo, hi) in new[] { (a, Math.Min(b, 0.5 * H)), (Math.Max(a, 0.5 * H), b) })
                    if (hi > lo) sum += AdaptiveQuadrature.Integrate(f, lo, hi, 1e-14).Value;
                return sum;
            }
            double inner = Piecewise(s => 4 * Math.PI * s * s * Rho(s), 0, Math.Min(r, H));
            double outer = r < H ? Piecewise(s => 4 * Math.PI * s * Rho(s), r, H) : 0;
            double expected = -G * (inner / r + outer);
            Assert.True(Math.Abs(SplineSoftening.Potential(r, M, H, G) - expected) <= 1e-12 * Math.Abs(expected), $"u = {u}: {SplineSoftening.Potential(r, M, H, G):R} vs {expected:R}");
        }
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(1.0)]
    public void PotentialAndMassFraction_AreContinuousWithContinuousSlopes_AtTheJoins(double u)
    {
        // Values within 1e-12 across a gap of 2e-14, and one-sided slopes (step 1e-6) agreeing to 1e-5: a jump in value or
        // slope of the piecewise forms would show far above these.
        const double e = 1e-14, s = 1e-6;
        foreach (Func<double, double> f in new Func<double, double>[] { SplineSoftening.MassFraction, SplineSoftening.PotentialShape })
        {
            Assert.Equal(f(u - e), f(u + e), 1e-12);
            double left = (f(u) - f(u - s)) / s, right = (f(u + s) - f(u)) / s;
            Assert.True(Math.Abs(left - right) < 1e-5, $"u = {u}: slopes {left} vs {right}");
        }
    }

    [Fact]
    public void OutsideTheSupport_GravityIsNewtonian_AndTheCentreMatchesThePlummerEquivalent()
    {
        foreach (double r in new[] { H, 1.3 * H, 10 * H })
        {
            Assert.Equal(-G * M / r, SplineSoftening.Potential(r, M, H, G), 1e-14);
            Assert.Equal(-G * M / (r * r), SplineSoftening.RadialAcceleration(r, M, H, G), 1e-14);
        }
        // Central potential −(14/5) G M/h equals the Plummer potential −G M/ε with ε = h/2.8.
        Assert.Equal(-G * M / (H / SplineSoftening.PlummerEquivalentRatio), SplineSoftening.Potential(0, M, H, G), 1e-13);
        Assert.Equal(-G * M / 0.4, SplineSoftening.Potential(0.4, M, 0, G));
        Assert.Equal(M, SplineSoftening.EnclosedMass(1e-9, M, 0));
    }

    [Fact]
    public void DensityShape_IsNormalisedAndAgreesWithTheSphCubicSpline()
    {
        double total = AdaptiveQuadrature.Integrate(u => 4 * Math.PI * u * u * SplineSoftening.DensityShape(u), 0, 0.5, 1e-14).Value
            + AdaptiveQuadrature.Integrate(u => 4 * Math.PI * u * u * SplineSoftening.DensityShape(u), 0.5, 1, 1e-14).Value;
        Assert.Equal(1.0, total, 1e-14);
        foreach (double u in Samples())
            Assert.Equal(SphKernel.CubicSpline.Value(u * H, H) * H * H * H, SplineSoftening.DensityShape(u), 1e-12);
    }

    [Theory]
    [InlineData(-1.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void BadSoftening_IsRejectedNamingTheValue(double h)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => SplineSoftening.Potential(1, 1, h, 1));
        Assert.Equal("softening", ex.ParamName);
    }
}
