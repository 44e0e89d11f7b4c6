namespace Placement.Numerics;

/// <summary>Chebyshev interpolation on [−1, 1]: fitting at Chebyshev–Gauss points, Clenshaw evaluation, derivative series.</summary>
/// <remarks>
/// f(s) ≈ Σ_{m&lt;N} c_m T_m(s) − c_0/2 with c_m = (2/N) Σ_j f(s_j) cos(π m (j + ½)/N), s_j = cos(π (j + ½)/N); evaluation by
/// Clenshaw's recurrence; derivative coefficients by c'_{m−1} = c'_{m+1} + 2m c_m (Press et al., Numerical Recipes,
/// 3rd ed., §5.8–5.9). For functions analytic near [−1, 1] the error falls geometrically with N.
/// </remarks>
public static class ChebyshevSeries
{
    /// <summary>The N Chebyshev–Gauss points s_j = cos(π (j + ½)/N) on [−1, 1] (descending).</summary>
    /// <param name="nodes">Output, length N ≥ 1.</param>
    public static void Nodes(Span<double> nodes)
    {
        int n = nodes.Length;
        for (int j = 0; j < n; j++) nodes[j] = Math.Cos(Math.PI * (j + 0.5) / n);
    }

    /// <summary>Coefficients from values at <see cref="Nodes"/>; c_0 is stored already halved so the series is Σ c_m T_m.</summary>
    /// <param name="values">f(s_j), length N.</param>
    /// <param name="coefficients">Output, length N.</param>
    /// <exception cref="ArgumentException">Lengths differ.</exception>
    public static void Fit(ReadOnlySpan<double> values, Span<double> coefficients)
    {
        int n = values.Length;
        if (coefficients.Length != n) throw new ArgumentException("Coefficient and value spans must have the same length.", nameof(coefficients));
        for (int m = 0; m < n; m++)
        {
            double sum = 0;
            for (int j = 0; j < n; j++) sum += values[j] * Math.Cos(Math.PI * m * (j + 0.5) / n);
            coefficients[m] = 2.0 / n * sum;
        }
        coefficients[0] *= 0.5;
    }

    /// <summary>Σ c_m T_m(s) by Clenshaw's recurrence.</summary>
    /// <param name="coefficients">Series coefficients (c_0 not halved again).</param>
    /// <param name="s">Point in [−1, 1].</param>
    public static double Evaluate(ReadOnlySpan<double> coefficients, double s)
    {
        double b1 = 0, b2 = 0, s2 = 2 * s;
        for (int m = coefficients.Length - 1; m >= 1; m--)
        {
            double b0 = s2 * b1 - b2 + coefficients[m];
            b2 = b1;
            b1 = b0;
        }
        return s * b1 - b2 + coefficients[0];
    }

    /// <summary>Coefficients of d/ds of the series (length N − 1, same convention).</summary>
    /// <param name="coefficients">Series coefficients, length N ≥ 2.</param>
    /// <param name="derivative">Output, length N − 1.</param>
    /// <exception cref="ArgumentException">Lengths do not match.</exception>
    public static void Derivative(ReadOnlySpan<double> coefficients, Span<double> derivative)
    {
        int n = coefficients.Length;
        if (n < 2 || derivative.Length != n - 1) throw new ArgumentException("Derivative span must be one shorter than the series.", nameof(derivative));
        Span<double> d = stackalloc double[n + 1];
        d.Clear();
        for (int m = n - 1; m >= 1; m--) d[m - 1] = d[m + 1] + 2 * m * coefficients[m];
        d[0] *= 0.5;
        d[..(n - 1)].CopyTo(derivative);
    }
}
