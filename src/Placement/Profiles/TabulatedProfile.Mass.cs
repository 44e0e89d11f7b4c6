using Placement.Numerics;

namespace Placement.Profiles;

public sealed partial class TabulatedProfile
{
    private const double PanelTolerance = 1e-14;
    private const double MaxPanelLogVariation = 2.0;
    private const int ChebyshevTerms = 16;
    private static readonly int[] CheckIndices = [0, 1, 4, 8, 12, 15];
    private static readonly double[] GlNodes = GaussLegendreRule.Eight.Nodes.ToArray();
    private static readonly double[] GlWeights = GaussLegendreRule.Eight.Weights.ToArray();

    // Mass panels (structure of arrays): start radius; start and width in u = ln(r/R0) local to the owning segment
    // (local so that large radii, e.g. 1e11 cm, keep full relative precision); cumulative mass at the start (one extra
    // entry: the total); owning density segment.
    private double[] _pR0 = [], _pU0 = [], _pH = [], _pM0 = [];
    private int[] _pSeg = [];
    private double[] _lnC = [];
    // Per PCHIP segment: e^(ln C + y0), dM/du at the segment start divided by e^(3u) (see LogLogMass).
    private double[] _segmentScale = [];
    // Per PCHIP panel: Chebyshev series (ChebyshevTerms coefficients) of the mass from the panel start as a function of
    // s ∈ [−1, 1] (u = u0 + (s + 1)h/2), and of its derivative (ChebyshevTerms − 1), flattened panel after panel.
    private double[] _pCheb = [], _pChebD = [];
    // Per PCHIP panel: Chebyshev series of the inverse, s as a function of q = 2ΔM/w − 1 (w = panel mass); the starting
    // guess of the Newton solve in r(M), accurate enough that one Newton step usually finishes.
    private double[] _pInv = [];
    // Guide table for r(M): entry b is the last panel starting at or below mass b·M/G (G = entries − 1), so a look-up
    // is one bucket plus a binary search over the few panels inside it.
    private int[] _massGuide = [];

    /// <inheritdoc />
    public double EnclosedMass(double r) => EnclosedMassUnchecked(r, TotalMass);

    /// <inheritdoc />
    public double RadiusOfEnclosedMass(double m)
    {
        ProfileGuards.MassInRange(m, TotalMass, nameof(m));
        return RadiusOfMass(m);
    }

    /// <inheritdoc />
    public void RadiusOfEnclosedMass(ReadOnlySpan<double> m, Span<double> r)
    {
        ProfileGuards.SpanLengths(m.Length, r.Length, nameof(r));
        for (int i = 0; i < m.Length; i++)
        {
            ProfileGuards.MassInRange(m[i], TotalMass, nameof(m));
            r[i] = RadiusOfMass(m[i]);
        }
    }

    /// <summary>Batch r(M) over arrays, split into chunks run in parallel through <see cref="Parallelism.ParallelLoop"/>; same bits on any thread count.</summary>
    /// <param name="m">Enclosed masses in [0, M(R)], mass units.</param>
    /// <param name="r">Output radii, length units; at least as long as <paramref name="m"/>.</param>
    /// <param name="settings">Parallelism; <see cref="Parallelism.ParallelSettings.Default"/> when null.</param>
    /// <exception cref="ArgumentNullException">An array is null.</exception>
    /// <exception cref="ArgumentException"><paramref name="r"/> is shorter than <paramref name="m"/>.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A mass is outside [0, M(R)].</exception>
    public void RadiusOfEnclosedMass(double[] m, double[] r, Parallelism.ParallelSettings? settings)
    {
        ArgumentNullException.ThrowIfNull(m);
        ArgumentNullException.ThrowIfNull(r);
        ProfileGuards.SpanLengths(m.Length, r.Length, nameof(r));
        foreach (double v in m) ProfileGuards.MassInRange(v, TotalMass, nameof(m));
        Parallelism.ParallelLoop.For(m.Length, settings, (start, end) =>
        {
            for (int i = start; i < end; i++) r[i] = RadiusOfMass(m[i]);
        });
    }

