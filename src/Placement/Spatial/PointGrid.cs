using System.Runtime.CompilerServices;

namespace Placement.Spatial;

/// <summary>
/// A uniform grid over a set of 3-D points, with the points copied into grid-cell order, for nearest-neighbour,
/// k-nearest and radius queries; optionally periodic.
/// </summary>
/// <remarks>
/// <para>Layout: the bounding region [<see cref="MinX"/>, MinX + <see cref="CountX"/>·<see cref="CellSizeX"/>) × …
/// is cut into CountX × CountY × CountZ cells of edge CellSizeX/Y/Z (length units of the input). Cells are
/// numbered in row order, <c>c = ix + CountX·(iy + CountY·iz)</c>. The points of cell c occupy the sorted slots
/// <c>[CellStart[c], CellStart[c+1])</c>; <see cref="SortedX"/>/<see cref="SortedY"/>/<see cref="SortedZ"/> hold
/// their coordinates in that order and <see cref="SortedIndex"/> their original indices. Building is one
/// counting sort (two passes over the points), so points that are close in space are close in memory, and a
/// caller that walks the sorted slots in order visits space in row order of cells.</para>
/// <para>Memory: 3 × 8 + 4 bytes per point for the sorted copy and the index, 4 bytes per point of sorting
/// scratch kept for <see cref="Update"/>, and 8 bytes per cell (about 5.3 bytes per point at the default 1.5
/// points per cell): about 37 bytes per point.</para>
/// <para>Queries (exact in double precision): <see cref="FindNearest"/> (k nearest, nearest first) and
/// <see cref="FindWithinRadius"/> through the incremental <see cref="NeighbourSearch"/>; and
/// <see cref="CollectInShell"/>, the fast unsorted row scan for hot loops (Voronoi cells, SPH neighbour sums),
/// into a reusable <see cref="NeighbourBuffer"/>. A periodic grid reports every periodic image within the radius
/// as its own neighbour, with its offset vector. Uniform grids suit points whose density varies by up to a few
/// decades across the box; for much steeper variation queries stay exact but visit more empty or crowded
/// cells (an adaptive index is the next step for such sets).</para>
/// </remarks>
public sealed class PointGrid
{
    private readonly OffsetTable _offsets;

    /// <summary>Builds a grid over the points, sized for about <paramref name="pointsPerCell"/> points per cell.</summary>
    /// <param name="x">x coordinates, length units.</param>
    /// <param name="y">y coordinates, same length as <paramref name="x"/>.</param>
    /// <param name="z">z coordinates, same length as <paramref name="x"/>.</param>
    /// <param name="min">Lower corner of the region (x, y, z); every point must satisfy min ≤ p ≤ max (p &lt; max when periodic).</param>
    /// <param name="max">Upper corner of the region; max &gt; min in every axis.</param>
    /// <param name="periodic">True when the region is a periodic box: distances use periodic images.</param>
    /// <param name="pointsPerCell">Mean number of points per cell, &gt; 0; 1–2 is fastest for Voronoi cells.</param>
    /// <exception cref="ArgumentException">Coordinate spans differ in length, the region is empty, or a point lies outside it.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="pointsPerCell"/> is not finite and positive.</exception>
    public PointGrid(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z,
        (double X, double Y, double Z) min, (double X, double Y, double Z) max, bool periodic, double pointsPerCell = 1.5)
    {
        if (y.Length != x.Length || z.Length != x.Length)
            throw new ArgumentException($"Coordinate spans differ in length: x {x.Length}, y {y.Length}, z {z.Length}.", nameof(y));
        if (!(pointsPerCell > 0) || !double.IsFinite(pointsPerCell))
            throw new ArgumentOutOfRangeException(nameof(pointsPerCell), pointsPerCell, "Points per cell must be finite and > 0.");
        double lx = max.X - min.X, ly = max.Y - min.Y, lz = max.Z - min.Z;
        if (!(lx > 0 && ly > 0 && lz > 0) || !double.IsFinite(lx * ly * lz))
            throw new ArgumentException($"Region [{min}, {max}] must have finite positive extent in every axis.", nameof(max));
        int n = x.Length;
        Count = n;
        Periodic = periodic;
        MinX = min.X; MinY = min.Y; MinZ = min.Z;
        LengthX = lx; LengthY = ly; LengthZ = lz;

        // Cubic cells of volume (box volume)/(N / pointsPerCell), at most about 2^27 cells in total.
        double cells = Math.Clamp(n / pointsPerCell, 1.0, 1 << 27);
        double h = Math.Cbrt(lx * ly * lz / cells);
        CountX = AxisCells(lx, h);
        CountY = AxisCells(ly, h);
        CountZ = AxisCells(lz, h);
        CellSizeX = lx / CountX; CellSizeY = ly / CountY; CellSizeZ = lz / CountZ;
        _inverseX = CountX / lx; _inverseY = CountY / ly; _inverseZ = CountZ / lz;
        MinCellSize = Math.Min(CellSizeX, Math.Min(CellSizeY, CellSizeZ));

        int cellCount = CountX * CountY * CountZ;
        _max = max;
        // Not cleared here: Update clears the counts and writes every slot.
        CellStart = GC.AllocateUninitializedArray<int>(cellCount + 1);
        SortedIndex = GC.AllocateUninitializedArray<int>(n);
        SortedX = GC.AllocateUninitializedArray<double>(n);
        SortedY = GC.AllocateUninitializedArray<double>(n);
        SortedZ = GC.AllocateUninitializedArray<double>(n);
        _cellOf = GC.AllocateUninitializedArray<int>(n);
        _fill = GC.AllocateUninitializedArray<int>(cellCount);
        Update(x, y, z);
        _offsets = OffsetTable.For(Math.Max(CountX, Math.Max(CountY, CountZ)), periodic);
    }

