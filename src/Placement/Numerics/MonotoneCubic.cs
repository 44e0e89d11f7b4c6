namespace Placement.Numerics;

/// <summary>Shape-preserving piecewise cubic Hermite interpolation (PCHIP): slopes and evaluation.</summary>
/// <remarks>
/// Interior slopes: the second-order three-point (Bessel) derivative (h1 δ0 + h0 δ1)/(h0 + h1), passed through the
/// monotonicity filter of Hyman 1983 (SIAM J. Sci. Stat. Comput. 4, 645): zero where the neighbouring secants δ0, δ1
/// differ in sign, otherwise limited to 3 min(|δ0|, |δ1|). The limit keeps every segment inside the Fritsch–Carlson
/// monotonicity region α, β ≤ 3 (Fritsch &amp; Carlson 1980, SIAM J. Numer. Anal. 17, 238), so the interpolant is monotone
/// wherever the data are and never leaves the range of the two nodes bounding a segment; unlike the harmonic-mean
/// slopes of Fritsch &amp; Butland it stays third-order accurate on irregular node spacing. End slopes: the one-sided
/// three-point formula with the same shape-preserving limits (Moler 2004, Numerical Computing with MATLAB, §3.4).
/// </remarks>
public static class MonotoneCubic
{
    /// <summary>Computes PCHIP slopes d[i] = dy/dx at the nodes.</summary>
    /// <param name="x">Strictly increasing abscissae, at least two.</param>
    /// <param name="y">Ordinates, same length.</param>
    /// <param name="slopes">Output, same length.</param>
    /// <exception cref="ArgumentException">Lengths differ or fewer than two nodes.</exception>
    public static void Slopes(ReadOnlySpan<double> x, ReadOnlySpan<double> y, Span<double> slopes)
    {
        int n = x.Length;
        if (n < 2 || y.Length != n || slopes.Length < n) throw new ArgumentException("Need at least two nodes and equal lengths.");
        if (n == 2)
        {
            double s = (y[1] - y[0]) / (x[1] - x[0]);
            slopes[0] = s;
            slopes[1] = s;
            return;
        }
        for (int k = 1; k < n - 1; k++)
        {
            double h0 = x[k] - x[k - 1], h1 = x[k + 1] - x[k];
            double d0 = (y[k] - y[k - 1]) / h0, d1 = (y[k + 1] - y[k]) / h1;
            if (d0 * d1 <= 0) { slopes[k] = 0; continue; }
            double bessel = (h1 * d0 + h0 * d1) / (h0 + h1);
            double limit = 3 * Math.Min(Math.Abs(d0), Math.Abs(d1));
            slopes[k] = Math.Abs(bessel) > limit ? Math.CopySign(limit, d0) : bessel;
        }
        slopes[0] = EndSlope(x[1] - x[0], x[2] - x[1], (y[1] - y[0]) / (x[1] - x[0]), (y[2] - y[1]) / (x[2] - x[1]));
        slopes[n - 1] = EndSlope(x[n - 1] - x[n - 2], x[n - 2] - x[n - 3],
            (y[n - 1] - y[n - 2]) / (x[n - 1] - x[n - 2]), (y[n - 2] - y[n - 3]) / (x[n - 2] - x[n - 3]));
    }

    /// <summary>Value of the cubic Hermite polynomial on [x0, x0 + h] at x0 + t h.</summary>
    /// <param name="t">Position in the segment, 0 ≤ t ≤ 1.</param>
    /// <param name="h">Segment width.</param>
    /// <param name="y0">Value at the left end.</param>
    /// <param name="y1">Value at the right end.</param>
    /// <param name="d0">Slope at the left end.</param>
    /// <param name="d1">Slope at the right end.</param>
    public static double Hermite(double t, double h, double y0, double y1, double d0, double d1)
    {
        double t2 = t * t, t3 = t2 * t;
        return (2 * t3 - 3 * t2 + 1) * y0 + (t3 - 2 * t2 + t) * h * d0 + (-2 * t3 + 3 * t2) * y1 + (t3 - t2) * h * d1;
    }

    /// <summary>Derivative with respect to x of <see cref="Hermite"/> at x0 + t h.</summary>
    /// <param name="t">Position in the segment, 0 ≤ t ≤ 1.</param>
    /// <param name="h">Segment width.</param>
    /// <param name="y0">Value at the left end.</param>
    /// <param name="y1">Value at the right end.</param>
    /// <param name="d0">Slope at the left end.</param>
    /// <param name="d1">Slope at the right end.</param>
    public static double HermiteDerivative(double t, double h, double y0, double y1, double d0, double d1)
    {
        double t2 = t * t;
        return ((6 * t2 - 6 * t) * (y0 - y1)) / h + (3 * t2 - 4 * t + 1) * d0 + (3 * t2 - 2 * t) * d1;
    }

    private static double EndSlope(double h0, double h1, double del0, double del1)
    {
        double d = ((2 * h0 + h1) * del0 - h0 * del1) / (h0 + h1);
        if (Math.Sign(d) != Math.Sign(del0)) return 0;
        if (Math.Abs(d) > Math.Abs(3 * del0)) return 3 * del0;
        return d;
    }
}
