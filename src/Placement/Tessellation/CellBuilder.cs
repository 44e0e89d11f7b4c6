using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using Placement.Spatial;

namespace Placement.Tessellation;

/// <summary>
/// Per-worker state of <see cref="VoronoiTessellation"/>: one <see cref="ConvexCell"/>, one neighbour search and
/// the per-face scratch, reused for every cell of the worker's chunk.
/// </summary>
internal sealed class CellBuilder
{
    private static readonly int[] BoxCodes = [CellFaceCodes.WallMinX, CellFaceCodes.WallMaxX, CellFaceCodes.WallMinY, CellFaceCodes.WallMaxY, CellFaceCodes.WallMinZ, CellFaceCodes.WallMaxZ];
    private static readonly int[] SphereCodes = [CellFaceCodes.SphereSurface, CellFaceCodes.SphereSurface, CellFaceCodes.SphereSurface, CellFaceCodes.SphereSurface, CellFaceCodes.SphereSurface, CellFaceCodes.SphereSurface];

    private readonly PointGrid? _grid;
    private readonly KdTree? _tree;
    private readonly double _firstRadius;
    private readonly double[] _px, _py, _pz;
    private readonly int[] _index;
    private readonly TessellationDomain _domain;
    private readonly TessellationOptions _options;
    private readonly VoronoiCells _cells;
    private readonly ConvexCell _cell = new();
    private readonly NeighbourBuffer _buffer = new(256);
    private readonly double _diagonal2;
    private double _lastSecurity;
    private int[] _order = new int[256];
    private double[] _ballR2 = new double[128];
    private readonly KdTreeSearch? _search;
    private readonly Lazy<FarIndex>? _farTree;

    // A grid cell still unfinished once its shells would pass this multiple of its first shell's radius gathers the rest
    // from the far tree, restricted to the vertex balls: the isotropic shells of the grid would sweep a dense region
    // next to a wedge-shaped cell reaching into a sparse one (the dense side of a large density step).
    private const double FarShellFactor = 3.0;
    private const int FirstNeighbours = 20;
    private readonly int[] _nearSlots = new int[FirstNeighbours];
    private readonly double[] _nearD2 = new double[FirstNeighbours];
    private int[] _bucketOf = new int[256];
    private readonly double _duplicate2, _duplicateFraction2;
    // This cell's duplicate distance², see Build.
    private double _cellDuplicate2;
    private readonly int[] _selfCodes = new int[6];
    private double[] _faceArea = new double[64], _faceH = new double[64];

    /// <summary>
    /// A builder over a uniform grid (<paramref name="tree"/> null) or over a k-d tree (<paramref name="grid"/> null). On the grid,
    /// <paramref name="farTree"/> (built on first use, shared by all builders) serves the far shells of cells that reach far
    /// beyond their first shell.
    /// </summary>
    public CellBuilder(PointGrid? grid, KdTree? tree, TessellationDomain domain, TessellationOptions options, VoronoiCells cells, double spacing,
        Lazy<FarIndex>? farTree = null)
    {
        _grid = grid;
        _tree = tree;
        _farTree = farTree;
        double lx = domain.MaxX - domain.MinX, ly = domain.MaxY - domain.MinY, lz = domain.MaxZ - domain.MinZ;
        _diagonal2 = lx * lx + ly * ly + lz * lz;
        if (tree is not null)
        {
            _px = tree.SortedX; _py = tree.SortedY; _pz = tree.SortedZ; _index = tree.SortedIndex;
            _search = tree.CreateSearch();
            _firstRadius = 2.5 * spacing;
        }
        else
        {
            var g = grid ?? throw new ArgumentNullException(nameof(grid));
            _px = g.SortedX; _py = g.SortedY; _pz = g.SortedZ; _index = g.SortedIndex;
            _firstRadius = 1.3 * Math.Max(g.CellSizeX, Math.Max(g.CellSizeY, g.CellSizeZ));
        }
        _domain = domain;
        _options = options;
        _cells = cells;
        double dup = options.DuplicateTolerance * spacing;
        _duplicate2 = dup * dup;
        _duplicateFraction2 = options.DuplicateTolerance * options.DuplicateTolerance;
    }

    /// <summary>Restarts the per-chunk state: the first shell radius guess and the plane counters.</summary>
    public void BeginChunk()
    {
        _lastSecurity = 0;
        PlanesTested = 0;
        PlanesCut = 0;
        _staged = 0;
    }