    private readonly double _inverseX, _inverseY, _inverseZ;
    private readonly (double X, double Y, double Z) _max;
    private readonly int[] _cellOf, _fill;

    /// <summary>
    /// Re-sorts new positions of the same number of points in the same region into the existing memory (no
    /// allocation): for iterations that move points, where first touches of fresh memory are expensive.
    /// </summary>
    /// <param name="x">New x coordinates, length <see cref="Count"/>.</param>
    /// <param name="y">New y coordinates.</param>
    /// <param name="z">New z coordinates.</param>
    /// <exception cref="ArgumentException">A span's length differs from <see cref="Count"/>, or a point lies outside the region.</exception>
    public void Update(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z)
    {
        int n = Count;
        if (x.Length != n || y.Length != n || z.Length != n)
            throw new ArgumentException($"Expected {n} coordinates per axis, got {x.Length}, {y.Length}, {z.Length}.", nameof(x));
        var min = (X: MinX, Y: MinY, Z: MinZ);
        var max = _max;
        Array.Clear(CellStart);
        var cellOf = _cellOf;
        for (int i = 0; i < n; i++)
        {
            double px = x[i], py = y[i], pz = z[i];
            bool inside = Periodic
                ? px >= min.X && px < max.X && py >= min.Y && py < max.Y && pz >= min.Z && pz < max.Z
                : px >= min.X && px <= max.X && py >= min.Y && py <= max.Y && pz >= min.Z && pz <= max.Z;
            if (!inside)
                throw new ArgumentException($"Point {i} at ({px}, {py}, {pz}) lies outside the region [{min}, {max}]{(Periodic ? " (upper bound excluded: periodic)" : "")}.", nameof(x));
            int c = CellOf(px, py, pz);
            cellOf[i] = c;
            CellStart[c + 1]++;
        }
        int cellCount = _fill.Length;
        for (int c = 0; c < cellCount; c++) CellStart[c + 1] += CellStart[c];
        var fill = _fill;
        Array.Clear(fill);
        for (int i = 0; i < n; i++)
        {
            int c = cellOf[i];
            int slot = CellStart[c] + fill[c]++;
            SortedIndex[slot] = i;
            SortedX[slot] = x[i];
            SortedY[slot] = y[i];
            SortedZ[slot] = z[i];
        }
    }

    /// <summary>Number of points.</summary>
    public int Count { get; }

    /// <summary>True when distances use periodic images of the region.</summary>
    public bool Periodic { get; }

    /// <summary>Lower x corner of the region, length units.</summary>
    public double MinX { get; }

    /// <summary>Lower y corner of the region, length units.</summary>
    public double MinY { get; }

