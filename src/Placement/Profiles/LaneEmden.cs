using Placement.Numerics;

namespace Placement.Profiles;

/// <summary>Solves the Lane–Emden equation θ'' + (2/ξ)θ' = −θⁿ, θ(0) = 1, θ'(0) = 0 with our own adaptive integrator.</summary>
/// <remarks>
/// <para>The equation is integrated in the first-order form θ' = −μ/ξ², μ' = ξ² θⁿ, where μ(ξ) = −ξ²θ'(ξ) is the
/// dimensionless enclosed mass (Chandrasekhar 1939, An Introduction to the Study of Stellar Structure, ch. IV;
/// Poisson &amp; Will 2014, Gravity, §2.4). The start avoids the singular centre with the series
/// θ = 1 − ξ²/6 + nξ⁴/120 − n(8n − 5)ξ⁶/15120 (Horedt 2004, Polytropes, eq. 2.2.13), used for ξ ≤ 0.01 where its
/// truncation error is below 1e-17.</para>
/// <para>Steps: Dormand–Prince 5(4) (<see cref="DormandPrince45"/>) with relative tolerance 1e-13 on θ and μ
/// (absolute 1e-15 on θ so the surface zero does not stall the control). The first zero ξ1 is found by Newton's
/// method on the step length from the last point before the sign change, each trial being one Dormand–Prince
/// step from that point, so ξ1 carries the integrator's accuracy. For θ &lt; 0, θⁿ is continued as zero for
/// non-integer n (where it is undefined) and as the polynomial θⁿ for integer n (so n = 0 gives exactly 1).</para>
/// <para>Dense output: the accepted points are kept and every interval is checked at its midpoint against a
/// direct step; intervals whose cubic Hermite interpolant (values and the exact derivatives from the equation)
/// misses by more than 1e-13 relative in μ or 1e-13 absolute in θ are bisected. Evaluations between points are
/// therefore accurate to about 1e-12 relative in μ (checked in tests against the closed forms for n = 0, 1, 5).</para>
/// </remarks>
public static class LaneEmden
{
    /// <summary>Below this ξ the series expansion is used instead of the integrated solution.</summary>
    public const double SeriesLimit = 0.01;

    private const double RelativeTolerance = 1e-13;
    private const double ThetaAbsoluteTolerance = 1e-15;
    private const double InterpolationTolerance = 1e-13;

    /// <summary>Integrates the Lane–Emden equation of index <paramref name="n"/> to its first zero ξ1 (n &lt; 5) or to <paramref name="xiMax"/>.</summary>
    /// <param name="n">Polytropic index, 0 ≤ n ≤ 10.</param>
    /// <param name="xiMax">Where to stop if θ has no zero before it; required (finite) for n ≥ 5, which have no finite zero.</param>
    /// <returns>The solution with dense output.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="n"/> is outside [0, 10], or n ≥ 5 with no finite <paramref name="xiMax"/>, or <paramref name="xiMax"/> ≤ 0.01.</exception>
    /// <exception cref="InvalidOperationException">The step size collapsed (should not happen for valid n).</exception>
    public static LaneEmdenSolution Solve(double n, double xiMax = double.PositiveInfinity)
    {
        if (!(n >= 0 && n <= 10)) throw new ArgumentOutOfRangeException(nameof(n), n, "Polytropic index must lie in [0, 10].");
        if (n >= 5 && !double.IsFinite(xiMax))
            throw new ArgumentOutOfRangeException(nameof(xiMax), xiMax, "For n ≥ 5 θ has no finite zero: give a finite xiMax.");
        if (!(xiMax > SeriesLimit)) throw new ArgumentOutOfRangeException(nameof(xiMax), xiMax, $"xiMax must exceed {SeriesLimit}.");

        bool integer = n == Math.Floor(n);
        OdeSystem rhs = (xi, y, d) =>
        {
            double th = y[0];
            double f = integer ? PowInteger(th, (int)n) : (th > 0 ? Math.Pow(th, n) : 0.0);
            d[0] = -y[1] / (xi * xi);
            d[1] = xi * xi * f;
        };
        var stepper = new DormandPrince45(2, rhs, RelativeTolerance, [ThetaAbsoluteTolerance, 0.0]);
        var xs = new List<double>();
        var th = new List<double>();
        var mu = new List<double>();
        double x = SeriesLimit;
        Span<double> y = stackalloc double[2];
        Span<double> yNew = stackalloc double[2];
        (y[0], y[1]) = Series(n, x);
        xs.Add(x); th.Add(y[0]); mu.Add(y[1]);
        double h = 0.01;
        bool surface = false;
        for (int guard = 0; guard < 10_000_000; guard++)
        {
            if (x >= xiMax) break;
            double step = Math.Min(h, xiMax - x);
            double err = stepper.Step(x, y, step, yNew);
            if (err <= 1 || step < 1e-14 * x)
            {
                if (yNew[0] <= 0 && n < 5)
                {
                    x = LocateZero(stepper, x, y, step, yNew);
                    y[0] = 0; y[1] = yNew[1];
                    xs.Add(x); th.Add(0.0); mu.Add(y[1]);
                    surface = true;
                    break;
                }
                x += step;
                yNew.CopyTo(y);
                xs.Add(x); th.Add(y[0]); mu.Add(y[1]);
            }
            if (step < 1e-14 * x) throw new InvalidOperationException($"Lane–Emden step size collapsed at ξ = {x} (n = {n}).");
            h = DormandPrince45.NextStep(step, err);
        }
        if (n < 5 && !surface) throw new ArgumentOutOfRangeException(nameof(xiMax), xiMax, $"θ has no zero before xiMax = {xiMax} for n = {n}.");
        return Refine(n, integer, stepper, xs, th, mu, surface);
    }