    /// <summary>Writes the chunk's last staged results to the result arrays; call after its last <see cref="Build"/>.</summary>
    public void EndChunk() => Flush();

    // A cell's results, staged in processing order and written to the result arrays (indexed by the generator's input
    // index, in no spatial order) StageSize at a time: written from inside the cell loop, those scattered stores cost
    // 5 % of the time at 1e6 points; in a tight loop of their own their misses overlap.
    private struct StagedCell
    {
        public int Self, FaceCount;
        public bool Cut;
        public double Volume, CentroidX, CentroidY, CentroidZ, CentroidOffset, MaxFaceAngleRatio;
    }

    private const int StageSize = 512;
    private readonly StagedCell[] _stage = new StagedCell[StageSize];
    private int _staged;

    private void Flush()
    {
        var c = _cells;
        var volume = c.Volume; var cx = c.CentroidX; var cy = c.CentroidY; var cz = c.CentroidZ;
        var offset = c.CentroidOffset; var faceCount = c.FaceCount; var ratio = c.MaxFaceAngleRatio; var cut = c.CutByDomain;
        var stage = _stage;
        for (int k = 0; k < _staged; k++)
        {
            ref readonly var r = ref stage[k];
            int i = r.Self;
            volume[i] = r.Volume;
            cx[i] = r.CentroidX; cy[i] = r.CentroidY; cz[i] = r.CentroidZ;
            offset[i] = r.CentroidOffset;
            faceCount[i] = r.FaceCount;
            ratio[i] = r.MaxFaceAngleRatio;
            cut[i] = r.Cut;
        }
        _staged = 0;
    }

    public long PlanesTested { get; private set; }

    public long PlanesCut { get; private set; }

    private bool _first;

    public void Build(int slot, FaceBuffer? faces)
    {
        int self = _index[slot];
        double gx = _px[slot], gy = _py[slot], gz = _pz[slot];
        var d = _domain;
        var cell = _cell;
        if (d.Kind == DomainKind.PeriodicBox)
        {
            // The cell lies within half a period of its generator: the bisectors with its own images.
            var g = _grid!;
            Array.Fill(_selfCodes, self);
            double hx = 0.5 * g.LengthX, hy = 0.5 * g.LengthY, hz = 0.5 * g.LengthZ;
            cell.InitBox(-hx, -hy, -hz, hx, hy, hz, _selfCodes);
        }
        else
        {
            cell.InitBox(d.MinX - gx, d.MinY - gy, d.MinZ - gz, d.MaxX - gx, d.MaxY - gy, d.MaxZ - gz,
                d.Kind == DomainKind.Sphere ? SphereCodes : BoxCodes);
        }
        cell.Tolerance = _options.ClipTolerance * Math.Sqrt(cell.MaxRadiusSquared);
        _first = true;
        // Duplicates: closer than the tolerance times the mean spacing, or times the generator's distance from the
        // coordinate origin where that is less: near a steep cusp at the origin points legitimately lie far closer
        // together than any fraction of the mean spacing (an invented r^-2.9 cusp, 2e4 points: 8e-12 apart, mean spacing
        // 0.6), and coordinates there carry that much more precision.
        _cellDuplicate2 = Math.Min(_duplicate2, _duplicateFraction2 * (gx * gx + gy * gy + gz * gz));
        ClipByShells(slot, self, gx, gy, gz);
        if (d.Kind == DomainKind.Sphere) ClipToSphere(gx, gy, gz, _options.SphereTolerance);
        // Volume, centroid and face areas from the corners of the cell's edge table (independent of each other, no face walked
        // in order); the mass quadrature and cells of over 64 planes use built rings.
        if (_cells.Mass is null && cell.PrepareFaceWalk()) MeasureByCorners(self, gx, gy, gz, faces);
        else
        {
            cell.BuildFaceRings();
            Measure(cell.FaceRings, self, gx, gy, gz, faces);
        }
    }