    /// <summary>Lower z corner of the region, length units.</summary>
    public double MinZ { get; }

    /// <summary>Region extent in x (the period when periodic), length units.</summary>
    public double LengthX { get; }

    /// <summary>Region extent in y, length units.</summary>
    public double LengthY { get; }

    /// <summary>Region extent in z, length units.</summary>
    public double LengthZ { get; }

    /// <summary>Number of cells along x.</summary>
    public int CountX { get; }

    /// <summary>Number of cells along y.</summary>
    public int CountY { get; }

    /// <summary>Number of cells along z.</summary>
    public int CountZ { get; }

    /// <summary>Cell edge in x, length units.</summary>
    public double CellSizeX { get; }

    /// <summary>Cell edge in y, length units.</summary>
    public double CellSizeY { get; }

    /// <summary>Cell edge in z, length units.</summary>
    public double CellSizeZ { get; }

    /// <summary>Smallest cell edge, length units.</summary>
    public double MinCellSize { get; }

    /// <summary>First sorted slot of each cell; length cells + 1 (row order of cells).</summary>
    public int[] CellStart { get; }

    /// <summary>Original index of the point in each sorted slot.</summary>
    public int[] SortedIndex { get; }

    /// <summary>x of the point in each sorted slot.</summary>
    public double[] SortedX { get; }

    /// <summary>y of the point in each sorted slot.</summary>
    public double[] SortedY { get; }

    /// <summary>z of the point in each sorted slot.</summary>
    public double[] SortedZ { get; }

    internal OffsetTable Offsets => _offsets;

    /// <summary>Row-order index of the cell containing (x, y, z), clamped into the grid.</summary>
    public int CellOf(double x, double y, double z)
    {
        int ix = Math.Clamp((int)((x - MinX) * _inverseX), 0, CountX - 1);
        int iy = Math.Clamp((int)((y - MinY) * _inverseY), 0, CountY - 1);
        int iz = Math.Clamp((int)((z - MinZ) * _inverseZ), 0, CountZ - 1);
        return ix + CountX * (iy + CountY * iz);
    }

    /// <summary>
    /// Finds the k points nearest to (x, y, z), nearest first, written to <paramref name="indices"/> (original
    /// indices) and <paramref name="distancesSquared"/>; returns how many were found (fewer when N &lt; k).
    /// </summary>
    /// <param name="x">Query x, length units (need not be a point of the set).</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="indices">Output original indices; its length is k.</param>
    /// <param name="distancesSquared">Output squared distances, length ≥ k, length units squared.</param>
    /// <param name="exclude">An original index to leave out (e.g. the query point itself), or −1.</param>
    /// <remarks>Periodic grids report the nearest image of each point once; a point can be reported more than once
    /// only when k exceeds N.</remarks>
    /// <exception cref="ArgumentException"><paramref name="distancesSquared"/> is shorter than <paramref name="indices"/>.</exception>
    public int FindNearest(double x, double y, double z, Span<int> indices, Span<double> distancesSquared, int exclude = -1)
    {
        if (distancesSquared.Length < indices.Length)
            throw new ArgumentException("The distance span is shorter than the index span.", nameof(distancesSquared));
        int k = indices.Length;
        if (k == 0 || Count == 0) return 0;
        var search = new NeighbourSearch(this);
        search.Start(x, y, z, exclude);
        int found = 0;
        while (found < k && search.Next(double.PositiveInfinity, out var hit))
        {
            indices[found] = SortedIndex[hit.Slot];
            distancesSquared[found] = hit.DistanceSquared;
            found++;
        }
        return found;
    }

    /// <summary>
    /// Adds to <paramref name="indices"/> every point within distance <paramref name="radius"/> of (x, y, z)
    /// (original indices, nearest first; periodic images within the radius each once) and returns the count added.
    /// </summary>
    /// <param name="x">Query x, length units.</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="radius">Search radius, length units, ≥ 0.</param>
    /// <param name="indices">List that receives the indices (not cleared).</param>
    /// <param name="distancesSquared">Optional list that receives the squared distances in the same order.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="radius"/> is negative or NaN.</exception>
    public int FindWithinRadius(double x, double y, double z, double radius, List<int> indices, List<double>? distancesSquared = null)
    {
        ArgumentNullException.ThrowIfNull(indices);
        if (!(radius >= 0)) throw new ArgumentOutOfRangeException(nameof(radius), radius, "Radius must be >= 0.");
        var search = new NeighbourSearch(this);
        search.Start(x, y, z, -1);
        int added = 0;
        double r2 = radius * radius;
        while (search.Next(r2, out var hit))
        {
            indices.Add(SortedIndex[hit.Slot]);
            distancesSquared?.Add(hit.DistanceSquared);
            added++;
        }
        return added;
    }

