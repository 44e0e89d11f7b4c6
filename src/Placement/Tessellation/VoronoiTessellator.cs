using System.Collections.Concurrent;
using System.Runtime.ExceptionServices;
using Placement.Parallelism;
using Placement.Spatial;

namespace Placement.Tessellation;

/// <summary>
/// A reusable Voronoi tessellator for one domain and one set of options: repeated calls with the same number of
/// points (relaxation, moving-mesh iterations) reuse the search grid, the processing order and the result arrays,
/// so no fresh memory is touched after the first call.
/// </summary>
/// <remarks>
/// The <see cref="VoronoiCells"/> returned is owned by the tessellator and overwritten by the next call with the
/// same point count. Method, costs and tolerances: see <see cref="VoronoiTessellation"/>. Not thread-safe: use one
/// instance per concurrent caller (each call is parallel inside).
/// </remarks>
public sealed class VoronoiTessellator
{
    private readonly TessellationDomain _domain;
    private readonly TessellationOptions _options;
    private PointGrid? _grid;
    private VoronoiCells? _cells;
    private int[] _order = [];

    /// <summary>True when the last call gathered neighbours from a k-d tree rather than the uniform grid.</summary>
    public bool UsedKdTree { get; private set; }

    /// <summary>True when the last call, on the grid, built a k-d tree for the far shells of cells reaching far.</summary>
    internal bool BuiltFarIndex { get; private set; }

    /// <summary>The region this tessellator fills.</summary>
    public TessellationDomain Domain => _domain;

    /// <summary>Creates a tessellator for <paramref name="domain"/>.</summary>
    /// <param name="domain">The region to fill.</param>
    /// <param name="options">Settings; <see cref="TessellationOptions.Default"/> when null.</param>
    /// <exception cref="ArgumentNullException"><paramref name="domain"/> is null.</exception>
    public VoronoiTessellator(TessellationDomain domain, TessellationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(domain);
        _domain = domain;
        _options = options ?? TessellationOptions.Default;
    }

    /// <summary>Tessellates the generators (x[i], y[i], z[i]) (length units of the domain).</summary>
    /// <param name="x">Generator x.</param>
    /// <param name="y">Generator y.</param>
    /// <param name="z">Generator z.</param>
    /// <returns>The cells, indexed like the generators; overwritten by the next call with the same count.</returns>
    /// <exception cref="ArgumentException">Arrays differ in length, a point lies outside the domain, or two points coincide (the message names both).</exception>
    public VoronoiCells Compute(double[] x, double[] y, double[] z)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(z);
        var domain = _domain;
        var options = _options;
        int n = x.Length;
        if (domain.Kind == DomainKind.Sphere)
        {
            // Few points make huge surface cells: holding them to the default δ would take tens of thousands of tangent
            // planes per cell. Surface cells span about 1.6 N^(-1/3) rad, so δ ≥ 1.4e-3 N^(-2/3) keeps it near 15
            // planes per direction; from N ≈ 1000 up the configured δ governs.
            double floor = 1.4e-3 * Math.Pow(Math.Max(n, 1), -2.0 / 3.0);
            if (options.SphereTolerance < floor) options = options with { SphereTolerance = floor };
        }
        if (y.Length != n || z.Length != n) throw new ArgumentException($"Coordinate arrays differ in length: {x.Length}, {y.Length}, {z.Length}.", nameof(y));
        for (int i = 0; i < n; i++)
        {
            if (!domain.Contains(x[i], y[i], z[i]))
                throw new ArgumentException($"Point {i} at ({x[i]}, {y[i]}, {z[i]}) lies outside the domain {domain}.", nameof(x));
        }
        if (_grid is null || _grid.Count != n)
        {
            _grid = new PointGrid(x, y, z, (domain.MinX, domain.MinY, domain.MinZ), (domain.MaxX, domain.MaxY, domain.MaxZ),
                domain.Kind == DomainKind.PeriodicBox, options.PointsPerGridCell);
            _order = GC.AllocateUninitializedArray<int>(n); // filled before use
        }
        else
        {
            _grid.Update(x, y, z);
        }
        if (_cells is null || _cells.Count != n) _cells = new VoronoiCells(n, domain, options.KeepFaces, options.MassProfile is not null);
        var grid = _grid;
        var cells = _cells;
        if (n == 0) return cells;
        bool useTree = domain.Kind != DomainKind.PeriodicBox && options.NeighbourIndex switch
        {
            NeighbourIndexKind.KdTree => true,
            NeighbourIndexKind.UniformGrid => false,
            _ => Crowding(grid) > options.GridCrowdingLimit,
        };
        var tree = useTree ? new KdTree(x, y, z) : null;
        UsedKdTree = useTree;
        // On the grid, cells that reach far (the dense side of a large density step) take their far shells from a tree.
        var far = useTree || domain.Kind == DomainKind.PeriodicBox ? null : new Lazy<FarIndex>(() => new FarIndex(x, y, z));