    // Neighbours from the grid or the tree in growing shells [r0, r1): the first radius follows the previous cell's
    // security radius (consecutive cells are neighbours in space, so of similar size), later ones the current cell's.
    private void ClipByShells(int slot, int self, double gx, double gy, double gz)
    {
        var g = _grid;
        var cell = _cell;
        double inner2 = 0;
        double outer = _lastSecurity > 0 ? _lastSecurity : _firstRadius;
        if (_search is not null)
        {
            // On the tree (strongly uneven sets) the previous cell says little about this one: its security radius may
            // span a dense region next to a sparse one. Start from the local spacing instead: 1.5 × the distance to the
            // FirstNeighbours-th nearest point.
            int found = _search.Nearest(gx, gy, gz, self, _nearSlots, _nearD2);
            if (found > 0) outer = 1.5 * Math.Sqrt(_nearD2[found - 1]);
        }
        var buffer = _buffer;
        bool preclipped = false, wentFar = false;
        // The tree this cell gathers from (its slot in it: treeSlot): the tree path's own, or on the grid the far tree once
        // the grid proved too coarse here; null while the cell gathers from the grid.
        KdTree? cellTree = _tree;
        int treeSlot = slot;
        if (g is not null && _farTree is not null && OwnGridCellCount(g, gx, gy, gz) > CrowdedGridCell)
            outer = SwitchToFarTree(self, gx, gy, gz, out cellTree, out treeSlot);
        double first = outer;
        // Candidates the grid shells of this cell returned: until there are a cell's worth (FirstNeighbours), the cell may
        // still span much of the domain, so vertex balls would not narrow a far gather.
        int fromGrid = 0;
        while (true)
        {
            double outer2 = outer * outer;
            buffer.Clear();
            KdTree? tree = null;
            if (inner2 > 0)
            {
                // Later shells from a tree (the tree path, a grid cell handed to the far tree, or the far tree of a grid cell
                // that reaches far): only where a point can still cut the cell, inside a ball centred at a vertex through
                // the generator (slightly enlarged against rounding).
                tree = cellTree;
                if (tree is null && _farTree is not null && outer > FarShellFactor * first)
                {
                    if (fromGrid < FirstNeighbours)
                    {
                        // Too few neighbours to bound the cell (a sparse region next to a dense one, entered with the
                        // dense side's small radius): start over from the far tree and the local spacing.
                        outer = first = SwitchToFarTree(self, gx, gy, gz, out cellTree, out treeSlot);
                        inner2 = 0;
                        continue;
                    }
                    tree = _farTree.Value.Tree;
                }
            }
            if (tree is null)
            {
                if (cellTree is not null) cellTree.CollectInShell(gx, gy, gz, inner2, outer2, treeSlot, buffer);
                else
                {
                    g!.CollectInShell(gx, gy, gz, inner2, outer2, slot, buffer);
                    if (buffer.Count > CrowdedShell && _farTree is not null)
                    {
                        // Far more candidates than a cell has neighbours: the density changes steeply on the grid's scale
                        // (next to a cusp or a dense core), and near-first order would test most of them. Gather this
                        // shell again from the far tree (from the local spacing if the cell is not yet bounded).
                        double start = SwitchToFarTree(self, gx, gy, gz, out cellTree, out treeSlot);
                        if (fromGrid < FirstNeighbours)
                        {
                            inner2 = 0;
                            outer = first = start;
                        }
                        continue;
                    }
                    fromGrid += buffer.Count;
                }
            }
            else
            {
                var vr2 = cell.VertexRadiusSquared;
                if (_ballR2.Length < vr2.Length) _ballR2 = new double[Math.Max(vr2.Length, 2 * _ballR2.Length)];
                for (int k = 0; k < vr2.Length; k++) _ballR2[k] = vr2[k] * (1 + 1e-6);
                int exclude = tree == cellTree ? treeSlot : _farTree!.Value.SlotOf[self];
                wentFar |= tree != cellTree;
                tree.CollectInShellNearBalls(gx, gy, gz, inner2, outer2, exclude, buffer, cell.Vx, cell.Vy, cell.Vz, _ballR2.AsSpan(0, vr2.Length));
            }
            var gathered = tree ?? cellTree;
            var index = gathered is null ? _index : gathered.SortedIndex;
            var order = tree is not null ? DeepestCutFirstOrder(buffer, cell) : NearFirstOrder(buffer, inner2, outer2);
            var dist2 = buffer.DistanceSquared; var slotOf = buffer.Slot; var bx = buffer.Dx; var by = buffer.Dy; var bz = buffer.Dz;
            for (int k = 0; k < order.Length; k++)
            {
                int q = order[k];
                double d2 = dist2[q];
                if (d2 >= 4.0 * cell.MaxRadiusSquared) continue;
                ClipBy(bx[q], by[q], bz[q], d2, self, index[slotOf[q]], gx, gy, gz);
            }
            double security2 = 4.0 * cell.MaxRadiusSquared;
            // A NaN extent would never meet the loop's exits: fail loudly instead of spinning.
            if (!double.IsFinite(security2)) throw new InvalidOperationException("A cell vertex is not finite (degenerate planes).");
            if (security2 > outer2 && _domain.Kind == DomainKind.Sphere && !preclipped)
            {
                PreclipToSphere(gx, gy, gz);
                preclipped = true;
                security2 = 4.0 * cell.MaxRadiusSquared;
            }
            if (security2 <= outer2 || (_domain.Kind != DomainKind.PeriodicBox && outer2 > _diagonal2)) break;
            inner2 = outer2;
            // Slightly beyond the security radius so rounding in √ cannot leave an empty last shell forever. A tree gather
            // is limited to where points can still cut, so it reaches the security radius at once; the grid's isotropic
            // shells at most double per round.
            double reach = Math.Sqrt(security2) * (1 + 1e-9);
            bool farNext = cellTree is null && _farTree is not null && fromGrid >= FirstNeighbours && 2.0 * outer > FarShellFactor * first;
            outer = tree is not null || farNext ? reach : Math.Min(reach, 2.0 * outer);
        }
        // The next cell starts from FirstShellFactor times this one's security radius (neighbours in space, so of similar
        // size), at most FarShellFactor times this one's start, and not at all from a cell that reached far: its radius would
        // sweep the dense region around the next cell.
        if (!wentFar) _lastSecurity = Math.Min(FirstShellFactor * 2.0 * Math.Sqrt(cell.MaxRadiusSquared), FarShellFactor * first);
    }