    /// <summary>
    /// Appends to <paramref name="buffer"/> every point (or periodic image) whose squared distance d² from
    /// (x, y, z) satisfies <paramref name="innerSquared"/> ≤ d² &lt; <paramref name="outerSquared"/>, unsorted;
    /// returns how many were added. The zero-shift copy of sorted slot <paramref name="excludeSlot"/> is skipped.
    /// </summary>
    /// <remarks>
    /// Scans whole rows of grid cells: for each (y, z) row that meets the ball, the cells meeting it along x are
    /// contiguous in the sorted arrays, so each row is one tight loop over points. Calling it with growing shells
    /// [r₀, r₁), [r₁, r₂), … gathers each point exactly once. Cost: the points of the rows meeting the ball
    /// (about 2× the ball's count), plus a few operations per row.
    /// </remarks>
    /// <param name="x">Query x, length units.</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="innerSquared">Inclusive lower limit on d², length².</param>
    /// <param name="outerSquared">Exclusive upper limit on d², length².</param>
    /// <param name="excludeSlot">Sorted slot (not original index) to skip at zero shift, or −1.</param>
    /// <param name="buffer">Receives the neighbours (not cleared).</param>
    /// <exception cref="ArgumentNullException"><paramref name="buffer"/> is null.</exception>
    public int CollectInShell(double x, double y, double z, double innerSquared, double outerSquared, int excludeSlot, NeighbourBuffer buffer)
    {
        ArgumentNullException.ThrowIfNull(buffer);
        if (!(outerSquared > innerSquared)) return 0;
        int before = buffer.Count;
        double outer = Math.Sqrt(outerSquared);
        int ix = Math.Clamp((int)Math.Floor((x - MinX) * _inverseX), 0, CountX - 1);
        int iy = Math.Clamp((int)Math.Floor((y - MinY) * _inverseY), 0, CountY - 1);
        int iz = Math.Clamp((int)Math.Floor((z - MinZ) * _inverseZ), 0, CountZ - 1);
        // Query position relative to its cell's lower corner.
        double fx = x - (MinX + ix * CellSizeX), fy = y - (MinY + iy * CellSizeY), fz = z - (MinZ + iz * CellSizeZ);
        int zLo = iz - Reach(outer, fz, _inverseZ), zHi = iz + Reach(outer, CellSizeZ - fz, _inverseZ);
        int yLo = iy - Reach(outer, fy, _inverseY), yHi = iy + Reach(outer, CellSizeY - fy, _inverseY);
        if (!Periodic)
        {
            zLo = Math.Max(zLo, 0); zHi = Math.Min(zHi, CountZ - 1);
            yLo = Math.Max(yLo, 0); yHi = Math.Min(yHi, CountY - 1);
        }
        if (!Periodic)
        {
            CollectRows(x, y, z, ix, iy, fx, fy, fz, zLo, zHi, yLo, yHi, iz, innerSquared, outerSquared, excludeSlot, buffer);
            return buffer.Count - before;
        }
        for (int cz = zLo; cz <= zHi; cz++)
        {
            double gz = Gap(cz - iz, fz, CellSizeZ);
            double remZ = outerSquared - gz * gz;
            if (remZ <= 0) continue;
            int wz = Periodic ? FloorDiv(cz, CountZ) : 0;
            int rz = cz - wz * CountZ;
            double sz = wz * LengthZ - z;
            for (int cy = yLo; cy <= yHi; cy++)
            {
                double gy = Gap(cy - iy, fy, CellSizeY);
                double rem = remZ - gy * gy;
                if (rem <= 0) continue;
                int wy = Periodic ? FloorDiv(cy, CountY) : 0;
                int ry = cy - wy * CountY;
                double sy = wy * LengthY - y;
                double reach = Math.Sqrt(rem);
                int xLo = ix - Reach(reach, fx, _inverseX), xHi = ix + Reach(reach, CellSizeX - fx, _inverseX);
                int rowBase = CountX * (ry + CountY * rz);
                if (!Periodic)
                {
                    xLo = Math.Max(xLo, 0); xHi = Math.Min(xHi, CountX - 1);
                    buffer.AppendRange(SortedX, SortedY, SortedZ, CellStart[rowBase + xLo], CellStart[rowBase + xHi + 1], -x, sy, sz, innerSquared, outerSquared, excludeSlot);
                    continue;
                }
                // Periodic rows may wrap, possibly several times for small grids: one contiguous run per period.
                for (int cx = xLo; cx <= xHi;)
                {
                    int wx = FloorDiv(cx, CountX);
                    int rx = cx - wx * CountX;
                    int runEnd = Math.Min(xHi, (wx + 1) * CountX - 1);
                    int rxEnd = runEnd - wx * CountX;
                    bool zero = wx == 0 && wy == 0 && wz == 0;
                    buffer.AppendRange(SortedX, SortedY, SortedZ, CellStart[rowBase + rx], CellStart[rowBase + rxEnd + 1], wx * LengthX - x, sy, sz, innerSquared, outerSquared, zero ? excludeSlot : -1);
                    cx = runEnd + 1;
                }
            }
        }
        return buffer.Count - before;
    }

