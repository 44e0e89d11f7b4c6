using Placement.Numerics;

namespace Placement.Profiles;

/// <summary>
/// A piecewise, shape-preserving interpolant v(r) on [0, R] built from tabulated nodes; used for density and for
/// every carried quantity of <see cref="TabulatedProfile"/>.
/// </summary>
/// <remarks>
/// <para>Layout (structure of arrays, one entry per segment, segments contiguous and ascending in r; a repeated
/// node radius is a step and produces no segment): <c>R0, R1</c> segment ends; <c>Hx</c> = ln(R1/R0), the
/// width in the local log coordinate u = ln(r/R0) used by the cubic (local so large radii keep full precision); <c>Y0, Y1, D0, D1</c> shape coefficients whose meaning depends on <c>Kind</c>; <c>Scale</c>
/// multiplies the value (1 unless the profile renormalises density to tabulated masses).</para>
/// <para>Kinds: <see cref="LogLog"/>: ln v is the PCHIP cubic in ln r (Y, D = ln v and d ln v/d ln r at the ends);
/// <see cref="LinLog"/>: v itself is the PCHIP cubic in ln r (used for quantities with zero or negative values);
/// <see cref="Centre"/>: first segment when the table starts at r = 0: v = Y0 + (Y1 − Y0)(r/R1)^q, q = D0
/// (q = 2: even in r, as any smooth spherically symmetric field is at the centre); <see cref="SurfacePower"/>:
/// last segment when v falls to zero at R: v = Y0 ((R1 − r)/(R1 − R0))^p, p = D0; <see cref="CorePower"/>: the
/// extrapolation below the first node when the table starts at r0 &gt; 0: v = Y0 (r/R1)^s, s = D0.</para>
/// </remarks>
internal sealed class ProfileCurve
{
    public const byte LogLog = 0, LinLog = 1, Centre = 2, SurfacePower = 3, CorePower = 4;

    public double[] R0 = [], R1 = [], Hx = [], Y0 = [], Y1 = [], D0 = [], D1 = [], Scale = [];
    public byte[] Kind = [];

    public int Count => Kind.Length;

    public double OuterRadius => R1[^1];

    /// <summary>
    /// Log slope |d ln ρ/d ln r| at the first row (off centre) below which the density is continued as a smooth core rather
    /// than a power-law cusp: 0.1, so cusps ρ ∝ r^−γ with γ ≥ 0.1 stay cusps and a core's extrapolated ρ(0) exceeds the
    /// first row's by at most 5 %.
    /// </summary>
    public const double CoreSlopeLimit = 0.1;