        var settings = options.Parallel ?? ParallelSettings.Default;
        int chunk = ParallelLoop.ChunkSize(n, Math.Min(settings.MinimumChunk, 2048));
        var chunkFaces = options.KeepFaces ? new FaceBuffer[(n + chunk - 1) / chunk] : null;
        long tested = 0, cut = 0;
        double spacing = Math.Cbrt(domain.Volume / n);
        var loopSettings = settings with { MinimumChunk = chunk };
        var order = _order;
        if (tree is null) TiledOrder(grid, order);
        else for (int k = 0; k < n; k++) order[k] = k; // tree order is already spatially coherent
        var index = tree is null ? grid.SortedIndex : tree.SortedIndex;
        try
        {
            // Workers (with scratch grown to the largest cells seen) are pooled across chunks rather than made per
            // chunk: crowded sets grow neighbour buffers to many thousands of entries. Each chunk restarts the worker's
            // state, so results do not depend on which worker ran which chunk.
            var pool = new ConcurrentBag<CellBuilder>();
            ParallelLoop.For(n, loopSettings, (start, end) =>
            {
                if (!pool.TryTake(out var worker))
                    worker = tree is null ? new CellBuilder(grid, null, domain, options, cells, spacing, far) : new CellBuilder(null, tree, domain, options, cells, spacing);
                worker.BeginChunk();
                FaceBuffer? faces = chunkFaces is null ? null : new FaceBuffer();
                for (int k = start; k < end; k++)
                {
                    try { worker.Build(order[k], faces); }
                    catch (InvalidOperationException e)
                    {
                        int slot = order[k], i = index[slot];
                        throw new InvalidOperationException(
                            $"Voronoi cell of generator {i} at ({x[i]:R}, {y[i]:R}, {z[i]:R}): {e.Message}", e);
                    }
                }
                worker.EndChunk();
                if (chunkFaces is not null) chunkFaces[start / chunk] = faces!;
                Interlocked.Add(ref tested, worker.PlanesTested);
                Interlocked.Add(ref cut, worker.PlanesCut);
                pool.Add(worker);
            });
        }
        catch (AggregateException ae) when (ae.InnerExceptions.Count > 0)
        {
            ExceptionDispatchInfo.Capture(ae.InnerExceptions[0]).Throw();
            throw;
        }
        BuiltFarIndex = far is { IsValueCreated: true };
        cells.PlanesTested = tested;
        cells.PlanesCut = cut;
        if (chunkFaces is not null) AssembleFaces(cells, index, order, chunkFaces, chunk);
        return cells;
    }


    /// <summary>
    /// Sorted slots in the order cells are processed: grid cells in tiles of 8 × 8 × 8, tiles and the cells inside
    /// them in row order. Consecutive cells then read the same few hundred KB of neighbour data (fits a core's L2),
    /// where plain row order sweeps whole slabs of the grid (measured about 2× slower at 10⁶ points).
    /// </summary>
    private static void TiledOrder(PointGrid grid, int[] order)
    {
        const int tile = 8;
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
    }

    /// <summary>
    /// Mean number of points sharing a point's grid cell, Σ_c n_c² / N: about 1 + λ for λ points per cell spread
    /// at random, and large when the points crowd into a few cells.
    /// </summary>
    private static double Crowding(PointGrid grid)
    {
        var start = grid.CellStart;
        double sum = 0;
        for (int c = 0; c + 1 < start.Length; c++)
        {
            double m = start[c + 1] - start[c];
            sum += m * m;
        }
        return sum / Math.Max(grid.Count, 1);
    }

    private static void AssembleFaces(VoronoiCells cells, int[] index, int[] order, FaceBuffer[] chunkFaces, int chunk)
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
                int i = index[order[k]];
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
