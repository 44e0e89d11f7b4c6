using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using Placement.Spatial;

namespace Placement.Tessellation;

/// <summary>
/// A convex polyhedron around a generator at the origin, kept as the dual triangulation of its faces and clipped
/// plane by plane: the per-thread workhorse of <see cref="VoronoiTessellation"/>.
/// </summary>
/// <remarks>
/// <para>Method: Ray, Sokolov, Lefebvre &amp; Lévy 2018, "Meshless Voronoi on the GPU", ACM TOG 37(6) — a cell is a
/// list of planes n·x ≤ d and a list of triangles (a, b, c) of plane indices, one per cell vertex (the point where
/// the three planes meet), oriented counter-clockwise seen from outside. Clipping by a new plane removes the
/// triangles whose vertex lies beyond it, finds the boundary cycle of the removed patch (edges not shared by two
/// removed triangles) and fans new triangles (x, y, new) over it. Nothing else is stored: no adjacency to rebuild.</para>
/// <para>Robustness: a vertex is removed only if it lies beyond the plane by more than <c>Tolerance</c> (a length,
/// relative to the cell size), so planes through existing vertices (co-spherical neighbours, lattices) leave the
/// cell unchanged and add no face. If rounding ever makes the removed patch not a disc, the clip is retried with
/// tolerances 64× larger each time, from the fifth try relative to the cell's farthest vertex (1e-10 R_max and up, never
/// beyond 1e-6 R_max) rather than to the neighbour spacing; if all tries fail, the cell is rebuilt from its box with the
/// failing plane first (see <c>Restart</c>; at most 16 rebuilds per cell), and only if that fails too an exception names
/// the generator. A new vertex must lie on its three planes and within the cell's farthest vertex (it lies on an edge of
/// the cell being cut); where the three planes are nearly dependent (relative determinant below 1e-6: the bisectors of a
/// ring of shell points, or of a compact cluster seen from far away) it is computed in double-double arithmetic.</para>
/// <para>Memory: capacity grows on demand; a typical cell (16 planes, 28 vertices) touches about 3 KB, held once per
/// thread. Coordinates are relative to the generator, which keeps rounding relative to the cell size.</para>
/// </remarks>
internal sealed class ConvexCell
{
    private double[] _nx = new double[64], _ny = new double[64], _nz = new double[64], _d = new double[64], _n2 = new double[64];
    private int[] _neighbour = new int[64];
    private int _planeCount;

    private int[] _ta = new int[128], _tb = new int[128], _tc = new int[128];
    private double[] _vx = new double[128], _vy = new double[128], _vz = new double[128], _vr2 = new double[128];
    private int _triCount;

    private ulong[] _removed = new ulong[2];
    private int[] _edgeKey = new int[384];
    private readonly ulong[] _outMask = new ulong[64], _inMask = new ulong[64];
    private int[] _next = new int[64], _nextStamp = new int[64];
    private int _stamp;

    // First of the cell-extent-relative tolerances (see Clip), as a fraction of the farthest vertex distance.
    private const double FarTolerance = 1e-10;

    // Largest clip tolerance, as a fraction of the farthest vertex distance.
    private const double MaxTolerance = 1e-6;

    public int PlaneCount => _planeCount;

    public int TriangleCount => _triCount;

    /// <summary>Largest squared distance from the generator to a vertex.</summary>
    public double MaxRadiusSquared { get; private set; }

    /// <summary>Absolute tolerance (length units) below which a vertex counts as on a plane.</summary>
    public double Tolerance { get; set; }

    public ReadOnlySpan<double> Nx => _nx.AsSpan(0, _planeCount);
    public ReadOnlySpan<double> Ny => _ny.AsSpan(0, _planeCount);
    public ReadOnlySpan<double> Nz => _nz.AsSpan(0, _planeCount);
    public ReadOnlySpan<double> D => _d.AsSpan(0, _planeCount);
    public ReadOnlySpan<int> Neighbour => _neighbour.AsSpan(0, _planeCount);
    public ReadOnlySpan<int> Ta => _ta.AsSpan(0, _triCount);
    public ReadOnlySpan<int> Tb => _tb.AsSpan(0, _triCount);
    public ReadOnlySpan<int> Tc => _tc.AsSpan(0, _triCount);
    public ReadOnlySpan<double> Vx => _vx.AsSpan(0, _triCount);
    public ReadOnlySpan<double> Vy => _vy.AsSpan(0, _triCount);
    public ReadOnlySpan<double> Vz => _vz.AsSpan(0, _triCount);
    public ReadOnlySpan<double> VertexRadiusSquared => _vr2.AsSpan(0, _triCount);

