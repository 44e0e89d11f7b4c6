using Placement.Profiles;

namespace Placement.Relaxation;

/// <summary>
/// One Voronoi face rebuilt in its bisector plane: a convex polygon in plane coordinates (s, t) about the midpoint o
/// between the generator (the origin) and its neighbour p, clipped by half-spaces (Sutherland–Hodgman, one edge pass
/// per half-space). Per-worker scratch of <see cref="VoronoiCellGradients"/>; no allocation once grown.
/// </summary>
internal sealed class FacePolygon
{
    private double[] _s = new double[32], _t = new double[32], _s2 = new double[32], _t2 = new double[32], _w = new double[32];
    private double _ox, _oy, _oz, _ux, _uy, _uz, _vx, _vy, _vz, _half;

    public int Count { get; private set; }

    /// <summary>Starts with the square of half-size <paramref name="half"/> about o = p/2 in the plane normal to p.</summary>
    public void Start(double px, double py, double pz, double half)
    {
        double len = Math.Sqrt(px * px + py * py + pz * pz);
        double nx = px / len, ny = py / len, nz = pz / len;
        _ox = 0.5 * px; _oy = 0.5 * py; _oz = 0.5 * pz;
        // u ⟂ n from the axis least aligned with n; v = n × u.
        double ax = Math.Abs(nx), ay = Math.Abs(ny), az = Math.Abs(nz);
        double ex = 0, ey = 0, ez = 0;
        if (ax <= ay && ax <= az) ex = 1; else if (ay <= az) ey = 1; else ez = 1;
        double ux = ny * ez - nz * ey, uy = nz * ex - nx * ez, uz = nx * ey - ny * ex;
        double ul = Math.Sqrt(ux * ux + uy * uy + uz * uz);
        _ux = ux / ul; _uy = uy / ul; _uz = uz / ul;
        _vx = ny * _uz - nz * _uy; _vy = nz * _ux - nx * _uz; _vz = nx * _uy - ny * _ux;
        _half = half;
        _s[0] = -half; _t[0] = -half;
        _s[1] = half; _t[1] = -half;
        _s[2] = half; _t[2] = half;
        _s[3] = -half; _t[3] = half;
        Count = 4;
    }

    /// <summary>Keeps the part with q·y ≤ c (y relative to the generator).</summary>
    public void Clip(double qx, double qy, double qz, double c)
    {
        if (Count == 0) return;
        double a = qx * _ux + qy * _uy + qz * _uz, b = qx * _vx + qy * _vy + qz * _vz;
        double limit = c - (qx * _ox + qy * _oy + qz * _oz);
        int n = Count;
        if (_s2.Length < 2 * n + 2) Grow(2 * n + 2);
        int m = 0;
        double sp = _s[n - 1], tp = _t[n - 1], fp = a * sp + b * tp - limit;
        bool any = false;
        for (int k = 0; k < n; k++)
        {
            double sq = _s[k], tq = _t[k], fq = a * sq + b * tq - limit;
            if (fq > 0) any = true;
            if ((fp <= 0) != (fq <= 0))
            {
                double r = fp / (fp - fq);
                _s2[m] = sp + r * (sq - sp); _t2[m] = tp + r * (tq - tp); m++;
            }
            if (fq <= 0) { _s2[m] = sq; _t2[m] = tq; m++; }
            sp = sq; tp = tq; fp = fq;
        }
        if (!any) return;
        (_s, _s2) = (_s2, _s);
        (_t, _t2) = (_t2, _t);
        Count = m < 3 ? 0 : m;
    }

    /// <summary>True when a vertex still lies on the starting square (the face may be larger than the square).</summary>
    public bool TouchesStartSquare()
    {
        double edge = _half * (1 - 1e-12);
        for (int k = 0; k < Count; k++) if (Math.Abs(_s[k]) >= edge || Math.Abs(_t[k]) >= edge) return true;
        return false;
    }

