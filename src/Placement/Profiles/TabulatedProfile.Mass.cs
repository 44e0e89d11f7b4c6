using Placement.Numerics;

namespace Placement.Profiles;

public sealed partial class TabulatedProfile
{
    private const double PanelTolerance = 1e-14;
    private const double MaxPanelLogVariation = 2.0;
    private static readonly double[] GlNodes = GaussLegendreRule.Eight.Nodes.ToArray();
    private static readonly double[] GlWeights = GaussLegendreRule.Eight.Weights.ToArray();

    // Mass panels (structure of arrays): start radius, ln of it, width in ln r, cumulative mass at the start
    // (one extra entry: the total), owning density segment, ln(dM/d ln r) at both ends (PCHIP panels only).
    private double[] _pR0 = [], _pX0 = [], _pH = [], _pM0 = [], _pG0 = [], _pG1 = [];
    private int[] _pSeg = [];
    private double[] _lnC = [];

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

    private double RadiusOfMass(double m)
    {
        if (m <= 0) return 0;
        if (m >= TotalMass) return OuterRadius;
        int p = Array.BinarySearch(_pM0, m);
        if (p < 0) p = ~p - 1;
        if (p >= _pM0.Length - 1) p = _pM0.Length - 2;
        if (_pM0[p] == m) return _pR0[p];
        int k = _pSeg[p];
        double target = m - _pM0[p];
        var c = _density;
        double lo, hi, x;
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
                    lo = Math.Log(Math.Min(Math.Cbrt(v / a), c.R1[k]));
                    hi = b > 0 ? Math.Log(Math.Min(Math.Cbrt(v / b), c.R1[k])) : Math.Log(c.R1[k]);
                    x = 0.5 * (lo + hi);
                    break;
                }
            case ProfileCurve.SurfacePower:
                lo = Math.Log(c.R0[k]);
                hi = Math.Log(c.R1[k]);
                x = lo + (hi - lo) * target / (_pM0[p + 1] - _pM0[p]);
                break;
            default:
                {
                    lo = _pX0[p];
                    hi = _pX0[p] + _pH[p];
                    // Cubic Hermite guess of ln r against mass with the exact end slopes d ln r/dM = 1/(dM/d ln r).
                    double w = _pM0[p + 1] - _pM0[p];
                    x = lo + MonotoneCubic.Hermite(target / w, w, 0, _pH[p], Math.Exp(-_pG0[p]), Math.Exp(-_pG1[p]));
                    break;
                }
        }
        if (hi <= lo) return Math.Exp(lo);
        for (int iter = 0; iter < 100; iter++)
        {
            if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
            double r = Math.Exp(x);
            double f = PanelMass(p, k, r, x) - target;
            if (f == 0) return r;
            if (f < 0) lo = x; else hi = x;
            double slope = 4 * Math.PI * r * r * r * _density.Evaluate(k, r);
            double next = x - f / slope;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - x) <= 1e-14 || hi - lo <= 4e-16 * Math.Max(1, Math.Abs(x))) return Math.Exp(next);
            x = next;
        }
        return Math.Exp(x);
    }

    /// <summary>Mass between the start of panel p (of segment k) and r (x = ln r).</summary>
    private double PanelMass(int p, int k, double r, double x)
    {
        var c = _density;
        switch (c.Kind[k])
        {
            case ProfileCurve.LogLog:
                return LogLogMass(k, _pX0[p], x);
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

    /// <summary>∫ 4π r³ρ d ln r over [xa, xb] inside PCHIP segment k, by the 8-point Gauss–Legendre rule.</summary>
    private double LogLogMass(int k, double xa, double xb)
    {
        var c = _density;
        double half = 0.5 * (xb - xa), mid = 0.5 * (xa + xb), sum = 0;
        double x0 = c.X0[k], h = c.Hx[k], y0 = c.Y0[k], y1 = c.Y1[k], d0 = c.D0[k], d1 = c.D1[k], lnc = _lnC[k];
        for (int i = 0; i < GlNodes.Length; i++)
        {
            double x = mid + half * GlNodes[i];
            double y = MonotoneCubic.Hermite((x - x0) / h, h, y0, y1, d0, d1);
            sum += GlWeights[i] * Math.Exp(lnc + 3 * x + y);
        }
        return sum * half;
    }

    private double LogDmDx(int k, double x)
    {
        var c = _density;
        return _lnC[k] + 3 * x + MonotoneCubic.Hermite((x - c.X0[k]) / c.Hx[k], c.Hx[k], c.Y0[k], c.Y1[k], c.D0[k], c.D1[k]);
    }

    private void BuildPanels()
    {
        var c = _density;
        _lnC = new double[c.Count];
        var r0 = new List<double>(); var x0 = new List<double>(); var hw = new List<double>(); var m0 = new List<double>();
        var g0 = new List<double>(); var g1 = new List<double>(); var seg = new List<int>();
        double total = 0;
        for (int k = 0; k < c.Count; k++)
        {
            _lnC[k] = Math.Log(4 * Math.PI * c.Scale[k]);
            if (c.Kind[k] != ProfileCurve.LogLog)
            {
                r0.Add(c.R0[k]); x0.Add(c.X0[k]); hw.Add(c.Hx[k]); m0.Add(total); g0.Add(0); g1.Add(0); seg.Add(k);
                total += PanelMassClosed(k, c.R1[k]);
                continue;
            }
            AddLogPanels(k, c.X0[k], c.X0[k] + c.Hx[k], 40, r0, x0, hw, m0, g0, g1, seg, ref total);
        }
        m0.Add(total);
        _pR0 = [.. r0]; _pX0 = [.. x0]; _pH = [.. hw]; _pM0 = [.. m0]; _pG0 = [.. g0]; _pG1 = [.. g1]; _pSeg = [.. seg];
    }

    private double PanelMassClosed(int k, double r) => PanelMass(0, k, r, Math.Log(r));

    private void AddLogPanels(int k, double a, double b, int depth, List<double> r0, List<double> x0, List<double> hw,
        List<double> m0, List<double> g0, List<double> g1, List<int> seg, ref double total)
    {
        double whole = LogLogMass(k, a, b);
        double mid = 0.5 * (a + b);
        double fine = LogLogMass(k, a, mid) + LogLogMass(k, mid, b);
        double ga = LogDmDx(k, a), gb = LogDmDx(k, b);
        bool ok = Math.Abs(whole - fine) <= PanelTolerance * fine && Math.Abs(gb - ga) <= MaxPanelLogVariation;
        if (ok || depth == 0)
        {
            r0.Add(a == _density.X0[k] ? _density.R0[k] : Math.Exp(a));
            x0.Add(a); hw.Add(b - a); m0.Add(total); g0.Add(ga); g1.Add(gb); seg.Add(k);
            total += whole;
            return;
        }
        AddLogPanels(k, a, mid, depth - 1, r0, x0, hw, m0, g0, g1, seg, ref total);
        AddLogPanels(k, mid, b, depth - 1, r0, x0, hw, m0, g0, g1, seg, ref total);
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
        return _pM0[p] + PanelMass(p, _pSeg[p], r, Math.Log(r));
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