    // Rows whose slot runs are found before any is scanned (CollectRows), per pass.
    private const int RowsPerPass = 128;

    /// <summary>
    /// The non-periodic body of <see cref="CollectInShell"/> in two passes: first the slot run of every (y, z) row that
    /// meets the ball (one square root per row), then the scan of the runs. Found and scanned in one loop, each row's
    /// square root waited on the mispredicted exit of the previous row's scan; apart, the roots overlap (1e6 uniform
    /// points, shells of about 50 neighbours: 30 rows and 180 points per query).
    /// </summary>
    private void CollectRows(double x, double y, double z, int ix, int iy, double fx, double fy, double fz, int zLo, int zHi, int yLo, int yHi,
        int iz, double innerSquared, double outerSquared, int excludeSlot, NeighbourBuffer buffer)
    {
        Span<int> runs = stackalloc int[2 * RowsPerPass];
        int rows = 0;
        var start = CellStart;
        for (int cz = zLo; cz <= zHi; cz++)
        {
            double gz = Gap(cz - iz, fz, CellSizeZ);
            double remZ = outerSquared - gz * gz;
            if (remZ <= 0) continue;
            for (int cy = yLo; cy <= yHi; cy++)
            {
                double gy = Gap(cy - iy, fy, CellSizeY);
                double rem = remZ - gy * gy;
                if (rem <= 0) continue;
                double reach = Math.Sqrt(rem);
                int xLo = Math.Max(ix - Reach(reach, fx, _inverseX), 0), xHi = Math.Min(ix + Reach(reach, CellSizeX - fx, _inverseX), CountX - 1);
                int rowBase = CountX * (cy + CountY * cz);
                runs[2 * rows] = start[rowBase + xLo];
                runs[2 * rows + 1] = start[rowBase + xHi + 1];
                if (++rows == RowsPerPass)
                {
                    buffer.AppendRuns(SortedX, SortedY, SortedZ, runs, rows, -x, -y, -z, innerSquared, outerSquared, excludeSlot);
                    rows = 0;
                }
            }
        }
        buffer.AppendRuns(SortedX, SortedY, SortedZ, runs, rows, -x, -y, -z, innerSquared, outerSquared, excludeSlot);
    }

    // Whole cells beyond the query's own cell needed to reach distance r when the query is `toFace` from the face.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int Reach(double r, double toFace, double inverseSize) => r <= toFace ? 0 : (int)Math.Ceiling((r - toFace) * inverseSize);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Gap(int d, double f, double h) => d > 0 ? (d - 1) * h + (h - f) : d < 0 ? (-d - 1) * h + f : 0.0;

    private static int FloorDiv(int a, int b) => a >= 0 ? a / b : -((-a + b - 1) / b);

    private static int AxisCells(double length, double h)
    {
        double c = Math.Round(length / h);
        return (int)Math.Clamp(c, 1.0, 1024.0);
    }
}
