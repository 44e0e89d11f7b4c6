namespace Placement.Numerics;

/// <summary>Root of a monotone function on a bracket by Newton's method, falling back to bisection.</summary>
/// <remarks>
/// Newton steps that leave the current bracket, or do not shrink it fast enough, are replaced by bisection
/// (the "rtsafe" strategy, Press et al., Numerical Recipes, 3rd ed., §9.4), so convergence is guaranteed for
/// any continuous function with a sign change on the bracket.
/// </remarks>
public static class SafeguardedNewton
{
    /// <summary>Finds x in [lo, hi] with f(x) = 0, where f(lo) ≤ 0 ≤ f(hi) or the reverse.</summary>
    /// <param name="f">Returns (value, derivative) at x.</param>
    /// <param name="lo">Left end of the bracket.</param>
    /// <param name="hi">Right end of the bracket.</param>
    /// <param name="guess">Starting point (clamped into the bracket).</param>
    /// <param name="tolerance">Absolute tolerance on x.</param>
    /// <param name="maxIterations">Iteration limit.</param>
    /// <exception cref="ArgumentNullException"><paramref name="f"/> is null.</exception>
    public static double Solve(Func<double, (double Value, double Derivative)> f, double lo, double hi, double guess,
        double tolerance, int maxIterations = 200)
    {
        ArgumentNullException.ThrowIfNull(f);
        double flo = f(lo).Value;
        if (flo == 0) return lo;
        bool increasing = flo < 0;
        double x = Math.Clamp(guess, lo, hi);
        double dxOld = hi - lo;
        for (int i = 0; i < maxIterations; i++)
        {
            (double v, double d) = f(x);
            if (v == 0) return x;
            if ((v < 0) == increasing) lo = x; else hi = x;
            double next = x - v / d;
            double dx;
            if (!(d != 0) || !(next > lo && next < hi) || Math.Abs(next - x) > 0.5 * Math.Abs(dxOld))
            {
                next = 0.5 * (lo + hi);
            }
            dx = next - x;
            dxOld = dx;
            x = next;
            if (Math.Abs(dx) <= tolerance || hi - lo <= tolerance) return x;
        }
        return x;
    }
}
