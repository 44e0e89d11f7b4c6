namespace Placement.Numerics;

/// <summary>Root of a continuous function on a bracket with a sign change, by Brent's method (no derivatives).</summary>
/// <remarks>
/// Inverse quadratic interpolation or secant steps when they stay inside the bracket and shrink it fast enough,
/// bisection otherwise, so convergence is guaranteed for any continuous function with a sign change (Brent 1973,
/// Algorithms for Minimization without Derivatives, ch. 4; Press et al., Numerical Recipes, 3rd ed., §9.3).
/// </remarks>
public static class BracketedRoot
{
    /// <summary>Finds x in [a, b] with f(x) = 0, given f(a) and f(b) of opposite signs (or one of them zero).</summary>
    /// <param name="f">The function.</param>
    /// <param name="a">One end of the bracket.</param>
    /// <param name="b">The other end.</param>
    /// <param name="fa">f(a).</param>
    /// <param name="fb">f(b).</param>
    /// <param name="tolerance">Absolute tolerance on x, &gt; 0.</param>
    /// <param name="maxIterations">Iteration limit.</param>
    /// <returns>The root estimate (the end of the final bracket with the smaller |f|).</returns>
    /// <exception cref="ArgumentNullException"><paramref name="f"/> is null.</exception>
    /// <exception cref="ArgumentException">f(a) and f(b) have the same sign or are not finite.</exception>
    public static double Solve(Func<double, double> f, double a, double b, double fa, double fb, double tolerance, int maxIterations = 200)
    {
        ArgumentNullException.ThrowIfNull(f);
        if (!double.IsFinite(fa) || !double.IsFinite(fb) || (fa > 0 && fb > 0) || (fa < 0 && fb < 0))
            throw new ArgumentException($"f must change sign on the bracket (f({a}) = {fa}, f({b}) = {fb}).");
        if (fa == 0) return a;
        if (fb == 0) return b;
        double c = a, fc = fa, d = b - a, e = d;
        for (int i = 0; i < maxIterations; i++)
        {
            if ((fb > 0) == (fc > 0))
            {
                c = a; fc = fa; d = b - a; e = d;
            }
            if (Math.Abs(fc) < Math.Abs(fb))
            {
                a = b; b = c; c = a;
                fa = fb; fb = fc; fc = fa;
            }
            double tol = 2 * 1e-16 * Math.Abs(b) + 0.5 * tolerance;
            double half = 0.5 * (c - b);
            if (Math.Abs(half) <= tol || fb == 0) return b;
            if (Math.Abs(e) >= tol && Math.Abs(fa) > Math.Abs(fb))
            {
                double s = fb / fa, p, q;
                if (a == c)
                {
                    p = 2 * half * s;
                    q = 1 - s;
                }
                else
                {
                    double qa = fa / fc, r = fb / fc;
                    p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
                    q = (qa - 1) * (r - 1) * (s - 1);
                }
                if (p > 0) q = -q; else p = -p;
                if (2 * p < Math.Min(3 * half * q - Math.Abs(tol * q), Math.Abs(e * q)))
                {
                    e = d;
                    d = p / q;
                }
                else
                {
                    d = half; e = d;
                }
            }
            else
            {
                d = half; e = d;
            }
            a = b; fa = fb;
            b += Math.Abs(d) > tol ? d : Math.CopySign(tol, half);
            fb = f(b);
        }
        return b;
    }
}