    private double RadiusOfMass(double m)
    {
        if (m <= 0) return 0;
        if (m >= TotalMass) return OuterRadius;
        int g = _massGuide.Length - 1;
        int bucket = Math.Min((int)(m / _pM0[^1] * g), g - 1);
        int first = _massGuide[bucket], last = Math.Min(_massGuide[bucket + 1] + 1, _pM0.Length - 1);
        int p = Array.BinarySearch(_pM0, first, last - first + 1, m);
        if (p < 0) p = ~p - 1;
        if (p < 0 || p >= _pM0.Length - 1 || _pM0[p] > m || _pM0[p + 1] < m)
        {
            // Rounding put m on the wrong side of a bucket edge: search everything.
            p = Array.BinarySearch(_pM0, m);
            if (p < 0) p = ~p - 1;
            p = Math.Clamp(p, 0, _pM0.Length - 2);
        }
        if (_pM0[p] == m) return _pR0[p];
        int k = _pSeg[p];
        double target = m - _pM0[p];
        var c = _density;
        // Newton variable u = ln(r/base): base = R0 of the segment, or R1 for the centre segment (R0 = 0).
        double lo, hi, u, rBase;
        switch (c.Kind[k])
        {
            case ProfileCurve.CorePower:
                {
                    double s = c.D0[k], whole = _pM0[p + 1] - _pM0[p];
                    return c.R1[k] * Math.Pow(target / whole, 1 / (3 + s));
                }
            case ProfileCurve.Centre:
                {
                    // ρ lies between the two end densities on [0, r], so r³ is bracketed by 3ΔM/(4π ρ_max) and 3ΔM/(4π ρ_min).
                    double a = c.Scale[k] * Math.Max(c.Y0[k], c.Y1[k]), b = c.Scale[k] * Math.Min(c.Y0[k], c.Y1[k]);
                    double v = 3 * target / (4 * Math.PI);
                    rBase = c.R1[k];
                    lo = Math.Log(Math.Min(Math.Cbrt(v / a) / rBase, 1));
                    hi = b > 0 ? Math.Log(Math.Min(Math.Cbrt(v / b) / rBase, 1)) : 0;
                    u = 0.5 * (lo + hi);
                    break;
                }
            case ProfileCurve.SurfacePower:
                rBase = c.R0[k];
                lo = 0;
                hi = Math.Log(c.R1[k] / rBase);
                u = hi * target / (_pM0[p + 1] - _pM0[p]);
                break;
            default:
                return c.R0[k] * Math.Exp(SolveChebyshevPanel(p, target));
        }
        if (hi <= lo) return rBase * Math.Exp(lo);
        for (int iter = 0; iter < 100; iter++)
        {
            if (!(u > lo && u < hi)) u = 0.5 * (lo + hi);
            double r = rBase * Math.Exp(u);
            double f = PanelMass(p, k, r) - target;
            if (f == 0) return r;
            if (f < 0) lo = u; else hi = u;
            double slope = 4 * Math.PI * r * r * r * c.Evaluate(k, r);
            double next = u - f / slope;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - u) <= 1e-14 || hi - lo <= 4e-16 * Math.Max(1, Math.Abs(u))) return rBase * Math.Exp(next);
            u = next;
        }
        return rBase * Math.Exp(u);
    }

    /// <summary>u = ln(r/R0) in PCHIP panel p where the panel's mass series equals <paramref name="target"/>.</summary>
    private double SolveChebyshevPanel(int p, double target)
    {
        var coef = _pCheb.AsSpan(p * ChebyshevTerms, ChebyshevTerms);
        var dcoef = _pChebD.AsSpan(p * (ChebyshevTerms - 1), ChebyshevTerms - 1);
        double w = _pM0[p + 1] - _pM0[p], h = _pH[p];
        double s = ChebyshevSeries.Evaluate(_pInv.AsSpan(p * ChebyshevTerms, ChebyshevTerms), Math.Clamp(2 * target / w - 1, -1, 1));
        double lo = -1, hi = 1;
        for (int iter = 0; iter < 100; iter++)
        {
            if (!(s > lo && s < hi)) s = 0.5 * (lo + hi);
            double f = ChebyshevSeries.Evaluate(coef, s) - target;
            if (f == 0) break;
            if (f < 0) lo = s; else hi = s;
            double next = s - f / ChebyshevSeries.Evaluate(dcoef, s);
            bool newton = next > lo && next < hi;
            if (!newton) next = 0.5 * (lo + hi);
            double step = Math.Abs(next - s) * 0.5 * h;
            s = next;
            // After a Newton step of size Δu the error is about ½|g'|Δu² (g = ln dM/du): Δu ≤ 2e-9 leaves < 1e-16 for |g'| ≤ 50.
            if ((newton && step <= 2e-9) || (hi - lo) * 0.5 * h <= 1e-15) break;
        }
        return _pU0[p] + (s + 1) * 0.5 * h;
    }

    /// <summary>Mass between the start of panel p (of segment k) and r.</summary>
    private double PanelMass(int p, int k, double r)
    {
        var c = _density;
        switch (c.Kind[k])
        {
            case ProfileCurve.LogLog:
                {
                    double sc = 2 * (Math.Log(r / c.R0[k]) - _pU0[p]) / _pH[p] - 1;
                    return ChebyshevSeries.Evaluate(_pCheb.AsSpan(p * ChebyshevTerms, ChebyshevTerms), Math.Clamp(sc, -1, 1));
                }
            case ProfileCurve.CorePower:
                {
                    double s = c.D0[k], rr = c.R1[k];
                    return 4 * Math.PI * c.Scale[k] * c.Y0[k] * rr * rr * rr / (3 + s) * Math.Pow(r / rr, 3 + s);
                }
            case ProfileCurve.Centre:
                {
                    double q = c.D0[k], r3 = r * r * r;
                    return 4 * Math.PI * c.Scale[k] * (c.Y0[k] * r3 / 3 + (c.Y1[k] - c.Y0[k]) * r3 * Math.Pow(r / c.R1[k], q) / (3 + q));
                }
            case ProfileCurve.SurfacePower:
                return c.Scale[k] * SurfaceShell.Mass(c.R0[k], c.R1[k], c.Y0[k], c.D0[k], r);
            default:
                throw new InvalidOperationException("Density segments are never of the linear kind.");
        }
    }

    /// <summary>∫ 4π r³ρ du over [ua, ub] (u = ln(r/R0)) inside PCHIP segment k, by the 8-point Gauss–Legendre rule.</summary>
    private double LogLogMass(int k, double ua, double ub)
    {
        var c = _density;
        double half = 0.5 * (ub - ua), mid = 0.5 * (ua + ub), sum = 0;
        double h = c.Hx[k], y0 = c.Y0[k], dy = c.Y1[k] - c.Y0[k], d0 = c.D0[k], d1 = c.D1[k];
        for (int i = 0; i < GlNodes.Length; i++)
        {
            double u = mid + half * GlNodes[i];
            // ln ρ relative to the segment start: ln ρ itself may be −300 or less far out in a steep envelope, and the
            // rounding of so large an exponent (~1e-14 absolute) would make every evaluation scatter by ~1e-14 relative,
            // which no panel split can remove; the common factor e^(ln C + y0) is one rounding for the whole segment.
            double y = MonotoneCubic.Hermite(u / h, h, 0, dy, d0, d1);
            sum += GlWeights[i] * Math.Exp(3 * u + y);
        }
        return sum * half * _segmentScale[k];
    }

    /// <summary>ln(dM/du) at u = ln(r/R0) in PCHIP segment k.</summary>
    private double LogDmDu(int k, double u)
    {
        var c = _density;
        return _lnC[k] + 3 * u + MonotoneCubic.Hermite(u / c.Hx[k], c.Hx[k], c.Y0[k], c.Y1[k], c.D0[k], c.D1[k]);
    }

    private void BuildPanels()
    {
        var c = _density;
        _lnC = new double[c.Count];
        _segmentScale = new double[c.Count];
        var b = new PanelLists();
        for (int k = 0; k < c.Count; k++)
        {
            // dM/du = 4π S r³ρ with r = R0 e^u: the constant part ln(4π S R0³) is folded into one number.
            _lnC[k] = c.Kind[k] == ProfileCurve.LogLog ? Math.Log(4 * Math.PI * c.Scale[k]) + 3 * Math.Log(c.R0[k]) : 0;
            _segmentScale[k] = c.Kind[k] == ProfileCurve.LogLog ? Math.Exp(_lnC[k] + c.Y0[k]) : 0;
            if (c.Kind[k] != ProfileCurve.LogLog)
            {
                // Closed-form panel: series slots stay zero and are never read.
                b.Add(c.R0[k], 0, c.Hx[k], k, new double[ChebyshevTerms], new double[ChebyshevTerms - 1], new double[ChebyshevTerms]);
                b.Total += PanelMassClosedForm(k, c.R1[k]);
                continue;
            }
            AddLogPanels(k, 0, c.Hx[k], 30, b);
        }
        b.M0.Add(b.Total);
        int entries = 2 * b.R0.Count + 1;
        _massGuide = new int[entries + 1];
        for (int e = 0, p = 0; e <= entries; e++)
        {
            double edge = b.Total * e / entries;
            while (p + 1 < b.R0.Count && b.M0[p + 1] <= edge) p++;
            _massGuide[e] = p;
        }
        _pCheb = [.. b.Cheb]; _pChebD = [.. b.ChebD]; _pInv = [.. b.Inv];
        _pR0 = [.. b.R0]; _pU0 = [.. b.U0]; _pH = [.. b.H]; _pM0 = [.. b.M0]; _pSeg = [.. b.Seg];
    }

    private double PanelMassClosedForm(int k, double r)
    {
        // PanelMass reads panel data only for PCHIP segments, so any panel index serves for the closed forms.
        return PanelMass(0, k, r);
    }

    private void AddLogPanels(int k, double a, double b, int depth, PanelLists lists)
    {
        double whole = LogLogMass(k, a, b);
        double mid = 0.5 * (a + b);
        double fine = LogLogMass(k, a, mid) + LogLogMass(k, mid, b);
        double tolerance = SegmentTolerance(k);
        bool ok = Math.Abs(whole - fine) <= tolerance * fine && Math.Abs(LogDmDu(k, b) - LogDmDu(k, a)) <= MaxPanelLogVariation;
        var coef = new double[ChebyshevTerms];
        if (ok || depth == 0) ok = FitPanel(k, a, b, whole, coef, tolerance) || depth == 0;
        if (ok)
        {
            var d = new double[ChebyshevTerms - 1];
            ChebyshevSeries.Derivative(coef, d);
            var inverse = new double[ChebyshevTerms];
            FitInverse(coef, d, inverse);
            lists.Add(a == 0 ? _density.R0[k] : _density.R0[k] * Math.Exp(a), a, b - a, k, coef, d, inverse);
            lists.Total += ChebyshevSeries.Evaluate(coef, 1);
            return;
        }
        AddLogPanels(k, a, mid, depth - 1, lists);
        AddLogPanels(k, mid, b, depth - 1, lists);
    }

    /// <summary>Panel arrays while they are being built.</summary>
    private sealed class PanelLists
    {
        public readonly List<double> R0 = [], U0 = [], H = [], M0 = [], Cheb = [], ChebD = [], Inv = [];
        public readonly List<int> Seg = [];
        public double Total;

        public void Add(double r0, double u0, double h, int seg, double[] cheb, double[] chebD, double[] inv)
        {
            R0.Add(r0); U0.Add(u0); H.Add(h); M0.Add(Total); Seg.Add(seg);
            Cheb.AddRange(cheb); ChebD.AddRange(chebD); Inv.AddRange(inv);
        }
    }

    /// <summary>Fits s(q), the inverse of the panel's mass series, at Chebyshev nodes in q (solved by bisection-safeguarded Newton).</summary>
    private static void FitInverse(double[] coef, double[] dcoef, double[] inverse)
    {
        Span<double> q = stackalloc double[ChebyshevTerms];
        Span<double> sv = stackalloc double[ChebyshevTerms];
        ChebyshevSeries.Nodes(q);
        double w = ChebyshevSeries.Evaluate(coef, 1) - ChebyshevSeries.Evaluate(coef, -1), m0 = ChebyshevSeries.Evaluate(coef, -1);
        for (int j = 0; j < ChebyshevTerms; j++)
        {
            double target = m0 + 0.5 * (q[j] + 1) * w, lo = -1, hi = 1, s = q[j];
            for (int it = 0; it < 100; it++)
            {
                double f = ChebyshevSeries.Evaluate(coef, s) - target;
                if (f == 0) break;
                if (f < 0) lo = s; else hi = s;
                double next = s - f / ChebyshevSeries.Evaluate(dcoef, s);
                if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
                if (Math.Abs(next - s) < 1e-15) { s = next; break; }
                s = next;
            }
            sv[j] = s;
        }
        ChebyshevSeries.Fit(sv, inverse);
    }

    /// <summary>Fits the Chebyshev series of the mass from u = a on [a, b]; true when it matches the quadrature to 1e-14 of the panel mass at the check points.</summary>
    /// <summary>
    /// Relative tolerance of segment k's panels: <see cref="PanelTolerance"/>, or the rounding of its integrand where that
    /// is larger. The exponent 3u + y(u) is a cubic whose terms reach |Δy| + h(|d0| + |d1|) + 3h; each evaluation is off
    /// by about that times the unit roundoff, relative, and no panel split removes it. Where ln ρ falls by tens within
    /// one row (an invented 1e-3 → 1e-20 last row) that noise passed 1e-14, every panel failed its check and the panels
    /// split to depth 30 (the constructor never returned).
    /// </summary>
    private double SegmentTolerance(int k)
    {
        var c = _density;
        double h = c.Hx[k];
        double terms = Math.Abs(c.Y1[k] - c.Y0[k]) + Math.Abs(h) * (Math.Abs(c.D0[k]) + Math.Abs(c.D1[k]) + 3);
        return Math.Max(PanelTolerance, RoundingMargin * UnitRoundoff * terms);
    }

    // Unit roundoff of double (2^-53) and the margin over it that the panel checks allow (two noisy values compared).
    private const double UnitRoundoff = 1.1102230246251565e-16;
    private const double RoundingMargin = 32;

    private bool FitPanel(int k, double a, double b, double whole, double[] coef, double tolerance)
    {
        Span<double> s = stackalloc double[ChebyshevTerms];
        Span<double> f = stackalloc double[ChebyshevTerms];
        ChebyshevSeries.Nodes(s);
        double half = 0.5 * (b - a);
        for (int j = 0; j < ChebyshevTerms; j++) f[j] = LogLogMass(k, a, a + (s[j] + 1) * half);
        ChebyshevSeries.Fit(f, coef);
        // Check points: the panel end and the extrema of T_16 nearest the ends and the middle, where interpolation
        // error peaks (the series is the Chebyshev interpolant, so its error is largest between the fit nodes).
        foreach (int j in CheckIndices)
        {
            double sj = Math.Cos(Math.PI * j / ChebyshevTerms);
            double exact = LogLogMass(k, a, a + (sj + 1) * half);
            if (Math.Abs(ChebyshevSeries.Evaluate(coef, sj) - exact) > tolerance * whole) return false;
        }
        return true;
    }

    private MassConsistency CompareMasses(MassSource source)
    {
        var tab = _tabulatedMass!;
        double totalTab = tab[^1], totalInt = _pM0[^1];
        double maxRel = 0, maxAbs = 0;
        int row = 0;
        for (int i = 0; i < _r.Length; i++)
        {
            double mi = EnclosedMassUnchecked(_r[i], totalInt);
            double d = Math.Abs(mi - tab[i]);
            maxAbs = Math.Max(maxAbs, d);
            if (tab[i] > 0 && d / tab[i] > maxRel) { maxRel = d / tab[i]; row = i; }
        }
        return new MassConsistency(source, maxRel, row, maxAbs / totalTab, totalInt, totalTab);
    }

    private double EnclosedMassUnchecked(double r, double total)
    {
        if (!(r > 0)) return 0;
        if (r >= _r[^1]) return total;
        int p = Array.BinarySearch(_pR0, r);
        if (p < 0) p = ~p - 1;
        return _pM0[p] + PanelMass(p, _pSeg[p], r);
    }

    private void RenormaliseToTabulatedMasses()
    {
        var c = _density;
        double total = _pM0[^1];
        for (int k = 0; k < c.Count; k++)
        {
            double mTab0 = TabulatedMassAt(c.R0[k]), mTab1 = TabulatedMassAt(c.R1[k]);
            double mInt0 = EnclosedMassUnchecked(c.R0[k], total), mInt1 = c.R1[k] >= _r[^1] ? total : EnclosedMassUnchecked(c.R1[k], total);
            // An interval whose tabulated mass is not resolved by the table's precision keeps the integrated density.
            double dTab = mTab1 - mTab0, dInt = mInt1 - mInt0;
            c.Scale[k] = dTab > 1e-12 * _tabulatedMass![^1] && dInt > 0 ? dTab / dInt : 1;
        }
    }

    private double TabulatedMassAt(double r)
    {
        if (r == 0) return 0;
        int i = Array.BinarySearch(_r, r);
        if (i < 0) throw new InvalidOperationException("Segment end is not a row radius.");
        while (i > 0 && _r[i - 1] == r) i--;
        return _tabulatedMass![i];
    }
}