    /// <summary>Clips by tangent planes of the ball (centre b relative to the generator, radius R) until every vertex lies within R(1 + δ).</summary>
    public void ClipToBall(double bx, double by, double bz, double radius, double delta)
    {
        double limit2 = radius * radius * (1 + delta) * (1 + delta);
        for (int iteration = 0; iteration < 10_000 && Count > 0; iteration++)
        {
            double best = -1; int worst = -1;
            for (int k = 0; k < Count; k++)
            {
                double dx = _ox + _s[k] * _ux + _t[k] * _vx - bx, dy = _oy + _s[k] * _uy + _t[k] * _vy - by, dz = _oz + _s[k] * _uz + _t[k] * _vz - bz;
                double q = dx * dx + dy * dy + dz * dz;
                if (q > best) { best = q; worst = k; }
            }
            if (best <= limit2) return;
            double len = Math.Sqrt(best);
            double mx = (_ox + _s[worst] * _ux + _t[worst] * _vx - bx) / len, my = (_oy + _s[worst] * _uy + _t[worst] * _vy - by) / len,
                mz = (_oz + _s[worst] * _uz + _t[worst] * _vz - bz) / len;
            // m·(y − b) ≤ R.
            Clip(mx, my, mz, radius + mx * bx + my * by + mz * bz);
        }
    }

    /// <summary>Area and centroid (relative to the generator) of the polygon; zero area when it is empty.</summary>
    public void Measure(out double area, out double cx, out double cy, out double cz)
    {
        area = 0; cx = _ox; cy = _oy; cz = _oz;
        int n = Count;
        if (n < 3) return;
        double s0 = _s[0], t0 = _t[0], a2 = 0, ms = 0, mt = 0;
        for (int k = 1; k < n - 1; k++)
        {
            double s1 = _s[k] - s0, t1 = _t[k] - t0, s2 = _s[k + 1] - s0, t2 = _t[k + 1] - t0;
            double cross = s1 * t2 - s2 * t1;
            a2 += cross;
            ms += cross * (s1 + s2);
            mt += cross * (t1 + t2);
        }
        if (a2 == 0) return;
        double sc = s0 + ms / (3 * a2), tc = t0 + mt / (3 * a2);
        area = 0.5 * Math.Abs(a2);
        cx = _ox + sc * _ux + tc * _vx; cy = _oy + sc * _uy + tc * _vy; cz = _oz + sc * _uz + tc * _vz;
    }

    /// <summary>
    /// Adds ∫w dV and ∫w y dV over the tetrahedra from the generator (weight <paramref name="w0"/>) to a fan of the
    /// polygon, w linear between its vertex values: ∫w = (V/4)Σw_k, ∫w y = (V/20)(Σ w_k y_k + Σw_k Σy_k).
    /// </summary>
    public void WeightedMoments(IRadialProfile profile, double gx, double gy, double gz, double exponent, double w0,
        ref double mass, ref double mx, ref double my, ref double mz)
    {
        int n = Count;
        if (n < 3) return;
        if (_w.Length < n) _w = new double[_s.Length];
        for (int k = 0; k < n; k++)
        {
            double px = _ox + _s[k] * _ux + _t[k] * _vx, py = _oy + _s[k] * _uy + _t[k] * _vy, pz = _oz + _s[k] * _uz + _t[k] * _vz;
            _w[k] = VoronoiCellGradients.Weight(profile, Math.Sqrt((gx + px) * (gx + px) + (gy + py) * (gy + py) + (gz + pz) * (gz + pz)), exponent);
        }
        double ax = _ox + _s[0] * _ux + _t[0] * _vx, ay = _oy + _s[0] * _uy + _t[0] * _vy, az = _oz + _s[0] * _uz + _t[0] * _vz, wa = _w[0];
        for (int k = 1; k < n - 1; k++)
        {
            double bx = _ox + _s[k] * _ux + _t[k] * _vx, by = _oy + _s[k] * _uy + _t[k] * _vy, bz = _oz + _s[k] * _uz + _t[k] * _vz;
            double cx = _ox + _s[k + 1] * _ux + _t[k + 1] * _vx, cy = _oy + _s[k + 1] * _uy + _t[k + 1] * _vy, cz = _oz + _s[k + 1] * _uz + _t[k + 1] * _vz;
            double v = Math.Abs(ax * (by * cz - bz * cy) + ay * (bz * cx - bx * cz) + az * (bx * cy - by * cx)) / 6;
            double wb = _w[k], wc = _w[k + 1], sw = w0 + wa + wb + wc;
            mass += v * sw / 4;
            double k20 = v / 20;
            mx += k20 * (wa * ax + wb * bx + wc * cx + sw * (ax + bx + cx));
            my += k20 * (wa * ay + wb * by + wc * cy + sw * (ay + by + cy));
            mz += k20 * (wa * az + wb * bz + wc * cz + sw * (az + bz + cz));
        }
    }

    private void Grow(int min)
    {
        int n = Math.Max(min, 2 * _s.Length);
        Array.Resize(ref _s, n); Array.Resize(ref _t, n); _s2 = new double[n]; _t2 = new double[n]; _w = new double[n];
    }
}