    // The next cell's first shell over this cell's security radius: a little beyond it, so fewer cells need a second
    // shell (which re-scans the first one's rows). 3e5 uniform points, one thread: 1.1 about 3 % faster than 1.0; 0.9 and 1.2
    // were worse or no better.
    private const double FirstShellFactor = 1.1;

    // A grid cell holding more than this many points (the grid sizes cells for about 1.5) marks a region far denser than
    // the grid resolves (a cusp or a dense core): its cells gather from the far tree.
    private const int CrowdedGridCell = 24;

    // Candidates in one grid shell beyond which the cell gathers from the far tree instead (about 50 in a first shell
    // of points of even density).
    private const int CrowdedShell = 400;

    private static int OwnGridCellCount(PointGrid g, double x, double y, double z)
    {
        int c = g.CellOf(x, y, z);
        return g.CellStart[c + 1] - g.CellStart[c];
    }

    private KdTreeSearch? _farSearch;

    // Hands a grid cell over to the far tree: its slot there and, as on the tree path, the first shell radius from the
    // local spacing (1.5 × the distance to the FirstNeighbours-th nearest point).
    private double SwitchToFarTree(int self, double gx, double gy, double gz, out KdTree tree, out int treeSlot)
    {
        var far = _farTree!.Value;
        tree = far.Tree;
        treeSlot = far.SlotOf[self];
        _farSearch ??= tree.CreateSearch();
        int found = _farSearch.Nearest(gx, gy, gz, treeSlot, _nearSlots, _nearD2);
        return found > 0 ? 1.5 * Math.Sqrt(_nearD2[found - 1]) : _firstRadius;
    }

    // Relative excess radius of the coarse tangent-plane pre-clip.
    private const double PreclipTolerance = 0.02;

