using Placement.Numerics;

namespace Placement.Profiles;

/// <summary>A solution θ(ξ), μ(ξ) = −ξ²θ'(ξ) of the Lane–Emden equation with dense output, from <see cref="LaneEmden.Solve"/>.</summary>
/// <remarks>
/// Layout: ascending points ξ_k (from <see cref="LaneEmden.SeriesLimit"/> to ξ1 or ξ_max) with θ_k and μ_k; between
/// points a cubic Hermite interpolant uses the exact derivatives θ' = −μ/ξ², μ' = ξ²θⁿ; below the first point the
/// centre series is used. Dimensionless throughout. Immutable and thread-safe.
/// </remarks>
public sealed class LaneEmdenSolution
{
    private readonly double[] _xi, _theta, _mu, _dTheta, _dMu;
    private readonly bool _integer;

    internal LaneEmdenSolution(double n, double[] xi, double[] theta, double[] mu, bool hasSurface)
    {
        Index = n;
        _xi = xi;
        _theta = theta;
        _mu = mu;
        _integer = n == Math.Floor(n);
        _dTheta = new double[xi.Length];
        _dMu = new double[xi.Length];
        for (int k = 0; k < xi.Length; k++)
        {
            _dTheta[k] = -mu[k] / (xi[k] * xi[k]);
            _dMu[k] = xi[k] * xi[k] * F(theta[k]);
        }
        HasSurface = hasSurface;
        MaxXi = xi[^1];
        FirstZero = hasSurface ? MaxXi : double.NaN;
        SurfaceMass = hasSurface ? mu[^1] : double.NaN;
    }

    /// <summary>Polytropic index n.</summary>
    public double Index { get; }

    /// <summary>True when θ reaches zero at a finite ξ1 (n &lt; 5).</summary>
    public bool HasSurface { get; }

    /// <summary>ξ1, the first zero of θ; NaN when <see cref="HasSurface"/> is false.</summary>
    public double FirstZero { get; }

    /// <summary>μ1 = −ξ1²θ'(ξ1), the dimensionless total mass; NaN when <see cref="HasSurface"/> is false.</summary>
    public double SurfaceMass { get; }

    /// <summary>ρ_c/ρ̄ = ξ1³/(3μ1).</summary>
    public double CentralToMeanDensity => FirstZero * FirstZero * FirstZero / (3 * SurfaceMass);

    /// <summary>Largest ξ covered (ξ1, or ξ_max without a surface).</summary>
    public double MaxXi { get; }

    /// <summary>Number of stored points of the dense output.</summary>
    public int PointCount => _xi.Length;

    /// <summary>θ(ξ) for 0 ≤ ξ ≤ <see cref="MaxXi"/> (clamped to ≥ 0 for non-integer n).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="xi"/> is outside [0, MaxXi].</exception>
    public double Theta(double xi)
    {
        if (xi <= LaneEmden.SeriesLimit) return LaneEmden.Series(Index, Check(xi)).Theta;
        int k = Find(Check(xi));
        double h = _xi[k + 1] - _xi[k];
        return MonotoneCubic.Hermite((xi - _xi[k]) / h, h, _theta[k], _theta[k + 1], _dTheta[k], _dTheta[k + 1]);
    }

    /// <summary>μ(ξ) = −ξ²θ'(ξ) = ∫₀^ξ s²θⁿ ds, the dimensionless enclosed mass, for 0 ≤ ξ ≤ <see cref="MaxXi"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="xi"/> is outside [0, MaxXi].</exception>
    public double Mu(double xi)
    {
        if (xi <= LaneEmden.SeriesLimit) return LaneEmden.Series(Index, Check(xi)).Mu;
        int k = Find(Check(xi));
        double h = _xi[k + 1] - _xi[k];
        return MonotoneCubic.Hermite((xi - _xi[k]) / h, h, _mu[k], _mu[k + 1], _dMu[k], _dMu[k + 1]);
    }

    /// <summary>θ'(ξ) = −μ(ξ)/ξ² (0 at the centre).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="xi"/> is outside [0, MaxXi].</exception>
    public double ThetaDerivative(double xi)
    {
        if (xi == 0) return 0;
        return -Mu(xi) / (xi * xi);
    }

    /// <summary>θ(ξ)ⁿ, the density in units of the central density (0 where θ ≤ 0 for non-integer n).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="xi"/> is outside [0, MaxXi].</exception>
    public double DensityFactor(double xi) => F(Theta(xi));

    /// <summary>The ξ with μ(ξ) = <paramref name="mu"/>, by safeguarded Newton on the dense output (tolerance 1e-15 ξ); no allocation.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="mu"/> is outside [0, μ(MaxXi)].</exception>
    public double XiOfMu(double mu)
    {
        if (!(mu >= 0 && mu <= _mu[^1])) throw new ArgumentOutOfRangeException(nameof(mu), mu, $"μ must lie in [0, {_mu[^1]}].");
        if (mu == 0) return 0;
        if (mu >= _mu[^1]) return MaxXi;
        // Safeguarded Newton without delegates (no allocation per call): on the centre series below the first point,
        // otherwise on the cubic Hermite of the bracketing interval.
        bool series = mu <= _mu[0];
        int k = 0;
        double lo, hi, x;
        if (series)
        {
            lo = 0; hi = _xi[0];
            x = Math.Cbrt(3 * mu);
        }
        else
        {
            k = _mu.AsSpan().BinarySearch(mu);
            if (k < 0) k = ~k - 1;
            if (k >= _xi.Length - 1) k = _xi.Length - 2;
            if (_mu[k] == mu) return _xi[k];
            lo = _xi[k]; hi = _xi[k + 1];
            x = lo + (hi - lo) * (mu - _mu[k]) / (_mu[k + 1] - _mu[k]);
        }
        double h = _xi.Length > 1 ? _xi[k + 1] - _xi[k] : 1, tol = 1e-15 * hi;
        for (int iter = 0; iter < 200; iter++)
        {
            if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
            double v, d;
            if (series)
            {
                var (theta, m) = LaneEmden.Series(Index, x);
                v = m - mu;
                d = x * x * F(theta);
            }
            else
            {
                double t = (x - _xi[k]) / h;
                v = MonotoneCubic.Hermite(t, h, _mu[k], _mu[k + 1], _dMu[k], _dMu[k + 1]) - mu;
                d = MonotoneCubic.HermiteDerivative(t, h, _mu[k], _mu[k + 1], _dMu[k], _dMu[k + 1]);
            }
            if (v == 0) return x;
            if (v < 0) lo = x; else hi = x;
            double next = x - v / d;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - x) <= tol || hi - lo <= tol) return next;
            x = next;
        }
        return x;
    }

    private double F(double theta) =>
        _integer ? LaneEmden.PowInteger(theta, (int)Index) : (theta > 0 ? Math.Pow(theta, Index) : 0.0);

    private double Check(double xi)
    {
        if (!(xi >= 0 && xi <= MaxXi)) throw new ArgumentOutOfRangeException(nameof(xi), xi, $"ξ must lie in [0, {MaxXi}].");
        return xi;
    }

    private int Find(double xi)
    {
        int k = _xi.AsSpan().BinarySearch(xi);
        if (k < 0) k = ~k - 1;
        return Math.Clamp(k, 0, _xi.Length - 2);
    }
}
