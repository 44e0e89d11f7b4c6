using System.Runtime.CompilerServices;

namespace Placement.Spatial;

/// <summary>
/// Incremental nearest-first enumeration of the points of a <see cref="PointGrid"/> around a query position:
/// each call of <see cref="Next"/> returns the next nearest point (or periodic image). Reusable: one instance per
/// thread, restarted with <see cref="Start"/> for each query, allocates nothing after warm-up.
/// </summary>
/// <remarks>
/// Cells are visited in the order of a lower bound on their distance (<see cref="OffsetTable"/>); the points of
/// visited cells wait in a binary min-heap keyed by squared distance, and the heap top is returned only once no
/// unvisited cell can hold a nearer point, so the order is exact. Cost per query: the cells whose bound lies
/// within the final search radius, plus O(log h) per point gathered (h = heap size). A caller that lowers its
/// radius as it learns (e.g. a Voronoi cell's security radius) passes a non-increasing
/// <c>maxDistanceSquared</c>; cells and points beyond it are then skipped for good.
/// </remarks>
public sealed class NeighbourSearch
{
    private readonly PointGrid _grid;
    private readonly OffsetTable _table;
    private double _qx, _qy, _qz, _fx, _fy, _fz;
    private int _ix, _iy, _iz, _exclude, _cursor, _ring;
    private readonly List<int> _ringOffsets = new();
    private int _ringCursor;
    private bool _exhausted;

    // Heap of gathered candidates (min-heap by squared distance), structure of arrays.
    private double[] _hd2 = new double[64], _hdx = new double[64], _hdy = new double[64], _hdz = new double[64];
    private int[] _hslot = new int[64];
    private int _heapCount;

    /// <summary>Creates a reusable search over <paramref name="grid"/>.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="grid"/> is null.</exception>
    public NeighbourSearch(PointGrid grid)
    {
        ArgumentNullException.ThrowIfNull(grid);
        _grid = grid;
        _table = grid.Offsets;
    }

    /// <summary>Starts a new query at (x, y, z), optionally leaving out the point with original index <paramref name="exclude"/> (its zero-shift copy only).</summary>
    /// <param name="x">Query x, length units.</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="exclude">Original index to skip at zero shift, or −1.</param>
    public void Start(double x, double y, double z, int exclude)
    {
        var g = _grid;
        _qx = x; _qy = y; _qz = z;
        _ix = Math.Clamp((int)Math.Floor((x - g.MinX) / g.CellSizeX), 0, g.CountX - 1);
        _iy = Math.Clamp((int)Math.Floor((y - g.MinY) / g.CellSizeY), 0, g.CountY - 1);
        _iz = Math.Clamp((int)Math.Floor((z - g.MinZ) / g.CellSizeZ), 0, g.CountZ - 1);
        _fx = x - (g.MinX + _ix * g.CellSizeX);
        _fy = y - (g.MinY + _iy * g.CellSizeY);
        _fz = z - (g.MinZ + _iz * g.CellSizeZ);
        _exclude = exclude;
        _cursor = 0;
        _ring = _table.Reach;
        _ringOffsets.Clear();
        _ringCursor = 0;
        _exhausted = false;
        _heapCount = 0;
    }

    /// <summary>
    /// Returns the next nearest point with squared distance below <paramref name="maxDistanceSquared"/>, or false
    /// when there is none. Pass a non-increasing limit over the calls of one query.
    /// </summary>
    /// <param name="maxDistanceSquared">Exclusive limit on the squared distance, length².</param>
    /// <param name="hit">The neighbour found.</param>
    public bool Next(double maxDistanceSquared, out NeighbourHit hit)
    {
        double h2 = _grid.MinCellSize * _grid.MinCellSize;
        while (true)
        {
            double nextBound = NextBoundSquared(h2);
            if (_heapCount > 0 && _hd2[0] <= nextBound)
            {
                if (_hd2[0] >= maxDistanceSquared) break;
                hit = new NeighbourHit(_hslot[0], _hd2[0], _hdx[0], _hdy[0], _hdz[0]);
                Pop();
                return true;
            }
            if (nextBound >= maxDistanceSquared) break;
            VisitNextOffset(maxDistanceSquared);
        }
        hit = default;
        return false;
    }

    private double NextBoundSquared(double h2)
    {
        if (_cursor < _table.Length) return _table.BoundSquared[_cursor] * h2;
        if (_ringCursor >= _ringOffsets.Count && !PrepareRing()) return double.PositiveInfinity;
        double r = _ring - 1;
        return r * r * h2;
    }