    /// <summary>Series θ and μ = −ξ²θ' about the centre, to order ξ⁶ in θ.</summary>
    internal static (double Theta, double Mu) Series(double n, double xi)
    {
        double x2 = xi * xi;
        double c6 = n * (8 * n - 5);
        double theta = 1 - x2 / 6 + n * x2 * x2 / 120 - c6 * x2 * x2 * x2 / 15120;
        double mu = xi * x2 * (1.0 / 3 - n * x2 / 30 + c6 * x2 * x2 / 2520);
        return (theta, mu);
    }

    internal static double PowInteger(double x, int n)
    {
        double r = 1;
        for (int i = 0; i < n; i++) r *= x;
        return r;
    }

    private static double LocateZero(DormandPrince45 stepper, double x0, ReadOnlySpan<double> y0, double hCross, Span<double> yOut)
    {
        // Newton on the step length: θ(x0 + h) = 0, θ' = −μ/ξ²; each trial is one step from the last point with θ > 0.
        double lo = 0, hi = hCross;
        double hTry = Math.Min(hCross, y0[0] * x0 * x0 / y0[1]);
        if (!(hTry > 0)) hTry = 0.5 * hCross;
        Span<double> yt = stackalloc double[2];
        double best = hCross;
        for (int i = 0; i < 200; i++)
        {
            stepper.Step(x0, y0, hTry, yt);
            double xe = x0 + hTry;
            if (yt[0] > 0) lo = hTry; else hi = hTry;
            double slope = -yt[1] / (xe * xe);
            double next = hTry - yt[0] / slope;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            best = hTry;
            yt.CopyTo(yOut);
            if (Math.Abs(next - hTry) <= 1e-16 * (x0 + hTry) || hi - lo <= 1e-16 * x0) break;
            hTry = next;
        }
        return x0 + best;
    }

    private static LaneEmdenSolution Refine(double n, bool integer, DormandPrince45 stepper, List<double> xs, List<double> th, List<double> mu, bool surface)
    {
        var rx = new List<double>(xs.Count * 2) { xs[0] };
        var rt = new List<double>(xs.Count * 2) { th[0] };
        var rm = new List<double>(xs.Count * 2) { mu[0] };
        Span<double> yl = stackalloc double[2];
        for (int k = 0; k + 1 < xs.Count; k++)
        {
            yl[0] = th[k]; yl[1] = mu[k];
            Bisect(n, integer, stepper, xs[k], yl, xs[k + 1], th[k + 1], mu[k + 1], rx, rt, rm, 40);
        }
        return new LaneEmdenSolution(n, rx.ToArray(), rt.ToArray(), rm.ToArray(), surface);
    }

    private static void Bisect(double n, bool integer, DormandPrince45 stepper, double xa, ReadOnlySpan<double> ya,
        double xb, double tb, double mb, List<double> rx, List<double> rt, List<double> rm, int depth)
    {
        double xm = 0.5 * (xa + xb);
        Span<double> ym = stackalloc double[2];
        stepper.Step(xa, ya, xm - xa, ym);
        double h = xb - xa;
        double ta = ya[0], ma = ya[1];
        double fa = integer ? PowInteger(ta, (int)n) : (ta > 0 ? Math.Pow(ta, n) : 0.0);
        double fb = integer ? PowInteger(tb, (int)n) : (tb > 0 ? Math.Pow(tb, n) : 0.0);
        double tHerm = MonotoneCubic.Hermite(0.5, h, ta, tb, -ma / (xa * xa), -mb / (xb * xb));
        double mHerm = MonotoneCubic.Hermite(0.5, h, ma, mb, xa * xa * fa, xb * xb * fb);
        bool ok = Math.Abs(tHerm - ym[0]) <= InterpolationTolerance && Math.Abs(mHerm - ym[1]) <= InterpolationTolerance * ym[1];
        if (ok || depth == 0)
        {
            rx.Add(xb); rt.Add(tb); rm.Add(mb);
            return;
        }
        double tm = ym[0], mm = ym[1];
        Bisect(n, integer, stepper, xa, ya, xm, tm, mm, rx, rt, rm, depth - 1);
        Span<double> ymid = [tm, mm];
        Bisect(n, integer, stepper, xm, ymid, xb, tb, mb, rx, rt, rm, depth - 1);
    }
}
