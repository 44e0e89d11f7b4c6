using System.Runtime.CompilerServices;

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
/// cell unchanged and add no face. If rounding ever makes the removed patch not a disc, the clip is retried with a
/// larger tolerance; if that fails too an exception names the generator.</para>
/// <para>Memory: capacity grows on demand; a typical cell (16 planes, 28 vertices) touches about 3 KB, held once per
/// thread. Coordinates are relative to the generator, which keeps rounding relative to the cell size.</para>
/// </remarks>
internal sealed class ConvexCell
{
    private double[] _nx = new double[64], _ny = new double[64], _nz = new double[64], _d = new double[64];
    private int[] _neighbour = new int[64];
    private int _planeCount;

    private int[] _ta = new int[128], _tb = new int[128], _tc = new int[128];
    private double[] _vx = new double[128], _vy = new double[128], _vz = new double[128];
    private int _triCount;

    private bool[] _removed = new bool[128];
    private int[] _edgeFrom = new int[384], _edgeTo = new int[384];
    private int[] _next = new int[64], _nextStamp = new int[64];
    private int _stamp;

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

    /// <summary>
    /// Resets to the box [lo, hi] (relative to the generator; lo &lt; 0 &lt; hi not required but lo &lt; hi), with
    /// face neighbour codes for −x, +x, −y, +y, −z, +z.
    /// </summary>
    public void InitBox(double lox, double loy, double loz, double hix, double hiy, double hiz, ReadOnlySpan<int> codes)
    {
        _planeCount = 0;
        AddPlane(-1, 0, 0, -lox, codes[0]);
        AddPlane(1, 0, 0, hix, codes[1]);
        AddPlane(0, -1, 0, -loy, codes[2]);
        AddPlane(0, 1, 0, hiy, codes[3]);
        AddPlane(0, 0, -1, -loz, codes[4]);
        AddPlane(0, 0, 1, hiz, codes[5]);
        _triCount = 0;
        double max = 0;
        for (int corner = 0; corner < 8; corner++)
        {
            int sx = corner & 1, sy = (corner >> 1) & 1, sz = (corner >> 2) & 1;
            int a = sx, b = 2 + sy, c = 4 + sz;
            // Orientation: (n_a × n_b)·n_c > 0 seen from outside; the normals' signs multiply.
            int sign = (sx == 1 ? 1 : -1) * (sy == 1 ? 1 : -1) * (sz == 1 ? 1 : -1);
            if (sign < 0) (a, b) = (b, a);
            double x = sx == 1 ? hix : lox, y = sy == 1 ? hiy : loy, z = sz == 1 ? hiz : loz;
            _ta[_triCount] = a; _tb[_triCount] = b; _tc[_triCount] = c;
            _vx[_triCount] = x; _vy[_triCount] = y; _vz[_triCount] = z;
            _triCount++;
            max = Math.Max(max, x * x + y * y + z * z);
        }
        MaxRadiusSquared = max;
    }

    private int AddPlane(double nx, double ny, double nz, double d, int neighbour)
    {
        if (_planeCount == _nx.Length) GrowPlanes();
        int p = _planeCount++;
        _nx[p] = nx; _ny[p] = ny; _nz[p] = nz; _d[p] = d; _neighbour[p] = neighbour;
        return p;
    }

