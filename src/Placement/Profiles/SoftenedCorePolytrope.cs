using Placement.Bodies;
using Placement.Numerics;

namespace Placement.Profiles;

/// <summary>
/// A polytropic gas sphere P = Kρ^(1+1/n) in hydrostatic equilibrium with its own gravity plus that of a softened point
/// mass at its centre, integrated outward from a regular centre; the inner part of a <see cref="CoreReplacedProfile"/>.
/// </summary>
/// <remarks>
/// <para>State w = ρ^(1/n) and the gas mass m(r): dw/dr = −G (m + m_c g(r/h)) / ((n + 1) K r²), dm/dr = 4πr² wⁿ, from
/// dP/dr = −G M_tot ρ / r² with P = K w^(n+1) (hydrostatic equilibrium, e.g. Kippenhahn, Weigert &amp; Weiss 2012, eq. 2.4;
/// g is <see cref="SplineSoftening.MassFraction"/>). In θ = w/w0 this is the Lane–Emden equation with the core's spline
/// density as an extra source, (1/ξ²)(ξ²θ')' = −θⁿ − (m_c/ρ0) W (the form of Ohlmann et al. 2017, A&amp;A 599, A5, as
/// derived in the project's reference notes). Where w &lt; 0 the density is taken as 0.</para>
/// <para>Start at r0 = 1e-4 of the smallest of h, r_c and the central length √(2w0/A), from the series
/// w = w0 − A r²/2, m = (4π/3)ρ0 r³ with A = G((4π/3)ρ0 + 32 m_c/(3h³))/((n + 1)K) (exact to O(r⁴)). Dormand–Prince 5(4)
/// (<see cref="DormandPrince45"/>) at relative tolerance 1e-12, with break points at h/2 and h where the kernel changes
/// form. Dense output: cubic Hermite between accepted points with the exact derivatives; intervals whose midpoint misses
/// a direct step by more than 1e-12 (relative to w0 in w, to m in m) are bisected.</para>
/// </remarks>
internal sealed class SoftenedCorePolytrope
{
    private const double RelativeTolerance = 1e-12;
    private const double InterpolationTolerance = 1e-12;

    private readonly double[] _r, _w, _m, _dw, _dm;

    private SoftenedCorePolytrope(Parameters p, double[] r, double[] w, double[] m)
    {
        P = p;
        _r = r; _w = w; _m = m;
        _dw = new double[r.Length];
        _dm = new double[r.Length];
        Span<double> y = stackalloc double[2];
        Span<double> d = stackalloc double[2];
        for (int i = 0; i < r.Length; i++)
        {
            y[0] = w[i]; y[1] = m[i];
            p.Derivatives(r[i], y, d);
            _dw[i] = d[0]; _dm[i] = d[1];
        }
    }

    /// <summary>Fixed inputs of one integration.</summary>
    internal sealed record Parameters(double Index, double K, double G, double CoreMass, double Softening, double CentralW, double CutRadius)
    {
        public double Rho(double w) => w > 0 ? Math.Pow(w, Index) : 0;

        public void Derivatives(double r, ReadOnlySpan<double> y, Span<double> d)
        {
            if (r == 0)
            {
                d[0] = 0; d[1] = 0;
                return;
            }
            double core = Softening > 0 ? CoreMass * SplineSoftening.MassFraction(r / Softening) : CoreMass;
            d[0] = -G * (y[1] + core) / ((Index + 1) * K * r * r);
            d[1] = 4 * Math.PI * r * r * Rho(y[0]);
        }
    }

    public Parameters P { get; }

    public int NodeCount => _r.Length;

    /// <summary>w and m at the cut radius (the last node).</summary>
    public (double W, double Mass) AtCut => (_w[^1], _m[^1]);

    public double Density(double r) => P.Rho(W(r));

    public double Pressure(double r)
    {
        double w = W(r);
        return w > 0 ? P.K * Math.Pow(w, P.Index + 1) : 0;
    }

    public double W(double r)
    {
        int k = Find(r);
        double h = _r[k + 1] - _r[k];
        return MonotoneCubic.Hermite((r - _r[k]) / h, h, _w[k], _w[k + 1], _dw[k], _dw[k + 1]);
    }

    public double Mass(double r)
    {
        if (!(r > 0)) return 0;
        int k = Find(r);
        double h = _r[k + 1] - _r[k];
        return MonotoneCubic.Hermite((r - _r[k]) / h, h, _m[k], _m[k + 1], _dm[k], _dm[k + 1]);
    }

    /// <summary>r with m(r) = mass, for 0 ≤ mass ≤ m(r_c), by safeguarded Newton on the Hermite interval.</summary>
    public double RadiusOfMass(double mass)
    {
        if (mass <= 0) return 0;
        if (mass >= _m[^1]) return _r[^1];
        int k = Array.BinarySearch(_m, mass);
        if (k >= 0) return _r[k];
        k = Math.Clamp(~k - 1, 0, _r.Length - 2);
        double r0 = _r[k], h = _r[k + 1] - r0;
        double m0 = _m[k], m1 = _m[k + 1], d0 = _dm[k], d1 = _dm[k + 1];
        // Safeguarded Newton on t ∈ [0, 1] (the Hermite mass is increasing there); inline, no allocation per call.
        double lo = 0, hi = 1, t = (mass - m0) / (m1 - m0);
        for (int i = 0; i < 100; i++)
        {
            double v = MonotoneCubic.Hermite(t, h, m0, m1, d0, d1) - mass;
            if (v == 0) break;
            if (v < 0) lo = t; else hi = t;
            double next = t - v / (h * MonotoneCubic.HermiteDerivative(t, h, m0, m1, d0, d1));
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            bool done = Math.Abs(next - t) <= 1e-16 || hi - lo <= 1e-16;
            t = next;
            if (done) break;
        }
        return r0 + t * h;
    }

