using Placement.Sph;

namespace Placement.Tests.Sph;

public class SphKernelTests
{
    /// <summary>∫₀¹ f(q) dq by composite Simpson with many panels; the kernels are piecewise polynomials.</summary>
    private static double Integrate(Func<double, double> f, int panels = 60_000)
    {
        double h = 1.0 / panels, sum = f(0) + f(1);
        for (int i = 1; i < panels; i++) sum += f(i * h) * (i % 2 == 1 ? 4 : 2);
        return sum * h / 3.0;
    }

    [Theory]
    [InlineData("cubic-spline")]
    [InlineData("quintic-spline")]
    [InlineData("wendland-c2")]
    [InlineData("wendland-c4")]
    public void Kernel_IntegratesToOne_OverItsSupport(string name)
    {
        var k = SphKernel.FromName(name);
        // ∫ W d³r = C ∫₀¹ 4π q² w(q) dq = 1 (normalisation of Dehnen & Aly 2012, Table 1).
        double integral = k.Normalisation * Integrate(q => 4 * Math.PI * q * q * k.Shape(q));
        Assert.Equal(1.0, integral, 9);
    }

    [Theory]
    // H/h values from Dehnen & Aly 2012, MNRAS 425, 1068, Table 1 (h = 2σ).
    [InlineData("cubic-spline", 1.825742)]
    [InlineData("quintic-spline", 2.195775)]
    [InlineData("wendland-c2", 1.936492)]
    [InlineData("wendland-c4", 2.207940)]
    public void Kernel_SupportOverSmoothingLength_MatchesSecondMoment(string name, double expected)
    {
        var k = SphKernel.FromName(name);
        // σ² = (1/3) ∫ r² W d³r with H = 1; h = 2σ so H/h = 1/(2σ). Computed here by quadrature.
        double sigma2 = k.Normalisation * Integrate(q => 4 * Math.PI * q * q * q * q * k.Shape(q)) / 3.0;
        // The table quotes 7 significant digits, so agreement to 1e-6 absolute is what it can confirm.
        Assert.Equal(expected, 1.0 / (2.0 * Math.Sqrt(sigma2)), 1e-6);
        Assert.Equal(expected, k.SupportOverSmoothingLength, 1e-12);
    }

    [Fact]
    public void Kernel_IsZeroAtAndBeyondSupport_AndPositiveInside()
    {
        foreach (var k in SphKernel.All)
        {
            Assert.Equal(0.0, k.Shape(1.0));
            Assert.Equal(0.0, k.Shape(1.5));
            for (double q = 0; q < 1; q += 0.01) Assert.True(k.Shape(q) > 0, $"{k.Name} w({q}) <= 0");
        }
        Assert.Throws<ArgumentException>(() => SphKernel.FromName("gaussian"));
        Assert.Throws<ArgumentOutOfRangeException>(() => SphKernel.CubicSpline.Value(0.1, 0));
    }

    [Fact]
    public void WendlandCorrection_FollowsDehnenAlyFit()
    {
        // ε_C2 = 0.0294 (N_H/100)^-0.977, ε_C4 = 0.01342 (N_H/100)^-1.579 (Dehnen & Aly 2012, eqs. 18-19).
        Assert.Equal(0.0294, SphKernel.WendlandC2.SelfContributionCorrection(100), 12);
        Assert.Equal(0.01342 * Math.Pow(2.0, 1.579), SphKernel.WendlandC4.SelfContributionCorrection(50), 12);
        Assert.Equal(0.0, SphKernel.CubicSpline.SelfContributionCorrection(64));
    }
}
