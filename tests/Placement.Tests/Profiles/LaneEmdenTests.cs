using Placement.Profiles;

namespace Placement.Tests.Profiles;

public class LaneEmdenTests
{
    // ξ1 and μ1 = −ξ1²θ'(ξ1): Poisson & Will 2014, Gravity, Table 2.1, cross-checked with Boyd 2011
    // (Numer. Math. Theor. Meth. Appl. 4, 142, doi:10.4208/nmtma.2011.42s.2). Ten significant digits are given
    // for most entries; the issue asks for at least 7, so we require relative agreement of 1e-8 where the
    // source gives ≥ 9 digits and 5e-7 where it gives 7.
    [Theory]
    [InlineData(0.5, 2.752698054, 3.788651185, 1e-8, 1e-8)]
    [InlineData(1.5, 3.653753736, 2.714055120, 1e-8, 1e-8)]
    [InlineData(2.0, 4.352874596, 2.411046, 1e-8, 5e-7)]
    [InlineData(3.0, 6.896848619, 2.018235951, 1e-8, 1e-8)]
    [InlineData(3.5, 9.535805344, 1.890557, 1e-8, 5e-7)]
    [InlineData(4.0, 14.97154635, 1.797229914, 1e-8, 1e-8)]
    [InlineData(4.5, 31.83646324, 1.737799, 1e-8, 5e-7)]
    public void Solve_FirstZeroAndSurfaceMass_MatchPublishedTable(double n, double xi1, double mu1, double tolXi, double tolMu)
    {
        var s = LaneEmden.Solve(n);
        Assert.True(s.HasSurface);
        Assert.True(Math.Abs(s.FirstZero / xi1 - 1) < tolXi, $"n={n}: ξ1 = {s.FirstZero:R}, table {xi1}");
        Assert.True(Math.Abs(s.SurfaceMass / mu1 - 1) < tolMu, $"n={n}: μ1 = {s.SurfaceMass:R}, table {mu1}");
    }

    [Fact]
    public void Solve_IndexZero_MatchesClosedFormEverywhere()
    {
        // Closed form θ = 1 − ξ²/6, ξ1 = √6, μ = ξ³/3 (Chandrasekhar 1939, ch. IV). Tolerance 1e-11 relative:
        // the integrator runs at 1e-13 per step and the dense output is checked to 1e-13.
        var s = LaneEmden.Solve(0);
        Assert.Equal(Math.Sqrt(6), s.FirstZero, 1e-12);
        for (double xi = 1e-4; xi < s.FirstZero; xi *= 1.37)
        {
            Assert.True(Math.Abs(s.Theta(xi) - (1 - xi * xi / 6)) < 1e-12, $"θ at {xi}");
            Assert.True(Math.Abs(s.Mu(xi) / (xi * xi * xi / 3) - 1) < 1e-11, $"μ at {xi}");
        }
    }

    [Fact]
    public void Solve_IndexOne_MatchesClosedFormEverywhere()
    {
        // Closed form θ = sin ξ/ξ, ξ1 = π, μ = sin ξ − ξ cos ξ (Chandrasekhar 1939, ch. IV).
        var s = LaneEmden.Solve(1);
        Assert.True(Math.Abs(s.FirstZero / Math.PI - 1) < 1e-12, $"ξ1 = {s.FirstZero:R}");
        Assert.True(Math.Abs(s.SurfaceMass / Math.PI - 1) < 1e-11);
        for (double xi = 1e-4; xi < Math.PI; xi *= 1.21)
        {
            double mu = Math.Abs(xi) < 1e-2 ? xi * xi * xi / 3 * (1 - xi * xi / 10) : Math.Sin(xi) - xi * Math.Cos(xi);
            Assert.True(Math.Abs(s.Theta(xi) - Math.Sin(xi) / xi) < 1e-12, $"θ at {xi}");
            Assert.True(Math.Abs(s.Mu(xi) / mu - 1) < 1e-10, $"μ at {xi}: {s.Mu(xi):R} vs {mu:R}");
            Assert.True(Math.Abs(s.XiOfMu(s.Mu(xi)) / xi - 1) < 1e-12, $"inverse at {xi}");
        }
    }

    [Fact]
    public void Solve_IndexFive_MatchesClosedFormToLargeRadius()
    {
        // Closed form θ = (1 + ξ²/3)^(−1/2), μ = ξ³/(3(1 + ξ²/3)^(3/2)) → √3 (Chandrasekhar 1939, ch. IV).
        var s = LaneEmden.Solve(5, xiMax: 200);
        Assert.False(s.HasSurface);
        for (double xi = 1e-3; xi <= 200; xi *= 1.5)
        {
            double q = 1 + xi * xi / 3;
            Assert.True(Math.Abs(s.Theta(xi) * Math.Sqrt(q) - 1) < 1e-10, $"θ at {xi}");
            Assert.True(Math.Abs(s.Mu(xi) / (xi * xi * xi / (3 * q * Math.Sqrt(q))) - 1) < 1e-10, $"μ at {xi}");
        }
    }

    [Theory]
    [InlineData(1.5, 5.990705)]
    [InlineData(3.0, 54.18248)]
    [InlineData(4.0, 622.4079)]
    public void CentralToMeanDensity_MatchesValuesComputedFromTable(double n, double expected)
    {
        // ρ_c/ρ̄ = ξ1³/(3μ1), computed from the Lane–Emden equation (reference notes §8, [computed]); 7 digits given.
        Assert.True(Math.Abs(LaneEmden.Solve(n).CentralToMeanDensity / expected - 1) < 2e-7);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(1.5)]
    [InlineData(3.0)]
    [InlineData(4.5)]
    public void DenseOutput_MassEqualsIntegralOfDensity(double n)
    {
        // μ(ξ) = ∫₀^ξ s²θⁿ ds is the definition of μ; θ and μ are interpolated separately, so integrating our θⁿ by
        // adaptive quadrature (1e-13) must reproduce our μ. Required 1e-10 relative (the accuracy for analytic bodies).
        var s = LaneEmden.Solve(n);
        for (double xi = 0.02; xi < s.FirstZero; xi += 0.0731 * s.FirstZero)
        {
            double q = Placement.Numerics.AdaptiveQuadrature.Integrate(x => x * x * s.DensityFactor(x), 0, xi, 1e-13).Value;
            Assert.True(Math.Abs(q / s.Mu(xi) - 1) < 1e-10, $"n={n} ξ={xi}: quadrature {q:R} vs μ {s.Mu(xi):R}");
        }
    }

    [Fact]
    public void Solve_RejectsIndexOutOfRange_AndMissingLimitForIndexFive()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => LaneEmden.Solve(-0.1));
        Assert.Throws<ArgumentOutOfRangeException>(() => LaneEmden.Solve(5));
    }
}
