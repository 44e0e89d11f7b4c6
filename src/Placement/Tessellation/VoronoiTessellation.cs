using System.Runtime.ExceptionServices;
using Placement.Parallelism;
using Placement.Points;
using Placement.Spatial;

namespace Placement.Tessellation;

/// <summary>
/// Computes the 3-D Voronoi cells of a point set in a box (solid or periodic) or a ball, cell by cell and in
/// parallel, by clipping each cell with the bisecting planes of its neighbours nearest-first until the security
/// radius proves it complete.
/// </summary>
/// <remarks>
/// <para>Method: cell clipping with a security radius (Ray, Sokolov, Lefebvre &amp; Lévy 2018, "Meshless Voronoi on
/// the GPU", ACM TOG 37(6)); see <see cref="ConvexCell"/>. A neighbour at distance D can only cut the cell if
/// D/2 &lt; max vertex distance, so a cell is complete once every point closer than 2·max|v| was used.</para>
/// <para>Neighbours: a uniform grid (<see cref="PointGrid"/>, about 1.5 points per grid cell) whose sorted order is
/// also the processing order, so consecutive cells are neighbours in space and touch the same memory. Each cell
/// gathers one shell of radius equal to the previous cell's security radius by scanning whole grid rows
/// (<see cref="PointGrid.CollectInShell"/>), orders it near-first in 16 distance buckets (no full sort), clips,
/// and gathers a further shell only if its own security radius is larger.</para>
/// <para>Per cell (uniform random points): about 53 points gathered, 42 bisecting planes tested and 16 cutting,
/// ending with 15.5 faces and 27 vertices. Measured split of the single-thread time on the development machine:
/// gathering 25 %, clipping 50 %, face rings and measures 20 %. Memory: the result's 53 bytes per cell, the grid's
/// ~31 bytes per point (+4 transient), a few KB of scratch per worker, no per-cell allocation. Exactness: in a box
/// the volumes sum to the box volume to about 1e-13 relative; a vertex within
/// <see cref="TessellationOptions.ClipTolerance"/> of a plane counts as on it.</para>
/// </remarks>
public static class VoronoiTessellation
{
    /// <summary>Tessellates the positions of <paramref name="points"/> (length units of the set).</summary>
    /// <param name="points">The generators; positions must lie in the domain.</param>
    /// <param name="domain">The region to fill.</param>
    /// <param name="options">Settings; <see cref="TessellationOptions.Default"/> when null.</param>
    /// <returns>The cells, indexed like the points.</returns>
    /// <exception cref="ArgumentException">A point lies outside the domain, or two points coincide (the message names both).</exception>
    public static VoronoiCells Compute(PointSet points, TessellationDomain domain, TessellationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        return Compute(points.X, points.Y, points.Z, domain, options);
    }