    /// <summary>
    /// Clips by the half-space n·x ≤ d. Returns true when the plane cut the cell (and became a face).
    /// </summary>
    /// <exception cref="InvalidOperationException">Rounding made the clip inconsistent even with a larger tolerance.</exception>
    public bool Clip(double nx, double ny, double nz, double d, int neighbour)
    {
        double norm = Math.Sqrt(nx * nx + ny * ny + nz * nz);
        double eps = Tolerance * norm;
        for (int attempt = 0; attempt < 4; attempt++)
        {
            int r = Classify(nx, ny, nz, d, eps);
            if (r == 0) return false;
            if (r == _triCount)
                throw new InvalidOperationException("A clipping plane removed the whole cell; the generator lies outside its own half-space.");
            if (TryRebuild(nx, ny, nz, d, neighbour)) return true;
            eps *= 64;
        }
        throw new InvalidOperationException("Voronoi cell clipping stayed inconsistent after enlarging the tolerance (degenerate input beyond double precision).");
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private int Classify(double nx, double ny, double nz, double d, double eps)
    {
        int removed = 0;
        double limit = d + eps;
        var vx = _vx; var vy = _vy; var vz = _vz; var rm = _removed;
        for (int t = 0; t < _triCount; t++)
        {
            bool out_ = nx * vx[t] + ny * vy[t] + nz * vz[t] > limit;
            rm[t] = out_;
            if (out_) removed++;
        }
        return removed;
    }

    private bool TryRebuild(double nx, double ny, double nz, double d, int neighbour)
    {
        // Edges of removed triangles.
        int e = 0;
        for (int t = 0; t < _triCount; t++)
        {
            if (!_removed[t]) continue;
            if (e + 3 > _edgeFrom.Length) { Array.Resize(ref _edgeFrom, _edgeFrom.Length * 2); Array.Resize(ref _edgeTo, _edgeTo.Length * 2); }
            int a = _ta[t], b = _tb[t], c = _tc[t];
            _edgeFrom[e] = a; _edgeTo[e] = b; e++;
            _edgeFrom[e] = b; _edgeTo[e] = c; e++;
            _edgeFrom[e] = c; _edgeTo[e] = a; e++;
        }
        // Boundary edges: their reverse is not an edge of another removed triangle.
        if (_next.Length < _planeCount + 1) GrowScratchPlanes(_planeCount + 1);
        int stamp = ++_stamp;
        int boundary = 0, first = -1;
        for (int i = 0; i < e; i++)
        {
            int from = _edgeFrom[i], to = _edgeTo[i];
            bool interior = false;
            for (int j = 0; j < e; j++)
            {
                if (_edgeFrom[j] == to && _edgeTo[j] == from) { interior = true; break; }
            }
            if (interior) continue;
            if (_nextStamp[from] == stamp) return false; // a plane twice on the boundary: not a disc
            _nextStamp[from] = stamp;
            _next[from] = to;
            boundary++;
            first = from;
        }
        // Walk the cycle once to check it is a single loop through every boundary edge.
        int steps = 0, x = first;
        do
        {
            if (_nextStamp[x] != stamp) return false;
            x = _next[x];
            steps++;
        } while (x != first && steps <= boundary);
        if (steps != boundary || x != first) return false;

        int p = AddPlane(nx, ny, nz, d, neighbour);
        // Fill removed slots with the new triangles (x, next[x], p), append the rest, compact if fewer.
        int slot = 0;
        x = first;
        for (int k = 0; k < boundary; k++)
        {
            int y = _next[x];
            while (slot < _triCount && !_removed[slot]) slot++;
            int t;
            if (slot < _triCount) { t = slot; _removed[slot] = false; slot++; }
            else
            {
                if (_triCount == _ta.Length) GrowTriangles();
                t = _triCount++;
                _removed[t] = false;
            }
            _ta[t] = x; _tb[t] = y; _tc[t] = p;
            SetVertex(t, x, y, p);
            x = y;
        }
        // Remaining removed slots (the patch had interior vertices): compact, keeping order.
        if (slot < _triCount)
        {
            int write = 0;
            for (int t = 0; t < _triCount; t++)
            {
                if (_removed[t]) continue;
                if (write != t) MoveTriangle(t, write);
                write++;
            }
            _triCount = write;
        }
        double max = 0;
        for (int t = 0; t < _triCount; t++)
            max = Math.Max(max, _vx[t] * _vx[t] + _vy[t] * _vy[t] + _vz[t] * _vz[t]);
        MaxRadiusSquared = max;
        return true;
    }

    private void MoveTriangle(int from, int to)
    {
        _ta[to] = _ta[from]; _tb[to] = _tb[from]; _tc[to] = _tc[from];
        _vx[to] = _vx[from]; _vy[to] = _vy[from]; _vz[to] = _vz[from];
        _removed[to] = _removed[from];
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void SetVertex(int t, int a, int b, int c)
    {
        // x = (d_a (n_b × n_c) + d_b (n_c × n_a) + d_c (n_a × n_b)) / (n_a · (n_b × n_c)).
        double ax = _nx[a], ay = _ny[a], az = _nz[a], bx = _nx[b], by = _ny[b], bz = _nz[b], cx = _nx[c], cy = _ny[c], cz = _nz[c];
        double bcx = by * cz - bz * cy, bcy = bz * cx - bx * cz, bcz = bx * cy - by * cx;
        double cax = cy * az - cz * ay, cay = cz * ax - cx * az, caz = cx * ay - cy * ax;
        double abx = ay * bz - az * by, aby = az * bx - ax * bz, abz = ax * by - ay * bx;
        double det = ax * bcx + ay * bcy + az * bcz;
        double da = _d[a], db = _d[b], dc = _d[c];
        double inv = 1.0 / det;
        _vx[t] = (da * bcx + db * cax + dc * abx) * inv;
        _vy[t] = (da * bcy + db * cay + dc * aby) * inv;
        _vz[t] = (da * bcz + db * caz + dc * abz) * inv;
    }

    // Face rings: for plane p, the triangles around its face in order, Ring[RingStart[p] .. RingStart[p+1]).
    private int[] _ringStart = new int[65], _ring = new int[384], _entQ = new int[384], _entR = new int[384], _succ = new int[64], _triOf = new int[64];

    public ReadOnlySpan<int> RingStart => _ringStart.AsSpan(0, _planeCount + 1);

    public ReadOnlySpan<int> Ring => _ring.AsSpan(0, 3 * _triCount);

    /// <summary>Orders the vertices (triangles) of every face; faces that vanished get an empty ring.</summary>
    public void BuildFaceRings()
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
        for (int p = 0; p < planes; p++)
        {
            int s = start[p], e = start[p + 1];
            if (e - s < 3) continue;
            for (int k = s; k < e; k++) { _succ[_entQ[k]] = _entR[k]; _triOf[_entQ[k]] = _ring[k]; }
            // In triangle (p, q, r) the face p runs from neighbour q to neighbour r; follow r to the next triangle.
            int q = _entQ[s];
            for (int k = s; k < e; k++) { _ring[k] = _triOf[q]; q = _succ[q]; }
        }
    }

    private void GrowPlanes()
    {
        int n = _nx.Length * 2;
        Array.Resize(ref _nx, n); Array.Resize(ref _ny, n); Array.Resize(ref _nz, n); Array.Resize(ref _d, n);
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
        Array.Resize(ref _vx, n); Array.Resize(ref _vy, n); Array.Resize(ref _vz, n);
        Array.Resize(ref _removed, n);
    }
}