    /// <summary>
    /// Resets to the box [lo, hi] (relative to the generator; lo &lt; 0 &lt; hi not required but lo &lt; hi), with
    /// face neighbour codes for −x, +x, −y, +y, −z, +z.
    /// </summary>
    public void InitBox(double lox, double loy, double loz, double hix, double hiy, double hiz, ReadOnlySpan<int> codes)
    {
        if (_restarts == 0) _restartsUsed = 0;
        _box[0] = lox; _box[1] = loy; _box[2] = loz; _box[3] = hix; _box[4] = hiy; _box[5] = hiz;
        codes[..6].CopyTo(_boxCodes);
        _planeCount = 0;
        AddPlane(-1, 0, 0, -lox, codes[0]);
        AddPlane(1, 0, 0, hix, codes[1]);
        AddPlane(0, -1, 0, -loy, codes[2]);
        AddPlane(0, 1, 0, hiy, codes[3]);
        AddPlane(0, 0, -1, -loz, codes[4]);
        AddPlane(0, 0, 1, hiz, codes[5]);
        // The eight corners, straight-line (a loop choosing each corner's planes and coordinates cost mispredicted branches
        // on every cell): corner (sx, sy, sz) meets planes sx, 2 + sy, 4 + sz, ordered so that (n_a × n_b)·n_c > 0 seen from
        // outside (the normals' signs multiply; a negative product swaps a and b).
        SetCorner(0, 2, 0, 4, lox, loy, loz);
        SetCorner(1, 1, 2, 4, hix, loy, loz);
        SetCorner(2, 0, 3, 4, lox, hiy, loz);
        SetCorner(3, 3, 1, 4, hix, hiy, loz);
        SetCorner(4, 0, 2, 5, lox, loy, hiz);
        SetCorner(5, 2, 1, 5, hix, loy, hiz);
        SetCorner(6, 3, 0, 5, lox, hiy, hiz);
        SetCorner(7, 1, 3, 5, hix, hiy, hiz);
        _triCount = 8;
        double mx = Math.Max(lox * lox, hix * hix), my = Math.Max(loy * loy, hiy * hiy), mz = Math.Max(loz * loz, hiz * hiz);
        double max = mx + my + mz;
        MaxRadiusSquared = max;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void SetCorner(int t, int a, int b, int c, double x, double y, double z)
    {
        _ta[t] = a; _tb[t] = b; _tc[t] = c;
        _vx[t] = x; _vy[t] = y; _vz[t] = z; _vr2[t] = x * x + y * y + z * z;
    }

    private int AddPlane(double nx, double ny, double nz, double d, int neighbour)
    {
        if (_planeCount == _nx.Length) GrowPlanes();
        if (_planeCount >= short.MaxValue) throw new InvalidOperationException("A cell exceeded 32767 planes (edge keys pack plane indices in 16 bits).");
        int p = _planeCount++;
        _nx[p] = nx; _ny[p] = ny; _nz[p] = nz; _d[p] = d; _n2[p] = nx * nx + ny * ny + nz * nz; _neighbour[p] = neighbour;
        return p;
    }

    /// <summary>
    /// Clips by the half-space n·x ≤ d. Returns true when the plane cut the cell (and became a face).
    /// </summary>
    /// <exception cref="InvalidOperationException">Rounding made the clip inconsistent even with a larger tolerance.</exception>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool Clip(double nx, double ny, double nz, double d, int neighbour)
    {
        double norm = Math.Sqrt(nx * nx + ny * ny + nz * nz);
        double eps = Tolerance * norm;
        // Quick rejection: no vertex can lie beyond a plane farther than the farthest vertex.
        double reach = d - eps;
        if (reach > 0 && reach * reach > MaxRadiusSquared * norm * norm) return false;
        return ClipFrom(nx, ny, nz, d, neighbour, norm, eps);
    }

    /// <summary>
    /// <see cref="Clip"/> for a plane the caller already found within reach of the farthest vertex (a bisector whose
    /// generator lies within twice that distance): no quick rejection, so the square root of the normal's length is not
    /// waited on before the vertices are classified. The caller passes that length, <paramref name="norm"/> = |n| (a
    /// bisector's normal is the neighbour's offset, whose squared length the gather already holds).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool ClipNear(double nx, double ny, double nz, double d, int neighbour, double norm)
    {
        return ClipFrom(nx, ny, nz, d, neighbour, norm, Tolerance * norm);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private bool ClipFrom(double nx, double ny, double nz, double d, int neighbour, double norm, double eps)
    {
        for (int attempt = 0; attempt < 8; attempt++)
        {
            int r = Classify(nx, ny, nz, d + eps);
            if (r == 0) return false;
            if (r == _triCount)
                throw new InvalidOperationException("A clipping plane removed the whole cell; the generator lies outside its own half-space.");
            if (TryRebuild(nx, ny, nz, d, neighbour, eps / norm)) return true;
            // After four tries relative to the neighbour spacing, tolerances relative to the cell's own extent: a vertex
            // where several nearly dependent planes meet (the bisectors of points on one sphere all pass through its
            // centre, so an unfinished cell of a shell point has a many-plane apex there) is rounded by about
            // 1e-16 R_max / det, far beyond the spacing-relative tolerance when the cell still reaches the domain box.
            // Never beyond MaxTolerance of the cell's extent: a tolerance near the cut's own depth would keep every vertex
            // and report no cut where the plane does cut.
            double cap = MaxTolerance * Math.Sqrt(MaxRadiusSquared) * norm;
            if (eps >= cap) break;
            eps = Math.Min(cap, attempt == 3 ? Math.Max(eps * 64, FarTolerance * Math.Sqrt(MaxRadiusSquared) * norm) : eps * 64);
        }
        return Restart(nx, ny, nz, d, neighbour);
    }

    // The box of the last InitBox (lo x, y, z, hi x, y, z) and its face codes, for Restart.
    private readonly double[] _box = new double[6];
    private readonly int[] _boxCodes = new int[6];
    private int _restarts;

    // Restarts allowed per cell (nested: a replay that fails restarts again with that plane first as well).
    private const int MaxRestarts = 8;

    // Restarts allowed per cell in all (each replays every stored plane; a cell that keeps failing would otherwise take
    // time exponential in the nesting), and how many this cell used (reset by InitBox outside a restart).
    private const int MaxRestartsPerCell = 16;
    private int _restartsUsed;

    /// <summary>
    /// Last resort when a clip stays inconsistent: the cell is the intersection of the box and every plane stored so far
    /// (a plane that did not cut never can later), whatever the order, so it is rebuilt from the box with the failing
    /// plane first and the stored ones after it. The usual failure is a many-plane degenerate vertex — the bisectors of
    /// points on one sphere all pass through its centre, so a shell point clipped first by its own shell's neighbours
    /// grows a cone whose apex at the body centre is met by dozens of planes — and the failing plane is then the one
    /// that cuts that apex away; clipped first, the apex never forms.
    /// </summary>
    private bool Restart(double nx, double ny, double nz, double d, int neighbour)
    {
        if (_restarts >= MaxRestarts || _restartsUsed >= MaxRestartsPerCell)
            throw new InvalidOperationException("Voronoi cell clipping stayed inconsistent after enlarging the tolerance and reordering the planes (degenerate input beyond double precision).");
        int stored = _planeCount - 6;
        // A snapshot per restart (rare), so a nested restart cannot overwrite the planes this one still replays.
        var planes = new double[4 * stored];
        var neighbours = new int[stored];
        for (int p = 0; p < stored; p++)
        {
            planes[4 * p] = _nx[p + 6]; planes[4 * p + 1] = _ny[p + 6]; planes[4 * p + 2] = _nz[p + 6]; planes[4 * p + 3] = _d[p + 6];
            neighbours[p] = _neighbour[p + 6];
        }
        _restarts++;
        _restartsUsed++;
        try
        {
            InitBox(_box[0], _box[1], _box[2], _box[3], _box[4], _box[5], _boxCodes);
            Clip(nx, ny, nz, d, neighbour);
            for (int p = 0; p < stored; p++) Clip(planes[4 * p], planes[4 * p + 1], planes[4 * p + 2], planes[4 * p + 3], neighbours[p]);
        }
        finally
        {
            _restarts--;
        }
        for (int p = 0; p < _planeCount; p++)
            if (_neighbour[p] == neighbour && _nx[p] == nx && _ny[p] == ny && _nz[p] == nz && _d[p] == d) return true;
        return false;
    }

    // Marks vertices with n·v > limit in the bit words _removed and returns how many; eight (AVX-512) or four (AVX2)
    // vertices per step, as SimdLanes.Doubles says. Also notes whether a removed vertex is a farthest one
    // (_farthestRemoved), so the rebuild knows the maximum radius must be found again among the kept vertices.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private int Classify(double nx, double ny, double nz, double limit)
    {
        int removed = 0, t = 0, count = _triCount;
        var rm = _removed;
        // Clear every word: triangles appended by the rebuild may land in words beyond the current count.
        for (int w = 0; w < rm.Length; w++) rm[w] = 0;
        bool farthest = false;
        int lanes = SimdLanes.Doubles;
        if (lanes == 8 && Vector512.IsHardwareAccelerated)
        {
            var vnx = Vector512.Create(nx); var vny = Vector512.Create(ny); var vnz = Vector512.Create(nz); var vl = Vector512.Create(limit);
            var vmax = Vector512.Create(MaxRadiusSquared);
            ref double px = ref MemoryMarshal.GetArrayDataReference(_vx);
            ref double py = ref MemoryMarshal.GetArrayDataReference(_vy);
            ref double pz = ref MemoryMarshal.GetArrayDataReference(_vz);
            ref double pr = ref MemoryMarshal.GetArrayDataReference(_vr2);
            // As below, eight vertices per step (capacities are multiples of eight).
            ulong word = 0;
            ulong farBits = 0;
            for (; t < count; t += 8)
            {
                var dot = vnx * Vector512.LoadUnsafe(ref px, (nuint)t) + vny * Vector512.LoadUnsafe(ref py, (nuint)t) + vnz * Vector512.LoadUnsafe(ref pz, (nuint)t);
                ulong bits = Vector512.GreaterThan(dot, vl).ExtractMostSignificantBits();
                int left = count - t;
                bits &= left >= 8 ? 0xFFUL : (1UL << left) - 1;
                word |= bits << (t & 63);
                removed += BitOperations.PopCount(bits);
                farBits |= Vector512.GreaterThanOrEqual(Vector512.LoadUnsafe(ref pr, (nuint)t), vmax).ExtractMostSignificantBits() & bits;
                if ((t & 63) == 56)
                {
                    rm[t >> 6] = word;
                    word = 0;
                }
            }
            if ((t & 63) != 0) rm[(t - 1) >> 6] = word;
            farthest = farBits != 0;
        }
        else if (lanes >= 4 && Vector256.IsHardwareAccelerated)
        {
            var vnx = Vector256.Create(nx); var vny = Vector256.Create(ny); var vnz = Vector256.Create(nz); var vl = Vector256.Create(limit);
            var vmax = Vector256.Create(MaxRadiusSquared);
            ref double px = ref MemoryMarshal.GetArrayDataReference(_vx);
            ref double py = ref MemoryMarshal.GetArrayDataReference(_vy);
            ref double pz = ref MemoryMarshal.GetArrayDataReference(_vz);
            ref double pr = ref MemoryMarshal.GetArrayDataReference(_vr2);
            // Capacities are multiples of four (doubling from 128), so the last group reads whole vectors; lanes past
            // the count hold stale values and are masked off. No branch on the outcome: most groups remove nothing but
            // some do, and a branch on it was mispredicted about once per plane. Bits gather in a local word, stored
            // once per 64 vertices.
            ulong word = 0;
            uint farBits = 0;
            for (; t < count; t += 4)
            {
                var dot = vnx * Vector256.LoadUnsafe(ref px, (nuint)t) + vny * Vector256.LoadUnsafe(ref py, (nuint)t) + vnz * Vector256.LoadUnsafe(ref pz, (nuint)t);
                uint bits = Vector256.GreaterThan(dot, vl).ExtractMostSignificantBits();
                int left = count - t;
                bits &= left >= 4 ? 0xFu : (1u << left) - 1;
                word |= (ulong)bits << (t & 63);
                removed += BitOperations.PopCount(bits);
                farBits |= Vector256.GreaterThanOrEqual(Vector256.LoadUnsafe(ref pr, (nuint)t), vmax).ExtractMostSignificantBits() & bits;
                if ((t & 63) == 60)
                {
                    rm[t >> 6] = word;
                    word = 0;
                }
            }
            if ((t & 63) != 0) rm[(t - 1) >> 6] = word;
            farthest = farBits != 0;
        }
        else
        {
            var vx = _vx; var vy = _vy; var vz = _vz; var vr2 = _vr2;
            double max = MaxRadiusSquared;
            for (; t < count; t++)
            {
                if (nx * vx[t] + ny * vy[t] + nz * vz[t] > limit)
                {
                    rm[t >> 6] |= 1UL << (t & 63);
                    removed++;
                    if (vr2[t] >= max) farthest = true;
                }
            }
        }
        _farthestRemoved = farthest;
        return removed;
    }

    private bool _farthestRemoved;

    // First removed slot at or after word `word` (advanced past empty words), or −1.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private int NextRemoved(ref int word)
    {
        var rm = _removed;
        int words = (_triCount + 63) >> 6;
        for (; word < words; word++)
        {
            ulong bits = rm[word];
            if (bits != 0) return (word << 6) + BitOperations.TrailingZeroCount(bits);
        }
        return -1;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private bool IsRemoved(int t) => (_removed[t >> 6] & (1UL << (t & 63))) != 0;

    // The new vertices of a clip, in cycle order, computed once while the cycle is checked.
    private double[] _newX = new double[64], _newY = new double[64], _newZ = new double[64], _newR2 = new double[64];

    // How far, in units of the clip's tolerance, a new vertex may lie beyond the cell's farthest vertex (a kept vertex
    // may lie that far beyond the plane, so the edge it ends may be cut just past its end).
    private const double OvershootTolerances = 64;

    private void GrowNewVertices(int min)
    {
        int n = Math.Max(min, 2 * _newX.Length);
        _newX = new double[n]; _newY = new double[n]; _newZ = new double[n]; _newR2 = new double[n];
    }

    private bool TryRebuild(double nx, double ny, double nz, double d, int neighbour, double slack)
    {
        if (_next.Length < _planeCount + 1) GrowScratchPlanes(_planeCount + 1);
        int stamp = ++_stamp;
        int boundary = 0, first = -1;
        bool ok = _planeCount <= 64 ? BoundaryByMasks(stamp, ref boundary, ref first) : BoundaryByEdges(stamp, ref boundary, ref first);
        if (!ok || boundary < 3) return false;
        // Walk the cycle once to check it is a single loop through every boundary edge, and that every new vertex is
        // defined: planes x, next[x] and the new one must meet in one point that lies on all three. At a degenerate edge
        // they may not: a zero determinant makes the vertex NaN, and nearly dependent planes (the bisectors of points on
        // one circle — a ring of a shell — all contain its axis, so three of them share a line) give a finite point far
        // off its planes that would silently cut the cell short. Such a clip is refused like a broken cycle and retried.
        // Every new vertex also lies on an edge of the cell being cut, so within its farthest vertex: one beyond it (by more
        // than the clip's tolerance allows a kept vertex to overshoot) comes from an edge nearly parallel to the new plane
        // whose end counted as kept within tolerance — the bisectors of a compact cluster seen from far away are nearly
        // parallel — and would make the cell non-convex. Refused like a broken cycle.
        double n2 = nx * nx + ny * ny + nz * nz;
        // reach² is at least this (no square root): most new vertices are checked against it alone.
        double surely2 = MaxRadiusSquared * ((1 + 1e-9) * (1 + 1e-9));
        if (_newX.Length < boundary) GrowNewVertices(boundary);
        int steps = 0, x = first;
        // Hot loop: arrays read through references (every index is a plane of this cell, below the scratch capacity
        // ensured above), so the JIT neither re-reads the fields after each store nor checks bounds.
        ref int next = ref MemoryMarshal.GetArrayDataReference(_next);
        ref int nextStamp = ref MemoryMarshal.GetArrayDataReference(_nextStamp);
        ref double pnx = ref MemoryMarshal.GetArrayDataReference(_nx);
        ref double pny = ref MemoryMarshal.GetArrayDataReference(_ny);
        ref double pnz = ref MemoryMarshal.GetArrayDataReference(_nz);
        ref double pd = ref MemoryMarshal.GetArrayDataReference(_d);
        ref double pn2 = ref MemoryMarshal.GetArrayDataReference(_n2);
        ref double newX = ref MemoryMarshal.GetArrayDataReference(_newX);
        ref double newY = ref MemoryMarshal.GetArrayDataReference(_newY);
        ref double newZ = ref MemoryMarshal.GetArrayDataReference(_newZ);
        ref double newR2 = ref MemoryMarshal.GetArrayDataReference(_newR2);
        // Cramer's rule for planes x, y = next[x] and the new one c: v = (d_x (n_y × n_c) + d_y (n_c × n_x) + d_c (n_x × n_y)) /
        // (n_x · (n_y × n_c)), written out (a method with out parameters kept the vertex in memory). Along the cycle
        // n_c × n_x of the next step is −(n_y × n_c) of this one, exactly (the same products, negated).
        double cax, cay, caz;
        {
            double fx = Unsafe.Add(ref pnx, x), fy = Unsafe.Add(ref pny, x), fz = Unsafe.Add(ref pnz, x);
            cax = ny * fz - nz * fy; cay = nz * fx - nx * fz; caz = nx * fy - ny * fx;
        }
        do
        {
            if (Unsafe.Add(ref nextStamp, x) != stamp || steps == boundary) return false;
            int y = Unsafe.Add(ref next, x);
            double xnx = Unsafe.Add(ref pnx, x), xny = Unsafe.Add(ref pny, x), xnz = Unsafe.Add(ref pnz, x), xd = Unsafe.Add(ref pd, x);
            double ynx = Unsafe.Add(ref pnx, y), yny = Unsafe.Add(ref pny, y), ynz = Unsafe.Add(ref pnz, y), yd = Unsafe.Add(ref pd, y);
            double bcx = yny * nz - ynz * ny, bcy = ynz * nx - ynx * nz, bcz = ynx * ny - yny * nx;
            double abx = xny * ynz - xnz * yny, aby = xnz * ynx - xnx * ynz, abz = xnx * yny - xny * ynx;
            double det = xnx * bcx + xny * bcy + xnz * bcz, inv = 1.0 / det;
            double vx = (xd * bcx + yd * cax + d * abx) * inv;
            double vy = (xd * bcy + yd * cay + d * aby) * inv;
            double vz = (xd * bcz + yd * caz + d * abz) * inv;
            cax = -bcx; cay = -bcy; caz = -bcz;
            // A zero determinant gives a vertex that is not finite, refused below (both distance tests are false for NaN and ∞).
            if (det * det < IllConditioned * Unsafe.Add(ref pn2, x) * Unsafe.Add(ref pn2, y) * n2)
            {
                // Nearly dependent planes: Cramer's rule in double-double arithmetic, so the vertex is accurate to rounding
                // for any determinant the doubles can resolve (in double it is off by about 1e-16 |v| / relative det).
                if (!(det != 0)) return false;
                // Through separate locals: passing vx, vy, vz by reference would keep them in memory on the common path.
                MeetExtended(xnx, xny, xnz, xd, ynx, yny, ynz, yd, nx, ny, nz, d, out double ex, out double ey, out double ez);
                if (!VertexOnPlanes(x, y, nx, ny, nz, d, ex, ey, ez)) return false;
                vx = ex; vy = ey; vz = ez;
            }
            double q2 = vx * vx + vy * vy + vz * vz;
            if (!(q2 <= surely2))
            {
                double reach = Math.Sqrt(MaxRadiusSquared) * (1 + 1e-9) + OvershootTolerances * slack;
                if (!(q2 <= reach * reach)) return false;
            }
            Unsafe.Add(ref newX, steps) = vx; Unsafe.Add(ref newY, steps) = vy; Unsafe.Add(ref newZ, steps) = vz; Unsafe.Add(ref newR2, steps) = q2;
            x = y;
            steps++;
        } while (x != first && steps <= boundary);
        if (steps != boundary || x != first) return false;

        int p = AddPlane(nx, ny, nz, d, neighbour);
        // The farthest vertex survives unless it is among the removed ones; then the new maximum is the old one or
        // a new vertex, and the full rescan below is skipped.
        double oldMax = MaxRadiusSquared, newMax = 0;
        bool farthestRemoved = _farthestRemoved;
        // Otherwise the largest kept vertex, found before the new vertices are written over removed slots (a vector read of
        // values just stored one by one would wait for the stores).
        if (farthestRemoved) oldMax = KeptVertexRadiusSquared();
        // Fill removed slots with the new triangles (x, next[x], p), append the rest (capacity ensured first, so the
        // references below stay valid).
        while (_triCount + boundary > _ta.Length) GrowTriangles();
        ref int ta = ref MemoryMarshal.GetArrayDataReference(_ta);
        ref int tb = ref MemoryMarshal.GetArrayDataReference(_tb);
        ref int tc = ref MemoryMarshal.GetArrayDataReference(_tc);
        ref double pvx = ref MemoryMarshal.GetArrayDataReference(_vx);
        ref double pvy = ref MemoryMarshal.GetArrayDataReference(_vy);
        ref double pvz = ref MemoryMarshal.GetArrayDataReference(_vz);
        ref double pvr2 = ref MemoryMarshal.GetArrayDataReference(_vr2);
        int slot = 0; // word cursor into _removed
        x = first;
        for (int k = 0; k < boundary; k++)
        {
            int y = Unsafe.Add(ref next, x);
            int t = NextRemoved(ref slot);
            if (t >= 0) _removed[t >> 6] &= ~(1UL << (t & 63));
            else t = _triCount++;
            Unsafe.Add(ref ta, t) = x; Unsafe.Add(ref tb, t) = y; Unsafe.Add(ref tc, t) = p;
            double r2 = Unsafe.Add(ref newR2, k);
            Unsafe.Add(ref pvx, t) = Unsafe.Add(ref newX, k); Unsafe.Add(ref pvy, t) = Unsafe.Add(ref newY, k); Unsafe.Add(ref pvz, t) = Unsafe.Add(ref newZ, k);
            Unsafe.Add(ref pvr2, t) = r2;
            newMax = Math.Max(newMax, r2);
            x = y;
        }
        // Remaining removed slots (the patch had interior vertices): compact, keeping order.
        if (NextRemoved(ref slot) >= 0)
        {
            int write = 0;
            for (int t = 0; t < _triCount; t++)
            {
                if (IsRemoved(t)) continue;
                if (write != t) MoveTriangle(t, write);
                write++;
            }
            _triCount = write;
        }
        MaxRadiusSquared = Math.Max(oldMax, newMax);
        return true;
    }

    // The largest _vr2 of the vertices Classify kept (all finite and non-negative: the rebuild refuses any other vertex),
    // eight at a time where the hardware has 512-bit vectors. Half the cuts remove the farthest vertex.
    private double KeptVertexRadiusSquared()
    {
        int count = _triCount;
        var removed = _removed;
        ref double pr = ref MemoryMarshal.GetArrayDataReference(_vr2);
        if (SimdLanes.Doubles != 8 || !Vector512.IsHardwareAccelerated)
        {
            double best = 0;
            for (int k = 0; k < count; k++)
                if ((removed[k >> 6] & (1UL << (k & 63))) == 0) best = Math.Max(best, Unsafe.Add(ref pr, k));
            return best;
        }
        var lanes = Vector512.Create(1L, 2, 4, 8, 16, 32, 64, 128);
        var max = Vector512<double>.Zero;
        for (int t = 0; t < count; t += 8)
        {
            // Lanes kept and below the count (capacities are multiples of eight: the last group reads a whole vector).
            long keep = (long)(~(removed[t >> 6] >> (t & 63)) & 0xFF);
            int left = count - t;
            if (left < 8) keep &= (1L << left) - 1;
            var mask = Vector512.Equals(Vector512.Create(keep) & lanes, lanes).AsDouble();
            max = Vector512.MaxNative(max, Vector512.ConditionalSelect(mask, Vector512.LoadUnsafe(ref pr, (nuint)t), Vector512<double>.Zero));
        }
        var half = Vector256.MaxNative(max.GetLower(), max.GetUpper());
        var quarter = Vector128.MaxNative(half.GetLower(), half.GetUpper());
        return Math.Max(quarter.GetElement(0), quarter.GetElement(1));
    }

    // Boundary of the removed patch when every plane index fits a 64-bit mask: for each plane x, the removed
    // triangles (x, q, r) give out-edges x→q and in-edges r→x; the boundary edge leaving x is the out-edge whose
    // target is not also an in-edge source. O(removed triangles).
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private bool BoundaryByMasks(int stamp, ref int boundary, ref int first)
    {
        // Plane indices are below 64 here (the masks' width), within every array read below.
        ref ulong outMask = ref MemoryMarshal.GetArrayDataReference(_outMask);
        ref ulong inMask = ref MemoryMarshal.GetArrayDataReference(_inMask);
        ref int ta = ref MemoryMarshal.GetArrayDataReference(_ta);
        ref int tb = ref MemoryMarshal.GetArrayDataReference(_tb);
        ref int tc = ref MemoryMarshal.GetArrayDataReference(_tc);
        var removed = _removed;
        ulong touched = 0;
        int words = (_triCount + 63) >> 6;
        for (int w = 0; w < words; w++)
        for (ulong bits = removed[w]; bits != 0; bits &= bits - 1)
        {
            int t = (w << 6) + BitOperations.TrailingZeroCount(bits);
            int a = Unsafe.Add(ref ta, t), b = Unsafe.Add(ref tb, t), c = Unsafe.Add(ref tc, t);
            ulong ma = 1UL << a, mb = 1UL << b, mc = 1UL << c;
            Unsafe.Add(ref outMask, a) |= mb; Unsafe.Add(ref inMask, a) |= mc;
            Unsafe.Add(ref outMask, b) |= mc; Unsafe.Add(ref inMask, b) |= ma;
            Unsafe.Add(ref outMask, c) |= ma; Unsafe.Add(ref inMask, c) |= mb;
            touched |= ma | mb | mc;
        }
        ref int next = ref MemoryMarshal.GetArrayDataReference(_next);
        ref int nextStamp = ref MemoryMarshal.GetArrayDataReference(_nextStamp);
        bool ok = true;
        while (touched != 0)
        {
            int x = BitOperations.TrailingZeroCount(touched);
            touched &= touched - 1;
            ulong leaving = Unsafe.Add(ref outMask, x) & ~Unsafe.Add(ref inMask, x);
            Unsafe.Add(ref outMask, x) = 0; Unsafe.Add(ref inMask, x) = 0;
            if (leaving == 0) continue;
            if ((leaving & (leaving - 1)) != 0) { ok = false; continue; } // two boundary edges leave x: not a disc
            Unsafe.Add(ref nextStamp, x) = stamp;
            Unsafe.Add(ref next, x) = BitOperations.TrailingZeroCount(leaving);
            boundary++;
            first = x;
        }
        return ok;
    }

    // General boundary search for cells with more than 64 planes: edges packed (from << 16 | to), a boundary edge
    // is one whose reverse is not an edge of another removed triangle. O(edges²) but vectorised.
    private bool BoundaryByEdges(int stamp, ref int boundary, ref int first)
    {
        int e = 0;
        for (int t = 0; t < _triCount; t++)
        {
            if (!IsRemoved(t)) continue;
            if (e + 3 > _edgeKey.Length) Array.Resize(ref _edgeKey, _edgeKey.Length * 2);
            int a = _ta[t], b = _tb[t], c = _tc[t];
            _edgeKey[e++] = (a << 16) | b;
            _edgeKey[e++] = (b << 16) | c;
            _edgeKey[e++] = (c << 16) | a;
        }
        var keys = _edgeKey.AsSpan(0, e);
        for (int i = 0; i < e; i++)
        {
            int key = keys[i];
            int from = key >> 16, to = key & 0xFFFF;
            if (keys.Contains((to << 16) | from)) continue;
            if (_nextStamp[from] == stamp) return false;
            _nextStamp[from] = stamp;
            _next[from] = to;
            boundary++;
            first = from;
        }
        return true;
    }

    private void MoveTriangle(int from, int to)
    {
        _ta[to] = _ta[from]; _tb[to] = _tb[from]; _tc[to] = _tc[from];
        _vx[to] = _vx[from]; _vy[to] = _vy[from]; _vz[to] = _vz[from]; _vr2[to] = _vr2[from];
    }

    // Squared relative determinant |n_a·(n_b × n_c)|² / (|n_a|²|n_b|²|n_c|²) below which a new vertex is computed in
    // double-double and checked against its planes: above it rounding in double moves the vertex by at most ~1e-10 of the
    // lengths involved.
    private const double IllConditioned = 1e-12;

    // Relative residual beyond which a computed vertex counts as off its planes: a sound vertex is off by ~1e-16 of the
    // lengths involved.
    private const double VertexResidual = 1e-9;

    // Whether the point v computed for stored planes a, b and the new plane (n, d) lies on all three: residuals n·v − d
    // within VertexResidual (|v| + |d|/|n|) + Tolerance as lengths (squared, with (x + y + z)² ≤ 3(x² + y² + z²), so no
    // root is taken).
    private bool VertexOnPlanes(int a, int b, double cx, double cy, double cz, double dc, double vx, double vy, double vz)
    {
        double ax = _nx[a], ay = _ny[a], az = _nz[a], bx = _nx[b], by = _ny[b], bz = _nz[b], da = _d[a], db = _d[b];
        double e2 = VertexResidual * VertexResidual, base2 = e2 * (vx * vx + vy * vy + vz * vz) + Tolerance * Tolerance;
        double ra = ax * vx + ay * vy + az * vz - da, rb = bx * vx + by * vy + bz * vz - db, rc = cx * vx + cy * vy + cz * vz - dc;
        return ra * ra <= 3 * (_n2[a] * base2 + e2 * da * da)
            && rb * rb <= 3 * (_n2[b] * base2 + e2 * db * db)
            && rc * rc <= 3 * ((cx * cx + cy * cy + cz * cz) * base2 + e2 * dc * dc);
    }

    // The point where planes n_a·x = d_a, n_b·x = d_b and n_c·x = d_c meet, x = (d_a (n_b × n_c) + d_b (n_c × n_a) +
    // d_c (n_a × n_b)) / (n_a · (n_b × n_c)), in double-double arithmetic (each value an unevaluated sum hi + lo; products
    // split exactly with a fused multiply-add, sums with Knuth's two-sum): the cross products and the determinant carry
    // about 106 bits, and each coordinate is rounded to double once at the end.
    private static void MeetExtended(double ax, double ay, double az, double da, double bx, double by, double bz, double db,
        double cx, double cy, double cz, double dc, out double vx, out double vy, out double vz)
    {
        var bcx = Diff(by, cz, bz, cy); var bcy = Diff(bz, cx, bx, cz); var bcz = Diff(bx, cy, by, cx);
        var cax = Diff(cy, az, cz, ay); var cay = Diff(cz, ax, cx, az); var caz = Diff(cx, ay, cy, ax);
        var abx = Diff(ay, bz, az, by); var aby = Diff(az, bx, ax, bz); var abz = Diff(ax, by, ay, bx);
        var det = Add(Add(Scale(ax, bcx), Scale(ay, bcy)), Scale(az, bcz));
        vx = Divide(Add(Add(Scale(da, bcx), Scale(db, cax)), Scale(dc, abx)), det);
        vy = Divide(Add(Add(Scale(da, bcy), Scale(db, cay)), Scale(dc, aby)), det);
        vz = Divide(Add(Add(Scale(da, bcz), Scale(db, caz)), Scale(dc, abz)), det);
    }

    // p q − r s exactly enough: both products split into hi + lo.
    private static (double Hi, double Lo) Diff(double p, double q, double r, double s)
    {
        double a = p * q, ae = Math.FusedMultiplyAdd(p, q, -a);
        double b = r * s, be = Math.FusedMultiplyAdd(r, s, -b);
        return Add((a, ae), (-b, -be));
    }

    private static (double Hi, double Lo) TwoSum(double a, double b)
    {
        double s = a + b, bb = s - a;
        return (s, (a - (s - bb)) + (b - bb));
    }

    private static (double Hi, double Lo) Add((double Hi, double Lo) x, (double Hi, double Lo) y)
    {
        var (s, e) = TwoSum(x.Hi, y.Hi);
        var (t, f) = TwoSum(x.Lo, y.Lo);
        e += t;
        (s, e) = TwoSum(s, e);
        e += f;
        return TwoSum(s, e);
    }

    private static (double Hi, double Lo) Scale(double a, (double Hi, double Lo) x)
    {
        double p = a * x.Hi, pe = Math.FusedMultiplyAdd(a, x.Hi, -p);
        return TwoSum(p, pe + a * x.Lo);
    }

    // x / y rounded to double: one correction step on the double quotient.
    private static double Divide((double Hi, double Lo) x, (double Hi, double Lo) y)
    {
        double q = x.Hi / y.Hi;
        var r = Add(x, Scale(-q, y));
        return q + (r.Hi + r.Lo) / y.Hi;
    }

    // Face rings: for plane p, the triangles around its face in order, Ring[RingStart[p] .. RingStart[p+1]).
    private int[] _ringStart = new int[65], _ring = new int[384], _entQ = new int[384], _entR = new int[384], _succ = new int[64], _triOf = new int[64];

    public ReadOnlySpan<int> RingStart => _ringStart.AsSpan(0, _planeCount + 1);

    public ReadOnlySpan<int> Ring => _ring.AsSpan(0, 3 * _triCount);

    // For each directed edge x→y (key 64x + y) of the dual triangulation, for cells of at most 64 planes: the triangle
    // (x, y, z) holding it, with z in the upper 16 bits (face x's ring goes on from this triangle to the one holding x→z).
    private readonly int[] _edgeTriangle = new int[64 * 64];
    private readonly int[] _firstNeighbour = new int[64];

    /// <summary>
    /// Prepares <see cref="Faces"/> for cells of at most 64 planes: every directed edge x→y of the dual triangulation is
    /// entered in a 64 × 64 table with the triangle (x, y, z) holding it and z, so each face is walked one load per
    /// vertex. Returns false for larger cells, whose rings must be built (<see cref="BuildFaceRings"/>).
    /// </summary>
    /// <remarks>
    /// In triangle (p, q, r) face p runs from neighbour q to neighbour r, so the next triangle around p is the one holding
    /// the directed edge p→r. Each edge of a closed triangulation occurs once, so no entry is read stale. The table is
    /// filled backwards, so each face's walk starts at its lowest-numbered triangle.
    /// </remarks>
    public bool PrepareFaceWalk()
    {
        int planes = _planeCount, tris = _triCount;
        if (planes > 64) return false;
        ref int edge = ref MemoryMarshal.GetArrayDataReference(_edgeTriangle);
        ref int firstQ = ref MemoryMarshal.GetArrayDataReference(_firstNeighbour);
        ref int ta = ref MemoryMarshal.GetArrayDataReference(_ta);
        ref int tb = ref MemoryMarshal.GetArrayDataReference(_tb);
        ref int tc = ref MemoryMarshal.GetArrayDataReference(_tc);
        for (int p = 0; p < planes; p++) Unsafe.Add(ref firstQ, p) = -1;
        for (int t = tris - 1; t >= 0; t--)
        {
            int a = Unsafe.Add(ref ta, t), b = Unsafe.Add(ref tb, t), c = Unsafe.Add(ref tc, t);
            Unsafe.Add(ref edge, (a << 6) | b) = t | (c << 16);
            Unsafe.Add(ref edge, (b << 6) | c) = t | (a << 16);
            Unsafe.Add(ref edge, (c << 6) | a) = t | (b << 16);
            Unsafe.Add(ref firstQ, a) = b; Unsafe.Add(ref firstQ, b) = c; Unsafe.Add(ref firstQ, c) = a;
        }
        return true;
    }

    private double[] _planeK = new double[64];

    /// <summary>
    /// After <see cref="PrepareFaceWalk"/> returned true: the cell's signed volume (returned) and first moment about the
    /// generator (<paramref name="mx"/>, <paramref name="my"/>, <paramref name="mz"/>, signed alike, so their ratio is
    /// the centroid), each face's area and the generator's distance from its plane (<paramref name="faceArea"/>,
    /// <paramref name="faceHeight"/>, indexed by plane; a face that vanished has area 0).
    /// </summary>
    /// <remarks>
    /// Each corner of a vertex t on face p (the edge from t to the next vertex around p, found in the edge table) spans the
    /// signed tetrahedron (0, f_p, v_t, v_next), f_p = n_p d_p/|n_p|² the generator's foot on the plane: volume
    /// f_p·(v_t × v_next)/6, centroid (f_p + v_t + v_next)/4, and n_p·(v_t × v_next) summed over a face's corners is
    /// twice its area times |n_p| (the foot drops out: it is parallel to n_p). The fans from the feet cover each face and
    /// pyramid exactly with signs, so the sums are exact integrals; no face is walked in order, so the corners are
    /// independent of each other (a walk waits on one load per vertex and mispredicts each face's end).
    /// </remarks>
    public double MeasureByCorners(double[] faceArea, double[] faceHeight, out double mx, out double my, out double mz)
    {
        int planes = _planeCount, tris = _triCount;
        if (_planeK.Length < _nx.Length) _planeK = new double[_nx.Length];
        ref double k = ref MemoryMarshal.GetArrayDataReference(_planeK);
        ref double pnx = ref MemoryMarshal.GetArrayDataReference(_nx);
        ref double pny = ref MemoryMarshal.GetArrayDataReference(_ny);
        ref double pnz = ref MemoryMarshal.GetArrayDataReference(_nz);
        ref double pd = ref MemoryMarshal.GetArrayDataReference(_d);
        ref double pn2 = ref MemoryMarshal.GetArrayDataReference(_n2);
        if (faceArea.Length < planes || faceHeight.Length < planes) throw new ArgumentException("Face arrays shorter than the plane count.");
        ref double sum = ref MemoryMarshal.GetArrayDataReference(faceArea);
        ref double h = ref MemoryMarshal.GetArrayDataReference(faceHeight);
        int p0 = 0;
        if (Vector512.IsHardwareAccelerated && (faceArea.Length & 7) == 0 && (faceHeight.Length & 7) == 0)
        {
            // Whole vectors: every capacity here is a multiple of eight; lanes past the plane count are never read.
            for (; p0 < planes; p0 += 8)
            {
                var n2 = Vector512.LoadUnsafe(ref pn2, (nuint)p0); var d = Vector512.LoadUnsafe(ref pd, (nuint)p0);
                (d / n2).StoreUnsafe(ref k, (nuint)p0);
                (d / Vector512.Sqrt(n2)).StoreUnsafe(ref h, (nuint)p0);
                Vector512<double>.Zero.StoreUnsafe(ref sum, (nuint)p0);
            }
        }
        for (int p = p0; p < planes; p++)
        {
            double n2 = Unsafe.Add(ref pn2, p), d = Unsafe.Add(ref pd, p);
            Unsafe.Add(ref k, p) = d / n2;
            Unsafe.Add(ref h, p) = d / Math.Sqrt(n2);
            Unsafe.Add(ref sum, p) = 0;
        }
        ref int edge = ref MemoryMarshal.GetArrayDataReference(_edgeTriangle);
        ref int ta = ref MemoryMarshal.GetArrayDataReference(_ta);
        ref int tb = ref MemoryMarshal.GetArrayDataReference(_tb);
        ref int tc = ref MemoryMarshal.GetArrayDataReference(_tc);
        ref double vx = ref MemoryMarshal.GetArrayDataReference(_vx);
        ref double vy = ref MemoryMarshal.GetArrayDataReference(_vy);
        ref double vz = ref MemoryMarshal.GetArrayDataReference(_vz);
        double vol = 0, sx = 0, sy = 0, sz = 0;
        for (int t = 0; t < tris; t++)
        {
            int a = Unsafe.Add(ref ta, t), b = Unsafe.Add(ref tb, t), c = Unsafe.Add(ref tc, t);
            double x = Unsafe.Add(ref vx, t), y = Unsafe.Add(ref vy, t), z = Unsafe.Add(ref vz, t);
            // Face a runs from t to the vertex holding a→c, face b to the one holding b→a, face c to the one holding c→b:
            // (p, q) = (a, c), (b, a), (c, b), each step (p, q, r) ← (r, p, q).
            int p = a, q = c, r = b;
            for (int corner = 0; corner < 3; corner++)
            {
                int u = Unsafe.Add(ref edge, (p << 6) | q) & 0xFFFF;
                double wx = Unsafe.Add(ref vx, u), wy = Unsafe.Add(ref vy, u), wz = Unsafe.Add(ref vz, u);
                double nx = Unsafe.Add(ref pnx, p), ny = Unsafe.Add(ref pny, p), nz = Unsafe.Add(ref pnz, p), kp = Unsafe.Add(ref k, p);
                double e = nx * (y * wz - z * wy) + ny * (z * wx - x * wz) + nz * (x * wy - y * wx);
                Unsafe.Add(ref sum, p) += e;
                double ve = kp * e;
                vol += ve;
                sx += ve * (kp * nx + x + wx);
                sy += ve * (kp * ny + y + wy);
                sz += ve * (kp * nz + z + wz);
                (p, q, r) = (r, p, q);
            }
        }
        // Area ½|e sum|/|n| = ½|e sum| h/d (h = d/|n|).
        p0 = 0;
        if (Vector512.IsHardwareAccelerated && (faceArea.Length & 7) == 0 && (faceHeight.Length & 7) == 0)
        {
            for (; p0 < planes; p0 += 8)
            {
                var area = Vector512.Abs(Vector512.LoadUnsafe(ref sum, (nuint)p0)) * Vector512.LoadUnsafe(ref h, (nuint)p0) / Vector512.LoadUnsafe(ref pd, (nuint)p0);
                (Vector512.Create(0.5) * area).StoreUnsafe(ref sum, (nuint)p0);
            }
        }
        for (int p = p0; p < planes; p++) Unsafe.Add(ref sum, p) = 0.5 * Math.Abs(Unsafe.Add(ref sum, p)) * Unsafe.Add(ref h, p) / Unsafe.Add(ref pd, p);
        // Tetrahedron volume det(f, v, w)/6 = k e/6, centroid (f + v + w)/4.
        mx = sx / 24; my = sy / 24; mz = sz / 24;
        return vol / 6;
    }

    /// <summary>The faces' vertex walks after <see cref="PrepareFaceWalk"/> returned true.</summary>
    public EdgeTableWalk Faces => new(_edgeTriangle, _firstNeighbour, _triCount);

    /// <summary>The faces' vertex walks over the rings of <see cref="BuildFaceRings"/>.</summary>
    public RingWalk FaceRings => new(_ringStart, _ring);

    /// <summary>
    /// Builds every face ring in order: <c>Ring[RingStart[p] .. RingStart[p + 1])</c> lists the triangles (vertices) around
    /// face p, in the order of <see cref="Faces"/> (from the lowest-numbered triangle) for cells of at most 64 planes, else
    /// as <see cref="OrderFace"/> gives; faces that vanished have an empty ring.
    /// </summary>
    /// <exception cref="InvalidOperationException">A ring does not close (an inconsistent triangulation).</exception>
    public void BuildFaceRings()
    {
        int planes = _planeCount, tris = _triCount;
        if (!PrepareFaceWalk())
        {
            GroupFaceCorners();
            for (int p = 0; p < planes; p++) OrderFace(p);
            return;
        }
        if (_ringStart.Length < planes + 1) Array.Resize(ref _ringStart, Math.Max(planes + 1, 2 * _ringStart.Length));
        if (_ring.Length < 3 * tris) Array.Resize(ref _ring, Math.Max(3 * tris, 2 * _ring.Length));
        var start = _ringStart; var ring = _ring;
        var walk = Faces;
        int k = 0;
        for (int p = 0; p < planes; p++)
        {
            start[p] = k;
            for (int t = walk.Start(p); t >= 0; t = walk.Next()) ring[k++] = t;
        }
        start[planes] = k;
    }

    /// <summary>
    /// Groups the triangle corners by plane: the first half of building the face rings. Each face's ring is in place
    /// once <see cref="OrderFace"/> was called for its plane, so a caller orders and measures a face in one pass;
    /// faces that vanished keep an empty ring.
    /// </summary>
    public void GroupFaceCorners()
    {
        int planes = _planeCount, corners = 3 * _triCount;
        if (_ringStart.Length < planes + 1) Array.Resize(ref _ringStart, Math.Max(planes + 1, 2 * _ringStart.Length));
        if (_ring.Length < corners)
        {
            int n = Math.Max(corners, 2 * _ring.Length);
            Array.Resize(ref _ring, n); Array.Resize(ref _entQ, n); Array.Resize(ref _entR, n);
        }
        if (_succ.Length < planes) { Array.Resize(ref _succ, 2 * planes); Array.Resize(ref _triOf, 2 * planes); }
        var start = _ringStart;
        Array.Clear(start, 0, planes + 1);
        for (int t = 0; t < _triCount; t++) { start[_ta[t] + 1]++; start[_tb[t] + 1]++; start[_tc[t] + 1]++; }
        for (int p = 0; p < planes; p++) start[p + 1] += start[p];
        // Scatter corners (p; q, r, t) grouped by p, using _ring as the fill cursor's output for t.
        Span<int> fill = planes <= 256 ? stackalloc int[planes] : new int[planes];
        for (int t = 0; t < _triCount; t++)
        {
            int a = _ta[t], b = _tb[t], c = _tc[t];
            int k = start[a] + fill[a]++; _entQ[k] = b; _entR[k] = c; _ring[k] = t;
            k = start[b] + fill[b]++; _entQ[k] = c; _entR[k] = a; _ring[k] = t;
            k = start[c] + fill[c]++; _entQ[k] = a; _entR[k] = b; _ring[k] = t;
        }
    }

    /// <summary>Orders face <paramref name="p"/>'s ring after <see cref="GroupFaceCorners"/>; faces with fewer than three corners are left as they are.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void OrderFace(int p)
    {
        int s = _ringStart[p], e = _ringStart[p + 1];
        if (e - s < 3) return;
        var entQ = _entQ; var entR = _entR; var ring = _ring; var succ = _succ; var triOf = _triOf;
        for (int k = s; k < e; k++) { succ[entQ[k]] = entR[k]; triOf[entQ[k]] = ring[k]; }
        // In triangle (p, q, r) the face p runs from neighbour q to neighbour r; follow r to the next triangle.
        int q = entQ[s];
        for (int k = s; k < e; k++) { ring[k] = triOf[q]; q = succ[q]; }
    }

    private void GrowPlanes()
    {
        int n = _nx.Length * 2;
        Array.Resize(ref _nx, n); Array.Resize(ref _ny, n); Array.Resize(ref _nz, n); Array.Resize(ref _d, n); Array.Resize(ref _n2, n);
        Array.Resize(ref _neighbour, n);
    }

    private void GrowScratchPlanes(int min)
    {
        int n = Math.Max(min, _next.Length * 2);
        Array.Resize(ref _next, n);
        Array.Resize(ref _nextStamp, n);
    }

    private void GrowTriangles()
    {
        int n = _ta.Length * 2;
        Array.Resize(ref _ta, n); Array.Resize(ref _tb, n); Array.Resize(ref _tc, n);
        Array.Resize(ref _vx, n); Array.Resize(ref _vy, n); Array.Resize(ref _vz, n); Array.Resize(ref _vr2, n);
        Array.Resize(ref _removed, (n + 63) >> 6);
    }
}

/// <summary>The vertices of one face of a <see cref="ConvexCell"/> in order, one at a time: <c>for (int t = w.Start(p); t &gt;= 0; t = w.Next())</c>.</summary>
internal interface IFaceWalk
{
    /// <summary>The first vertex (triangle) of face <paramref name="p"/>, or −1 if the face vanished.</summary>
    int Start(int p);

    /// <summary>The next vertex of the face begun by <see cref="Start"/>, or −1 after its last.</summary>
    int Next();
}

/// <summary>Walks a face through the directed-edge table of <see cref="ConvexCell.PrepareFaceWalk"/>: one load per vertex.</summary>
internal struct EdgeTableWalk(int[] edgeTriangle, int[] firstNeighbour, int triangles) : IFaceWalk
{
    private int _row, _q0, _q, _left;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public int Start(int p)
    {
        int q0 = firstNeighbour[p];
        if (q0 < 0) return -1;
        _row = p << 6;
        _q0 = q0;
        // A face has at most as many vertices as the cell: more means a walk that does not close.
        _left = triangles - 1;
        int entry = Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(edgeTriangle), _row | q0);
        _q = entry >> 16;
        return entry & 0xFFFF;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public int Next()
    {
        if (_q == _q0) return -1;
        if (--_left < 0) throw new InvalidOperationException("A face ring of a Voronoi cell does not close (inconsistent triangulation).");
        int entry = Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(edgeTriangle), _row | _q);
        _q = entry >> 16;
        return entry & 0xFFFF;
    }
}

/// <summary>Walks a face through the rings of <see cref="ConvexCell.BuildFaceRings"/>.</summary>
internal struct RingWalk(int[] ringStart, int[] ring) : IFaceWalk
{
    private int _k, _end;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public int Start(int p)
    {
        _k = ringStart[p];
        _end = ringStart[p + 1];
        return _k < _end ? ring[_k++] : -1;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public int Next() => _k < _end ? ring[_k++] : -1;
}