    /// <summary>Tessellates the generators (x[i], y[i], z[i]).</summary>
    /// <param name="x">Generator x, length units.</param>
    /// <param name="y">Generator y.</param>
    /// <param name="z">Generator z.</param>
    /// <param name="domain">The region to fill.</param>
    /// <param name="options">Settings; <see cref="TessellationOptions.Default"/> when null.</param>
    /// <returns>The cells, indexed like the generators.</returns>
    /// <exception cref="ArgumentException">Arrays differ in length, a point lies outside the domain, or two points coincide.</exception>
    public static VoronoiCells Compute(double[] x, double[] y, double[] z, TessellationDomain domain, TessellationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(z);
        ArgumentNullException.ThrowIfNull(domain);
        options ??= TessellationOptions.Default;
        int n = x.Length;
        if (y.Length != n || z.Length != n) throw new ArgumentException($"Coordinate arrays differ in length: {x.Length}, {y.Length}, {z.Length}.", nameof(y));
        for (int i = 0; i < n; i++)
        {
            if (!domain.Contains(x[i], y[i], z[i]))
                throw new ArgumentException($"Point {i} at ({x[i]}, {y[i]}, {z[i]}) lies outside the domain {domain}.", nameof(x));
        }
        var grid = new PointGrid(x, y, z, (domain.MinX, domain.MinY, domain.MinZ), (domain.MaxX, domain.MaxY, domain.MaxZ),
            domain.Kind == DomainKind.PeriodicBox, options.PointsPerGridCell);
        var cells = new VoronoiCells(n, domain, options.KeepFaces, options.MassProfile is not null);
        if (n == 0) return cells;

        var settings = options.Parallel ?? ParallelSettings.Default;
        int chunk = ParallelLoop.ChunkSize(n, Math.Min(settings.MinimumChunk, 2048));
        var chunkFaces = options.KeepFaces ? new FaceBuffer[(n + chunk - 1) / chunk] : null;
        long tested = 0, cut = 0;
        double spacing = Math.Cbrt(domain.Volume / n);
        var loopSettings = settings with { MinimumChunk = chunk };
        var order = TiledOrder(grid);
        try
        {
            ParallelLoop.For(n, loopSettings, (start, end) =>
            {
                var worker = new CellBuilder(grid, domain, options, cells, spacing);
                FaceBuffer? faces = chunkFaces is null ? null : new FaceBuffer();
                for (int k = start; k < end; k++) worker.Build(order[k], faces);
                if (chunkFaces is not null) chunkFaces[start / chunk] = faces!;
                Interlocked.Add(ref tested, worker.PlanesTested);
                Interlocked.Add(ref cut, worker.PlanesCut);
            });
        }
        catch (AggregateException ae) when (ae.InnerExceptions.Count > 0)
        {
            ExceptionDispatchInfo.Capture(ae.InnerExceptions[0]).Throw();
            throw;
        }
        cells.PlanesTested = tested;
        cells.PlanesCut = cut;
        if (chunkFaces is not null) AssembleFaces(cells, grid, order, chunkFaces, chunk);
        return cells;
    }

    /// <summary>
    /// Sorted slots in the order cells are processed: grid cells in tiles of 8 × 8 × 8, tiles and the cells inside
    /// them in row order. Consecutive cells then read the same few hundred KB of neighbour data (fits a core's L2),
    /// where plain row order sweeps whole slabs of the grid (measured about 2× slower at 10⁶ points).
    /// </summary>
    private static int[] TiledOrder(PointGrid grid)
    {
        const int tile = 8;
        var order = new int[grid.Count];
        int k = 0;
        for (int tz = 0; tz < grid.CountZ; tz += tile)
            for (int ty = 0; ty < grid.CountY; ty += tile)
                for (int tx = 0; tx < grid.CountX; tx += tile)
                    for (int cz = tz; cz < Math.Min(tz + tile, grid.CountZ); cz++)
                        for (int cy = ty; cy < Math.Min(ty + tile, grid.CountY); cy++)
                        {
                            int row = grid.CountX * (cy + grid.CountY * cz);
                            int from = grid.CellStart[row + tx], to = grid.CellStart[row + Math.Min(tx + tile, grid.CountX)];
                            for (int s = from; s < to; s++) order[k++] = s;
                        }
        return order;
    }

    private static void AssembleFaces(VoronoiCells cells, PointGrid grid, int[] order, FaceBuffer[] chunkFaces, int chunk)
    {
        var start = cells.FaceStart!;
        for (int i = 0; i < cells.Count; i++) start[i + 1] = start[i] + cells.FaceCount[i];
        var neighbour = new int[start[cells.Count]];
        var area = new double[start[cells.Count]];
        for (int c = 0; c < chunkFaces.Length; c++)
        {
            var buffer = chunkFaces[c];
            int read = 0;
            int end = Math.Min(cells.Count, (c + 1) * chunk);
            for (int k = c * chunk; k < end; k++)
            {
                int i = grid.SortedIndex[order[k]];
                int m = cells.FaceCount[i];
                buffer.Neighbour.AsSpan(read, m).CopyTo(neighbour.AsSpan(start[i], m));
                buffer.Area.AsSpan(read, m).CopyTo(area.AsSpan(start[i], m));
                read += m;
            }
        }
        cells.FaceNeighbour = neighbour;
        cells.FaceArea = area;
    }
}
