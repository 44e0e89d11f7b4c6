namespace Placement.Numerics;

/// <summary>Nodes and weights of an n-point Gauss–Legendre rule on [−1, 1].</summary>
/// <remarks>
/// The rule integrates polynomials of degree ≤ 2n − 1 exactly. Nodes are the roots of the Legendre polynomial
/// P_n, found by Newton's method from the Tricomi initial guess cos(π(i − 1/4)/(n + 1/2)); weights
/// w_i = 2 / ((1 − x_i²) P_n'(x_i)²) (Abramowitz &amp; Stegun 1964, eq. 25.4.29; Press et al., Numerical Recipes,
/// 3rd ed., §4.6). Nodes are stored in ascending order.
/// </remarks>
public sealed class GaussLegendreRule
{
    private readonly double[] _nodes;
    private readonly double[] _weights;

    /// <summary>The 8-point rule (exact to degree 15), used by the profile mass integrals.</summary>
    public static GaussLegendreRule Eight { get; } = new(8);

    /// <summary>Builds the n-point rule.</summary>
    /// <param name="n">Number of points, 1 ≤ n ≤ 64.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="n"/> is outside [1, 64].</exception>
    public GaussLegendreRule(int n)
    {
        if (n < 1 || n > 64) throw new ArgumentOutOfRangeException(nameof(n), n, "The number of points must lie in [1, 64].");
        _nodes = new double[n];
        _weights = new double[n];
        for (int i = 0; i < (n + 1) / 2; i++)
        {
            double x = Math.Cos(Math.PI * (i + 0.75) / (n + 0.5));
            for (int iter = 0; iter < 100; iter++)
            {
                (double p, double d) = Legendre(n, x);
                double dx = p / d;
                x -= dx;
                if (Math.Abs(dx) < 1e-16) break;
            }
            double dp = Legendre(n, x).Derivative;
            double w = 2.0 / ((1 - x * x) * dp * dp);
            _nodes[i] = -x;
            _nodes[n - 1 - i] = x;
            _weights[i] = w;
            _weights[n - 1 - i] = w;
        }
        if (n % 2 == 1) _nodes[n / 2] = 0.0;
    }

    /// <summary>Number of points.</summary>
    public int Count => _nodes.Length;

    /// <summary>Nodes on [−1, 1], ascending.</summary>
    public ReadOnlySpan<double> Nodes => _nodes;

    /// <summary>Weights, summing to 2.</summary>
    public ReadOnlySpan<double> Weights => _weights;

    /// <summary>∫ₐᵇ f(x) dx by this rule.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="f"/> is null.</exception>
    public double Integrate(Func<double, double> f, double a, double b)
    {
        ArgumentNullException.ThrowIfNull(f);
        double half = 0.5 * (b - a), mid = 0.5 * (a + b), sum = 0;
        for (int i = 0; i < _nodes.Length; i++) sum += _weights[i] * f(mid + half * _nodes[i]);
        return sum * half;
    }

    private static (double Value, double Derivative) Legendre(int n, double x)
    {
        double p0 = 1, p1 = x;
        for (int k = 2; k <= n; k++)
        {
            double p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
            p0 = p1;
            p1 = p2;
        }
        // P_n' = n (x P_n − P_{n−1}) / (x² − 1); never evaluated at x = ±1 (not a root).
        return (p1, n * (x * p1 - p0) / (x * x - 1));
    }
}