    /// <summary>Integrates to the cut radius; with <paramref name="dense"/> keeps and refines every point for evaluation.</summary>
    /// <returns>w and m at r_c, and the solution when <paramref name="dense"/>.</returns>
    public static (double W, double Mass, SoftenedCorePolytrope? Solution) Integrate(Parameters p, double massScale, bool dense)
    {
        double n = p.Index, w0 = p.CentralW, rho0 = p.Rho(w0), rc = p.CutRadius, h = p.Softening;
        double coreDensityTerm = h > 0 ? 32 * p.CoreMass / (3 * h * h * h) : 0;
        double a = p.G * (4 * Math.PI / 3 * rho0 + coreDensityTerm) / ((n + 1) * p.K);
        double central = a > 0 ? Math.Sqrt(2 * w0 / a) : rc;
        double r0 = 1e-4 * Math.Min(Math.Min(rc, central), h > 0 ? h : rc);
        var xs = new List<double>();
        var ws = new List<double>();
        var ms = new List<double>();
        if (dense)
        {
            xs.Add(0); ws.Add(w0); ms.Add(0);
        }
        Span<double> y = stackalloc double[2];
        Span<double> yNew = stackalloc double[2];
        y[0] = w0 - 0.5 * a * r0 * r0;
        y[1] = 4 * Math.PI / 3 * rho0 * r0 * r0 * r0;
        if (dense) { xs.Add(r0); ws.Add(y[0]); ms.Add(y[1]); }
        var stepper = new DormandPrince45(2, p.Derivatives, RelativeTolerance, [1e-14 * w0, 1e-16 * massScale]);
        double x = r0, step = r0;
        Span<double> breaks = [h > 0 ? 0.5 * h : rc, h > 0 ? h : rc, rc];
        foreach (double end in breaks)
        {
            if (end <= x || end > rc) continue;
            while (x < end)
            {
                double hs = Math.Min(step, end - x);
                bool last = hs == end - x;
                double err = stepper.Step(x, y, hs, yNew);
                if (err <= 1 || hs < 1e-13 * end)
                {
                    x = last ? end : x + hs;
                    yNew.CopyTo(y);
                    if (dense) { xs.Add(x); ws.Add(y[0]); ms.Add(y[1]); }
                }
                else if (hs < 1e-13 * end) throw new InvalidOperationException($"Core polytrope step size collapsed at r = {x}.");
                step = DormandPrince45.NextStep(hs, err);
            }
        }
        if (!dense) return (y[0], y[1], null);
        var rx = new List<double>(xs.Count * 2) { xs[0] };
        var rw = new List<double>(xs.Count * 2) { ws[0] };
        var rm = new List<double>(xs.Count * 2) { ms[0] };
        Span<double> ya = stackalloc double[2];
        // The first interval [0, r0] holds the series and is not refined.
        rx.Add(xs[1]); rw.Add(ws[1]); rm.Add(ms[1]);
        for (int k = 1; k + 1 < xs.Count; k++)
        {
            ya[0] = ws[k]; ya[1] = ms[k];
            Refine(p, stepper, xs[k], ya, xs[k + 1], ws[k + 1], ms[k + 1], rx, rw, rm, 30);
        }
        var sol = new SoftenedCorePolytrope(p, [.. rx], [.. rw], [.. rm]);
        return (y[0], y[1], sol);
    }

    private static void Refine(Parameters p, DormandPrince45 stepper, double xa, ReadOnlySpan<double> ya, double xb, double wb, double mb,
        List<double> rx, List<double> rw, List<double> rm, int depth)
    {
        double xm = 0.5 * (xa + xb), h = xb - xa;
        Span<double> ym = stackalloc double[2];
        Span<double> da = stackalloc double[2];
        Span<double> db = stackalloc double[2];
        Span<double> yb = [wb, mb];
        stepper.Step(xa, ya, xm - xa, ym);
        p.Derivatives(xa, ya, da);
        p.Derivatives(xb, yb, db);
        double wh = MonotoneCubic.Hermite(0.5, h, ya[0], wb, da[0], db[0]);
        double mh = MonotoneCubic.Hermite(0.5, h, ya[1], mb, da[1], db[1]);
        bool ok = Math.Abs(wh - ym[0]) <= InterpolationTolerance * p.CentralW && Math.Abs(mh - ym[1]) <= InterpolationTolerance * ym[1];
        if (ok || depth == 0)
        {
            rx.Add(xb); rw.Add(wb); rm.Add(mb);
            return;
        }
        double wm = ym[0], mm = ym[1];
        Refine(p, stepper, xa, ya, xm, wm, mm, rx, rw, rm, depth - 1);
        Span<double> ymid = [wm, mm];
        Refine(p, stepper, xm, ymid, xb, wb, mb, rx, rw, rm, depth - 1);
    }

    private int Find(double r)
    {
        int k = Array.BinarySearch(_r, r);
        if (k < 0) k = ~k - 1;
        return Math.Clamp(k, 0, _r.Length - 2);
    }
}
