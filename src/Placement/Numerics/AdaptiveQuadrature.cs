namespace Placement.Numerics;

/// <summary>Globally convergent adaptive integration of smooth functions by bisection with Gauss–Legendre panels.</summary>
/// <remarks>
/// Each panel is integrated by the 8-point Gauss–Legendre rule and by the same rule on its two halves; the
/// panel is accepted when the two agree to max(relative × |whole estimate so far|, absolute), otherwise both halves
/// are refined (common practice in adaptive quadrature, e.g. Press et al., Numerical Recipes, 3rd ed., §4.7).
/// The returned error estimate is the sum of the accepted |coarse − fine| differences, a conservative bound for
/// smooth integrands because the fine value (which is returned) is far more accurate than the coarse one.
/// </remarks>
public static class AdaptiveQuadrature
{
    /// <summary>∫ₐᵇ f(x) dx to the requested tolerance.</summary>
    /// <param name="f">Integrand; called only at interior points of [a, b].</param>
    /// <param name="a">Lower limit.</param>
    /// <param name="b">Upper limit.</param>
    /// <param name="relativeTolerance">Target relative accuracy, ≥ 1e-15.</param>
    /// <param name="absoluteTolerance">Target absolute accuracy, ≥ 0.</param>
    /// <param name="maxDepth">Maximum bisection depth.</param>
    /// <returns>The integral and the sum of accepted panel error estimates.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="f"/> is null.</exception>
    /// <exception cref="ArgumentException">A limit is not finite.</exception>
    public static (double Value, double ErrorEstimate) Integrate(
        Func<double, double> f, double a, double b, double relativeTolerance = 1e-13, double absoluteTolerance = 0, int maxDepth = 40)
    {
        ArgumentNullException.ThrowIfNull(f);
        if (!double.IsFinite(a) || !double.IsFinite(b)) throw new ArgumentException($"Integration limits must be finite (got [{a}, {b}]).");
        if (a == b) return (0, 0);
        var rule = GaussLegendreRule.Eight;
        double whole = rule.Integrate(f, a, b);
        double err = 0;
        double value = Recurse(f, rule, a, b, whole, Math.Max(relativeTolerance, 1e-15), absoluteTolerance, Math.Abs(whole), maxDepth, ref err);
        return (value, err);
    }

    private static double Recurse(Func<double, double> f, GaussLegendreRule rule, double a, double b, double whole,
        double rel, double abs, double scale, int depth, ref double err)
    {
        double m = 0.5 * (a + b);
        double left = rule.Integrate(f, a, m), right = rule.Integrate(f, m, b);
        double fine = left + right, diff = Math.Abs(fine - whole);
        double tol = Math.Max(rel * Math.Max(scale, Math.Abs(fine)), abs);
        if (diff <= tol || depth <= 0 || m <= a || m >= b)
        {
            err += diff;
            return fine;
        }
        return Recurse(f, rule, a, m, left, rel, abs, scale, depth - 1, ref err)
             + Recurse(f, rule, m, b, right, rel, abs, scale, depth - 1, ref err);
    }
}