    /// <summary>
    /// In a ball, a cell still unfinished after its first neighbours usually reaches out of the ball (a surface cell
    /// of a steep envelope, or one next to the empty corners of the bounding cube); its security radius would then
    /// sweep much of the body. Tangent planes to within R(1 + 0.02) bound it first; they are planes the final
    /// tangent-plane pass could have added (each is tangent to the ball), so the cell still contains its part of the
    /// ball and ends within R(1 + δ).
    /// </summary>
    private void PreclipToSphere(double gx, double gy, double gz)
    {
        if (PreclipTolerance > _options.SphereTolerance) ClipToSphere(gx, gy, gz, PreclipTolerance);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void ClipBy(double dx, double dy, double dz, double d2, int self, int other, double gx, double gy, double gz)
    {
        if (d2 <= _cellDuplicate2) ThrowDuplicate(self, other, d2, gx, gy, gz);
        double distance = Math.Sqrt(d2);
        if (_first)
        {
            // Tolerance from the first (near-nearest) neighbour: rounding scales with the cell size.
            _cell.Tolerance = _options.ClipTolerance * distance;
            _first = false;
        }
        PlanesTested++;
        // Callers pass only points closer than twice the farthest vertex (see ClipByShells), so no quick rejection.
        if (_cell.ClipNear(dx, dy, dz, 0.5 * d2, other, distance)) PlanesCut++;
    }

    private static void ThrowDuplicate(int self, int other, double d2, double gx, double gy, double gz) =>
        throw new ArgumentException(
            $"Points {Math.Min(self, other)} and {Math.Max(self, other)} coincide (distance {Math.Sqrt(d2)} at ({gx}, {gy}, {gz})); a Voronoi tessellation needs distinct generators: remove or merge duplicates first.");

    // Indices of the buffer's neighbours in near-first order: 16 buckets of equal width in d² over the shell
    // [inner², outer²), unsorted within a bucket. Exact order is not needed for correctness (the cell is complete
    // only once every point inside the security radius was used); near-first only keeps the cell small early.
    private ReadOnlySpan<int> NearFirstOrder(NeighbourBuffer buffer, double inner2, double outer2)
    {
        int n = buffer.Count;
        EnsureOrder(n);
        var d2 = buffer.DistanceSquared;
        double scale = Buckets / (outer2 - inner2);
        for (int i = 0; i < n; i++) _bucketOf[i] = Math.Clamp((int)((d2[i] - inner2) * scale), 0, Buckets - 1);
        return BucketOrder(n);
    }

    // Buckets of the near-first and deepest-cut orders (one more, last, for the deepest-cut order's non-cutting points).
    private const int Buckets = 16;

    private void EnsureOrder(int n)
    {
        if (_order.Length < n) { _order = new int[Math.Max(n, 2 * _order.Length)]; _bucketOf = new int[_order.Length]; }
    }

    // Counting sort of 0 … n−1 by _bucketOf (values 0 … Buckets, as both orders write them; n within the arrays, see
    // EnsureOrder), stable within a bucket. The starts are summed in a register: summed in place, each step waited on the
    // store of the one before.
    private ReadOnlySpan<int> BucketOrder(int n)
    {
        Span<int> start = stackalloc int[Buckets + 1];
        start.Clear();
        ref int first = ref MemoryMarshal.GetReference(start);
        ref int bucketOf = ref MemoryMarshal.GetArrayDataReference(_bucketOf);
        ref int order = ref MemoryMarshal.GetArrayDataReference(_order);
        for (int i = 0; i < n; i++) Unsafe.Add(ref first, Unsafe.Add(ref bucketOf, i))++;
        int run = 0;
        for (int k = 0; k <= Buckets; k++)
        {
            int count = Unsafe.Add(ref first, k);
            Unsafe.Add(ref first, k) = run;
            run += count;
        }
        for (int i = 0; i < n; i++) Unsafe.Add(ref order, Unsafe.Add(ref first, Unsafe.Add(ref bucketOf, i))++) = i;
        return _order.AsSpan(0, n);
    }

    // Indices of the buffer's neighbours ordered by how far the cell's farthest vertex lies beyond their bisector, deepest
    // first (16 buckets; those not reaching it last). For a later shell on the tree: a cell that is still a long wedge
    // into a sparse region is capped first by the far point that cuts its tip, after which most of the many nearer
    // points gathered beside it fail the cheap security test instead of each trimming the tip a little.
    private ReadOnlySpan<int> DeepestCutFirstOrder(NeighbourBuffer buffer, ConvexCell cell)
    {
        int n = buffer.Count;
        EnsureOrder(n);
        var vr2 = cell.VertexRadiusSquared;
        int far = 0;
        for (int t = 1; t < vr2.Length; t++) if (vr2[t] > vr2[far]) far = t;
        double fx = cell.Vx[far], fy = cell.Vy[far], fz = cell.Vz[far];
        var d2 = buffer.DistanceSquared; var bx = buffer.Dx; var by = buffer.Dy; var bz = buffer.Dz;
        if (_depth.Length < n) _depth = new double[_order.Length];
        double top = 0;
        for (int i = 0; i < n; i++)
        {
            // (q·v − |q|²/2)/|q|: the distance of v beyond the bisector of q (negative: v is kept).
            double depth = (bx[i] * fx + by[i] * fy + bz[i] * fz - 0.5 * d2[i]) / Math.Sqrt(d2[i]);
            _depth[i] = depth;
            top = Math.Max(top, depth);
        }
        double scale = top > 0 ? Buckets / top : 0;
        // Bucket 0 holds the deepest cuts; bucket `Buckets` those that do not reach the farthest vertex.
        for (int i = 0; i < n; i++) _bucketOf[i] = _depth[i] > 0 ? Math.Clamp((int)((top - _depth[i]) * scale), 0, Buckets - 1) : Buckets;
        return BucketOrder(n);
    }

    private double[] _depth = new double[256];

    private void ClipToSphere(double gx, double gy, double gz, double tolerance)
    {
        var d = _domain;
        var cell = _cell;
        double r = d.Radius, limit2 = r * r * (1 + tolerance) * (1 + tolerance);
        double ox = gx - d.CenterX, oy = gy - d.CenterY, oz = gz - d.CenterZ;
        for (int iteration = 0; iteration < 100_000; iteration++)
        {
            var vx = cell.Vx; var vy = cell.Vy; var vz = cell.Vz;
            double best = -1; int bestT = -1;
            for (int t = 0; t < vx.Length; t++)
            {
                double px = vx[t] + ox, py = vy[t] + oy, pz = vz[t] + oz;
                double q = px * px + py * py + pz * pz;
                if (q > best) { best = q; bestT = t; }
            }
            if (best <= limit2) return;
            double len = Math.Sqrt(best);
            double nx = (vx[bestT] + ox) / len, ny = (vy[bestT] + oy) / len, nz = (vz[bestT] + oz) / len;
            // Tangent plane n·(x − c) ≤ R, in generator-relative coordinates n·v ≤ R − n·(g − c).
            if (!cell.Clip(nx, ny, nz, r - (nx * ox + ny * oy + nz * oz), CellFaceCodes.SphereSurface))
                throw new InvalidOperationException($"A tangent plane failed to cut a vertex at distance {len} of a sphere of radius {r}.");
        }
        throw new InvalidOperationException("Sphere clipping did not converge; raise SphereTolerance.");
    }

    private const double OneThird = 1.0 / 3.0;

    // Generic over the walk, so each is compiled with its own inlined steps.
    private void Measure<TWalk>(TWalk walk, int self, double gx, double gy, double gz, FaceBuffer? faces) where TWalk : struct, IFaceWalk
    {
        var cell = _cell;
        int planes = cell.PlaneCount;
        EnsureFaceScratch(planes);
        var nx = cell.Nx; var ny = cell.Ny; var nz = cell.Nz; var dd = cell.D;
        var vx = cell.Vx; var vy = cell.Vy; var vz = cell.Vz;
        double volume = 0, mx = 0, my = 0, mz = 0;
        // Locals, so the stores below do not make the JIT reload the fields.
        var faceArea = _faceArea; var faceH = _faceH;
        for (int p = 0; p < planes; p++)
        {
            faceArea[p] = 0;
            // A fan from the face's first vertex t0 over each further pair (t1, t2); a face of fewer than three vertices
            // has none and no area.
            int t0 = walk.Start(p);
            if (t0 < 0) continue;
            int t1 = walk.Next();
            if (t1 < 0) continue;
            double norm = Math.Sqrt(nx[p] * nx[p] + ny[p] * ny[p] + nz[p] * nz[p]);
            double inv = 1.0 / norm;
            double ux = nx[p] * inv, uy = ny[p] * inv, uz = nz[p] * inv;
            double ax = vx[t0], ay = vy[t0], az = vz[t0];
            double area = 0, cx = 0, cy = 0, cz = 0;
            for (int t2 = walk.Next(); t2 >= 0; t1 = t2, t2 = walk.Next())
            {
                double bx = vx[t1] - ax, by = vy[t1] - ay, bz = vz[t1] - az;
                double qx = vx[t2] - ax, qy = vy[t2] - ay, qz = vz[t2] - az;
                // Signed area along the face normal (consistent sign for a convex face).
                double a2 = (by * qz - bz * qy) * ux + (bz * qx - bx * qz) * uy + (bx * qy - by * qx) * uz;
                area += a2;
                cx += a2 * (vx[t1] + vx[t2]);
                cy += a2 * (vy[t1] + vy[t2]);
                cz += a2 * (vz[t1] + vz[t2]);
            }
            if (area == 0) continue;
            // Face centroid = a + Σ a_k (b_k + c_k − 2a)/(3 Σ a_k) with b, c absolute: fold the a terms in. One division
            // per face.
            double perArea = 1.0 / area;
            double fcx = (cx * perArea + ax) * OneThird, fcy = (cy * perArea + ay) * OneThird, fcz = (cz * perArea + az) * OneThird;
            area = 0.5 * Math.Abs(area);
            double h = dd[p] * inv;
            double vf = area * h * OneThird;
            volume += vf;
            mx += vf * fcx; my += vf * fcy; mz += vf * fcz;
            faceArea[p] = area;
            faceH[p] = h;
        }
        // Pyramid over face f with apex at the generator (origin): centroid ¾ c_f.
        Finish(self, gx, gy, gz, faces, volume, 0.75 * mx / volume, 0.75 * my / volume, 0.75 * mz / volume);
    }

    // Per-face scratch for at least `planes` faces, grown to a multiple of eight (MeasureByCorners' whole vectors; a length
    // left otherwise by the ring path would send every later cell of this worker down the scalar loops).
    private void EnsureFaceScratch(int planes)
    {
        if (_faceArea.Length >= planes) return;
        int m = (Math.Max(planes, 2 * _faceArea.Length) + 7) & ~7;
        _faceArea = new double[m]; _faceH = new double[m];
    }

    // Volume and centroid from the corner tetrahedra (ConvexCell.MeasureByCorners), face areas from the same sums.
    private void MeasureByCorners(int self, double gx, double gy, double gz, FaceBuffer? faces)
    {
        var cell = _cell;
        int planes = cell.PlaneCount;
        EnsureFaceScratch(planes);
        var faceArea = _faceArea; var faceH = _faceH;
        double volume = cell.MeasureByCorners(faceArea, faceH, out double mx, out double my, out double mz);
        // The corner sums carry the orientation's sign; the centroid, a ratio of two of them, does not.
        Finish(self, gx, gy, gz, faces, Math.Abs(volume), mx / volume, my / volume, mz / volume);
    }

    private void Finish(int self, double gx, double gy, double gz, FaceBuffer? faces, double volume, double cxr, double cyr, double czr)
    {
        var cell = _cell;
        int planes = cell.PlaneCount;
        var faceArea = _faceArea; var faceH = _faceH;
        double cbrt = Math.Cbrt(volume);
        double minArea = _options.FaceAreaTolerance * cbrt * cbrt;
        int faceCount = 0;
        bool cut = false;
        // The largest √(A_f/π)/h_f over faces between generators, as the largest A_f/h_f² (one square root per cell).
        double worst2 = 0;
        var neighbour = cell.Neighbour;
        for (int p = 0; p < planes; p++)
        {
            double area = faceArea[p];
            if (!(area > minArea)) continue;
            faceCount++;
            int code = neighbour[p];
            if (code < 0) cut = true;
            else worst2 = Math.Max(worst2, area / (faceH[p] * faceH[p]));
            faces?.Add(code, area);
        }
        double worst = Math.Sqrt(worst2 / Math.PI);
        var c = _cells;
        if (_staged == StageSize) Flush();
        ref var r = ref _stage[_staged++];
        r.Self = self;
        r.Volume = volume;
        r.CentroidX = gx + cxr;
        r.CentroidY = gy + cyr;
        r.CentroidZ = gz + czr;
        r.CentroidOffset = Math.Sqrt(cxr * cxr + cyr * cyr + czr * czr);
        r.FaceCount = faceCount;
        r.MaxFaceAngleRatio = worst;
        r.Cut = cut;
        if (c.Mass is not null)
            c.Mass[self] = CellMassQuadrature.CellMass(cell, gx, gy, gz, _options.MassProfile!, _options.MassQuadratureAngle);
    }
}
