using Placement.Profiles;
using Placement.Quality;
using Placement.Samplers;
using Placement.Sph;
using Placement.Units;

namespace Placement.Tests.Sph;

public class KernelSmoothedProfileTests
{
    /// <summary>ρ = a − b r² on [0, R] (test body, not a physical model): the kernel average is a polynomial we can do by hand.</summary>
    private sealed class QuadraticBall(double a, double b, double radius) : IRadialProfile
    {
        public UnitSystem Units => UnitSystem.Dimensionless;
        public double OuterRadius => radius;
        public double TotalMass => EnclosedMass(radius);
        public string Fingerprint => "quadratic-test-ball";
        public double Density(double r) => r >= 0 && r <= radius ? a - b * r * r : 0;
        public double EnclosedMass(double r)
        {
            double x = Math.Clamp(r, 0, radius);
            return 4 * Math.PI * (a * x * x * x / 3 - b * Math.Pow(x, 5) / 5);
        }
        public double RadiusOfEnclosedMass(double m)
        {
            double lo = 0, hi = radius;
            for (int k = 0; k < 200; k++) { double mid = 0.5 * (lo + hi); if (EnclosedMass(mid) < m) lo = mid; else hi = mid; }
            return 0.5 * (lo + hi);
        }
    }

    [Fact]
    public void UniformDensity_InsideTheBody_IsReturnedUnchanged_ForEveryKernel()
    {
        // Every kernel integrates to 1 over its support (normalisations of Dehnen & Aly 2012, Table 1, checked by quadrature in
        // SphKernelTests); the six-panel rule puts every break point of the B-splines on a panel edge, so the sum is exact to rounding.
        var ball = new UniformSphere(2.0, 1.0, UnitSystem.Dimensionless);
        foreach (var kernel in SphKernel.All)
            Assert.Equal(ball.Density(0.3), KernelSmoothedProfile.At(ball, kernel, 0.3, 0.2), 1e-12 * ball.Density(0.3));
    }

    [Fact]
    public void QuadraticDensity_GainsTheKernelsSecondMoment()
    {
        // ρ = a − b r²: ∫W(s)ρ(|x+s|)d³s = a − b r² − b⟨s²⟩, and for Wendland C2 of support H (C = 21/(2π))
        // ⟨s²⟩ = 4πC H² ∫₀¹ (1−q)⁴(1+4q) q⁴ dq = 4πC H² (B(5,5) + 4B(6,5)) = 4πC H²/210 = H²/5 (derived, Beta integrals).
        // The integrand is a polynomial in s and μ, which the rules integrate exactly.
        double a = 3, b = 1.5, h = 0.25;
        var ball = new QuadraticBall(a, b, 1.0);
        foreach (double r in new[] { 0.0, 0.2, 0.5, 0.7 })
            Assert.Equal(a - b * r * r - b * h * h / 5, KernelSmoothedProfile.At(ball, SphKernel.WendlandC2, r, h), 1e-12);
    }

    [Fact]
    public void KernelCentredOnTheSurface_SeesHalfTheDensity()
    {
        // Half of a small kernel lies outside a uniform ball: ρ̃ = ρ/2 up to the surface curvature, O(H/R) = 1e-3 here.
        var ball = new UniformSphere(2.0, 1.0, UnitSystem.Dimensionless);
        double ratio = KernelSmoothedProfile.At(ball, SphKernel.CubicSpline, 1.0, 1e-3) / ball.Density(0.5);
        Assert.InRange(ratio, 0.5 - 2e-3, 0.5 + 1e-12);
    }

    [Fact]
    public void QualityCheck_OfAShellPlacement_SplitsTheSmoothingBiasFromThePlacementNoise()
    {
        // An n = 3 polytrope falls steeply outside: the kernel's smoothing bias ~ ⟨s²⟩∇²ρ/6 lifts ρ_SPH above ρ(r) there, so
        // against ρ̃ the same points read closer (measured at 1e5 points: 2.14 % against ρ, 0.93 % against ρ̃).
        var star = new Polytrope(3, 1.0, 1.0, UnitSystem.Solar);
        var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(star, 20_000) { Seed = 3 }).Points;
        var sph = QualityChecker.Evaluate(points, star).Sph!;
        Assert.True(sph.BodySmoothedRmsError < 0.8 * sph.BodyRmsError, $"against ρ̃ {sph.BodySmoothedRmsError}, against ρ {sph.BodyRmsError}");
        Assert.Equal(sph.Bias.Length, sph.SmoothedBias!.Length);
        var off = QualityChecker.Evaluate(points, star, options: QualityOptions.Default with { SphSmoothedTarget = false }).Sph!;
        Assert.True(double.IsNaN(off.BodySmoothedRmsError) && off.SmoothedBias is null);
        Assert.Equal(sph.BodyRmsError, off.BodyRmsError);
    }
}