    /// <summary>Builds the interpolant. Nodes must already be validated (see <see cref="ProfileTableChecks"/>).</summary>
    /// <param name="r">Node radii, non-decreasing, a repeated radius marking a step.</param>
    /// <param name="v">Node values.</param>
    /// <param name="density">True for density: always log-space, power-law core and surface.</param>
    /// <param name="centreExponent">q of the centre segment (2 in radius, 2/3 in mass coordinate).</param>
    public static ProfileCurve Build(ReadOnlySpan<double> r, ReadOnlySpan<double> v, bool density, double centreExponent = 2)
    {
        int n = r.Length;
        var seg = new List<(double r0, double r1, byte kind, double y0, double y1, double d0, double d1)>(n + 1);
        int start = 0;
        bool first = true;
        double coreSlope = 0;
        while (start < n)
        {
            int end = start;
            while (end + 1 < n && r[end + 1] > r[end]) end++;
            bool lastZone = end == n - 1;
            bool allPositive = true;
            for (int i = start; i <= end; i++) if (!(v[i] > 0) && !(lastZone && i == end && v[i] == 0)) allPositive = false;
            bool log = density || allPositive;
            bool surfaceZero = log && lastZone && v[end] == 0;
            bool centre = r[start] == 0;
            int j0 = centre ? start + 1 : start, j1 = surfaceZero ? end - 1 : end;

            if (centre)
            {
                int k = start + 1;
                seg.Add((0, r[k], Centre, v[start], v[k], centreExponent, 0));
            }
            if (j1 > j0)
            {
                int m = j1 - j0 + 1;
                var x = new double[m];
                var y = new double[m];
                var d = new double[m];
                for (int i = 0; i < m; i++)
                {
                    x[i] = Math.Log(r[j0 + i] / r[j0]); // relative to the zone start: full precision for large radii
                    y[i] = log ? Math.Log(v[j0 + i]) : v[j0 + i];
                }
                MonotoneCubic.Slopes(x, y, d);
                for (int i = 0; i + 1 < m; i++)
                    seg.Add((r[j0 + i], r[j0 + i + 1], log ? LogLog : LinLog, y[i], y[i + 1], d[i], d[i + 1]));
                if (first && density) coreSlope = Math.Clamp(d[0], -2.5, 0);
            }
            if (surfaceZero && (end - 1 > start || !centre))
            {
                int a = end - 1;
                double p = 1;
                if (density && a - 1 >= start) p = SurfaceShell.Exponent(r[a - 1], v[a - 1], r[a], v[a], r[end]);
                seg.Add((r[a], r[end], SurfacePower, v[a], 0, p, 0));
            }
            first = false;
            start = end + 1;
        }
        if (r[0] > 0)
        {
            // Below the first row: a density whose log slope there is shallower than CoreSlopeLimit is a smooth core sampled
            // off centre (a stellar model's first zone; the slope of ρ_c − a r² vanishes like r²), continued as the even
            // centre form with ρ(0) = ρ0 (1 − s/q), which matches ρ0 and the slope s at the first row; a steeper one is a cusp
            // (Hernquist, NFW: s → −1) continued as the power law ρ0 (r/r0)^s, whose ρ(0) is infinite.
            if (density && coreSlope > -CoreSlopeLimit)
                seg.Insert(0, (0, r[0], Centre, v[0] * (1 - coreSlope / centreExponent), v[0], centreExponent, 0));
            else
                seg.Insert(0, (0, r[0], CorePower, v[0], v[0], density ? coreSlope : 0, 0));
        }

        var c = new ProfileCurve();
        int s = seg.Count;
        c.R0 = new double[s]; c.R1 = new double[s]; c.Hx = new double[s];
        c.Y0 = new double[s]; c.Y1 = new double[s]; c.D0 = new double[s]; c.D1 = new double[s];
        c.Scale = new double[s]; c.Kind = new byte[s];
        for (int i = 0; i < s; i++)
        {
            var g = seg[i];
            c.R0[i] = g.r0; c.R1[i] = g.r1; c.Kind[i] = g.kind;
            c.Hx[i] = g.r0 > 0 ? Math.Log(g.r1 / g.r0) : double.PositiveInfinity;
            c.Y0[i] = g.y0; c.Y1[i] = g.y1; c.D0[i] = g.d0; c.D1[i] = g.d1; c.Scale[i] = 1;
        }
        return c;
    }

    /// <summary>Index of the segment containing r (right-continuous at steps), for 0 ≤ r ≤ R.</summary>
    public int Find(double r)
    {
        int k = Array.BinarySearch(R0, r);
        if (k < 0) k = ~k - 1;
        return Math.Clamp(k, 0, R0.Length - 1);
    }

    /// <summary>v(r) for 0 ≤ r ≤ R (callers handle the outside).</summary>
    public double Evaluate(double r) => Evaluate(Find(r), r);

    public double Evaluate(int k, double r)
    {
        switch (Kind[k])
        {
            case LogLog:
                {
                    // ln(r/R0) rather than ln r − ln R0: keeps full relative precision when r is large (cgs radii).
                    double t = Math.Log(r / R0[k]) / Hx[k];
                    return Scale[k] * Math.Exp(MonotoneCubic.Hermite(t, Hx[k], Y0[k], Y1[k], D0[k], D1[k]));
                }
            case LinLog:
                {
                    double t = Math.Log(r / R0[k]) / Hx[k];
                    return Scale[k] * MonotoneCubic.Hermite(t, Hx[k], Y0[k], Y1[k], D0[k], D1[k]);
                }
            case Centre:
                return Scale[k] * (Y0[k] + (Y1[k] - Y0[k]) * Math.Pow(r / R1[k], D0[k]));
            case SurfacePower:
                {
                    double u = (R1[k] - r) / (R1[k] - R0[k]);
                    return u <= 0 ? 0 : Scale[k] * Y0[k] * Math.Pow(u, D0[k]);
                }
            default:
                return D0[k] == 0 ? Scale[k] * Y0[k] : Scale[k] * Y0[k] * Math.Pow(r / R1[k], D0[k]);
        }
    }
}
