using Placement.Numerics;
using Placement.Profiles;
using Placement.Random;

namespace Placement.Tests.Profiles;

// Tests of the Numerics helpers the profile model is built on (kept with the profile tests, which own them).
public class NumericsTests
{
    [Fact]
    public void GaussLegendreEight_IntegratesDegree15Exactly()
    {
        // An n-point Gauss–Legendre rule is exact to degree 2n − 1 (Abramowitz & Stegun 1964, §25.4.29).
        var rule = GaussLegendreRule.Eight;
        for (int k = 0; k <= 15; k++)
        {
            double exact = (Math.Pow(2, k + 1) - Math.Pow(-1, k + 1)) / (k + 1); // ∫_{-1}^{2} x^k dx
            Assert.Equal(exact, rule.Integrate(x => Math.Pow(x, k), -1, 2), 1e-12 * Math.Max(1, Math.Abs(exact)));
        }
        double sum = 0;
        foreach (double w in rule.Weights) sum += w;
        Assert.Equal(2.0, sum, 1e-15);
    }

    [Fact]
    public void AdaptiveQuadrature_ResolvesPeakedIntegrand()
    {
        // ∫_0^1 1/(1e-4 + x²) dx = 100 atan(100) (elementary antiderivative).
        var (value, err) = AdaptiveQuadrature.Integrate(x => 1 / (1e-4 + x * x), 0, 1, 1e-13);
        Assert.Equal(100 * Math.Atan(100), value, 1e-10);
        Assert.True(err < 1e-9);
    }

    [Fact]
    public void DormandPrince_HarmonicOscillator_StaysOnClosedFormWithinTolerance()
    {
        // y'' = −y, y(0) = 0, y'(0) = 1: y = sin t (closed form). Adaptive steps at rtol 1e-10 to t = 10.
        var dp = new DormandPrince45(2, (t, y, d) => { d[0] = y[1]; d[1] = -y[0]; }, 1e-10, [1e-12, 1e-12]);
        double t = 0, h = 0.1;
        double[] y = [0, 1], yn = new double[2];
        while (t < 10)
        {
            double step = Math.Min(h, 10 - t);
            double err = dp.Step(t, y, step, yn);
            if (err <= 1) { t += step; yn.CopyTo(y, 0); }
            h = DormandPrince45.NextStep(step, err);
        }
        Assert.Equal(Math.Sin(10), y[0], 1e-8);
        Assert.Equal(Math.Cos(10), y[1], 1e-8);
    }

    [Fact]
    public void Chebyshev_FitsExponentialToRoundoff_AndDifferentiates()
    {
        // e^s on [−1, 1]: 16 terms suffice for 1e-15 (coefficients ~ I_m(1), Press et al. §5.8).
        Span<double> s = stackalloc double[16];
        Span<double> f = stackalloc double[16];
        Span<double> c = stackalloc double[16];
        Span<double> d = stackalloc double[15];
        ChebyshevSeries.Nodes(s);
        for (int j = 0; j < 16; j++) f[j] = Math.Exp(s[j]);
        ChebyshevSeries.Fit(f, c);
        ChebyshevSeries.Derivative(c, d);
        for (double x = -1; x <= 1; x += 0.01)
        {
            Assert.Equal(Math.Exp(x), ChebyshevSeries.Evaluate(c, x), 1e-14);
            Assert.Equal(Math.Exp(x), ChebyshevSeries.Evaluate(d, x), 1e-12);
        }
    }

    [Fact]
    public void SafeguardedNewton_FindsRootEvenFromBadGuess()
    {
        // x³ − 2 = 0 on [0, 10], guess at the far end: root 2^(1/3).
        double x = SafeguardedNewton.Solve(v => (v * v * v - 2, 3 * v * v), 0, 10, 10, 1e-15);
        Assert.Equal(Math.Cbrt(2), x, 1e-14);
    }

    [Fact]
    public void BatchInverse_EqualsScalarInverse_AndRejectsOutOfRangeMass()
    {
        var star = DemoBodies.TwoZoneStar();
        var rng = new KeyedRandom(9, 0);
        var m = new double[5000];
        for (int i = 0; i < m.Length; i++) m[i] = rng.NextDouble() * star.TotalMass;
        var r = new double[m.Length];
        ((IRadialProfile)star).RadiusOfEnclosedMass(m, r);
        for (int i = 0; i < m.Length; i++) Assert.Equal(star.RadiusOfEnclosedMass(m[i]), r[i]);
        // Round trip through M(r): 1e-13 relative plus 1e-15 of the total (rounding of the cumulative mass).
        for (int i = 0; i < m.Length; i++)
            Assert.True(Math.Abs(star.EnclosedMass(r[i]) - m[i]) < 1e-13 * m[i] + 1e-15 * star.TotalMass, $"M(r(m)) at m = {m[i]}");
        Assert.Throws<ArgumentOutOfRangeException>(() => star.RadiusOfEnclosedMass(-1e-3));
        Assert.Throws<ArgumentOutOfRangeException>(() => star.RadiusOfEnclosedMass(1.001 * star.TotalMass));
        Assert.Equal(star.OuterRadius, star.RadiusOfEnclosedMass(star.TotalMass));
        Assert.Equal(0, star.RadiusOfEnclosedMass(0));
    }
}