    private bool PrepareRing()
    {
        if (_exhausted) return false;
        var g = _grid;
        int r = ++_ring;
        if (!g.Periodic && r >= Math.Max(g.CountX, Math.Max(g.CountY, g.CountZ)))
        {
            _exhausted = true;
            return false;
        }
        _ringOffsets.Clear();
        _ringCursor = 0;
        for (int dz = -r; dz <= r; dz++)
            for (int dy = -r; dy <= r; dy++)
            {
                bool face = Math.Abs(dz) == r || Math.Abs(dy) == r;
                for (int dx = -r; dx <= r; dx += face ? 1 : 2 * r)
                    _ringOffsets.Add(((dx + 512) << 20) | ((dy + 512) << 10) | (dz + 512));
            }
        return true;
    }

    private void VisitNextOffset(double maxDistanceSquared)
    {
        int dx, dy, dz;
        if (_cursor < _table.Length)
        {
            dx = _table.Dx[_cursor]; dy = _table.Dy[_cursor]; dz = _table.Dz[_cursor];
            _cursor++;
        }
        else
        {
            int p = _ringOffsets[_ringCursor++];
            dx = ((p >> 20) & 1023) - 512; dy = ((p >> 10) & 1023) - 512; dz = (p & 1023) - 512;
        }
        var g = _grid;
        // Tight lower bound for this offset from the query's position inside its cell.
        double gx = AxisGap(dx, _fx, g.CellSizeX), gy = AxisGap(dy, _fy, g.CellSizeY), gz = AxisGap(dz, _fz, g.CellSizeZ);
        if (gx * gx + gy * gy + gz * gz >= maxDistanceSquared) return;
        int cx = _ix + dx, cy = _iy + dy, cz = _iz + dz;
        double sx = 0, sy = 0, sz = 0;
        if (g.Periodic)
        {
            int wx = FloorDiv(cx, g.CountX), wy = FloorDiv(cy, g.CountY), wz = FloorDiv(cz, g.CountZ);
            cx -= wx * g.CountX; cy -= wy * g.CountY; cz -= wz * g.CountZ;
            sx = wx * g.LengthX; sy = wy * g.LengthY; sz = wz * g.LengthZ;
        }
        else if ((uint)cx >= (uint)g.CountX || (uint)cy >= (uint)g.CountY || (uint)cz >= (uint)g.CountZ)
        {
            return;
        }
        int c = cx + g.CountX * (cy + g.CountY * cz);
        int end = g.CellStart[c + 1];
        bool zeroShift = sx == 0 && sy == 0 && sz == 0;
        double ox = sx - _qx, oy = sy - _qy, oz = sz - _qz;
        var px = g.SortedX; var py = g.SortedY; var pz = g.SortedZ;
        for (int s = g.CellStart[c]; s < end; s++)
        {
            double ddx = px[s] + ox, ddy = py[s] + oy, ddz = pz[s] + oz;
            double d2 = ddx * ddx + ddy * ddy + ddz * ddz;
            if (d2 >= maxDistanceSquared) continue;
            if (zeroShift && g.SortedIndex[s] == _exclude) continue;
            Push(s, d2, ddx, ddy, ddz);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double AxisGap(int d, double f, double h) =>
        d > 0 ? (d - 1) * h + (h - f) : d < 0 ? (-d - 1) * h + f : 0.0;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int FloorDiv(int a, int b) => a >= 0 ? a / b : -((-a + b - 1) / b);

    private void Push(int slot, double d2, double dx, double dy, double dz)
    {
        if (_heapCount == _hd2.Length) Grow();
        int i = _heapCount++;
        while (i > 0)
        {
            int parent = (i - 1) >> 1;
            if (_hd2[parent] <= d2) break;
            Move(parent, i);
            i = parent;
        }
        _hd2[i] = d2; _hslot[i] = slot; _hdx[i] = dx; _hdy[i] = dy; _hdz[i] = dz;
    }

    private void Pop()
    {
        int last = --_heapCount;
        if (last == 0) return;
        double d2 = _hd2[last];
        int slot = _hslot[last];
        double dx = _hdx[last], dy = _hdy[last], dz = _hdz[last];
        int i = 0;
        while (true)
        {
            int child = 2 * i + 1;
            if (child >= last) break;
            if (child + 1 < last && _hd2[child + 1] < _hd2[child]) child++;
            if (_hd2[child] >= d2) break;
            Move(child, i);
            i = child;
        }
        _hd2[i] = d2; _hslot[i] = slot; _hdx[i] = dx; _hdy[i] = dy; _hdz[i] = dz;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void Move(int from, int to)
    {
        _hd2[to] = _hd2[from]; _hslot[to] = _hslot[from];
        _hdx[to] = _hdx[from]; _hdy[to] = _hdy[from]; _hdz[to] = _hdz[from];
    }

    private void Grow()
    {
        int n = _hd2.Length * 2;
        Array.Resize(ref _hd2, n); Array.Resize(ref _hdx, n); Array.Resize(ref _hdy, n);
        Array.Resize(ref _hdz, n); Array.Resize(ref _hslot, n);
    }
}
