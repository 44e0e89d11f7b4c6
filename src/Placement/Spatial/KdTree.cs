namespace Placement.Spatial;

/// <summary>
/// A k-d tree over a set of 3-D points for exact nearest-first neighbour queries whose cost does not depend on
/// how unevenly the points are spread (stellar profiles span many decades of density, which defeats uniform grids).
/// </summary>
/// <remarks>
/// <para>Build: the node's points are split at the median of the widest axis of their bounding box (quickselect),
/// recursively, until a node holds at most <see cref="LeafSize"/> points; O(N log N). Points are copied into tree
/// order, so a leaf's points are contiguous and nearby points are nearby in memory.</para>
/// <para>Layout: node k has bounding box [<c>BoxMin{X,Y,Z}[k]</c>, <c>BoxMax{X,Y,Z}[k]</c>], sorted slots
/// [<c>NodeStart[k]</c>, <c>NodeEnd[k]</c>) and children <c>Left[k]</c>, <c>Right[k]</c> (−1 for a leaf). The point in
/// slot s sits at (<see cref="SortedX"/>[s], <see cref="SortedY"/>[s], <see cref="SortedZ"/>[s]) and has original
/// index <see cref="SortedIndex"/>[s]. Memory: 3 × 8 + 4 = 28 bytes per point plus about 64 bytes per node
/// (N / LeafSize × 2 nodes), ≈ 44 bytes per point at leaf size 8.</para>
/// <para>Queries use <see cref="KdTreeSearch"/> (best-first incremental search, Hjaltason &amp; Samet 1999,
/// ACM TODS 24, 265).</para>
/// </remarks>
public sealed class KdTree
{
    /// <summary>Builds the tree over the points.</summary>
    /// <param name="x">x coordinates, length units.</param>
    /// <param name="y">y coordinates.</param>
    /// <param name="z">z coordinates.</param>
    /// <param name="leafSize">Largest number of points in a leaf (default 8).</param>
    /// <exception cref="ArgumentException">Spans differ in length or hold a non-finite coordinate.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="leafSize"/> &lt; 1.</exception>
    public KdTree(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z, int leafSize = 8)
    {
        if (y.Length != x.Length || z.Length != x.Length)
            throw new ArgumentException($"Coordinate spans differ in length: x {x.Length}, y {y.Length}, z {z.Length}.", nameof(y));
        ArgumentOutOfRangeException.ThrowIfLessThan(leafSize, 1);
        int n = x.Length;
        Count = n;
        LeafSize = leafSize;
        SortedX = new double[n];
        SortedY = new double[n];
        SortedZ = new double[n];
        SortedIndex = new int[n];
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(x[i]) || !double.IsFinite(y[i]) || !double.IsFinite(z[i]))
                throw new ArgumentException($"Point {i} has a non-finite coordinate ({x[i]}, {y[i]}, {z[i]}).", nameof(x));
            SortedX[i] = x[i];
            SortedY[i] = y[i];
            SortedZ[i] = z[i];
            SortedIndex[i] = i;
        }
        // Median splits stop at ≤ leafSize points, so every leaf of a split node holds ≥ ⌊(leafSize+1)/2⌋ points.
        int minLeaf = Math.Max(1, (leafSize + 1) / 2);
        int capacity = 2 * (n / minLeaf + 1) + 1;
        BoxMinX = new double[capacity]; BoxMinY = new double[capacity]; BoxMinZ = new double[capacity];
        BoxMaxX = new double[capacity]; BoxMaxY = new double[capacity]; BoxMaxZ = new double[capacity];
        NodeStart = new int[capacity]; NodeEnd = new int[capacity];
        Left = new int[capacity]; Right = new int[capacity];
        if (n > 0) Build(0, n);
    }

    /// <summary>Number of points.</summary>
    public int Count { get; }

    /// <summary>Largest number of points in a leaf.</summary>
    public int LeafSize { get; }

    /// <summary>Number of nodes; node 0 is the root.</summary>
    public int NodeCount { get; private set; }

    /// <summary>x of the points in tree order.</summary>
    public double[] SortedX { get; }

    /// <summary>y of the points in tree order.</summary>
    public double[] SortedY { get; }

    /// <summary>z of the points in tree order.</summary>
    public double[] SortedZ { get; }

    /// <summary>Original index of the point in each slot.</summary>
    public int[] SortedIndex { get; }

    internal double[] BoxMinX { get; }
    internal double[] BoxMinY { get; }
    internal double[] BoxMinZ { get; }
    internal double[] BoxMaxX { get; }
    internal double[] BoxMaxY { get; }
    internal double[] BoxMaxZ { get; }
    internal int[] NodeStart { get; }
    internal int[] NodeEnd { get; }
    internal int[] Left { get; }
    internal int[] Right { get; }

    /// <summary>
    /// Appends to <paramref name="buffer"/> every point whose squared distance d² from (x, y, z) satisfies
    /// <paramref name="innerSquared"/> ≤ d² &lt; <paramref name="outerSquared"/>, unsorted, except sorted slot
    /// <paramref name="excludeSlot"/>; returns how many were added. Calling it with growing shells [r₀, r₁), [r₁, r₂), …
    /// gathers each point exactly once.
    /// </summary>
    /// <remarks>
    /// Depth-first over the nodes whose box meets the shell (nearest box distance below the outer radius, farthest
    /// corner at or beyond the inner one); a leaf's points are one contiguous branch-free scan. Cost: the leaves
    /// meeting the shell, whatever the density contrast of the set.
    /// </remarks>
    /// <param name="x">Query x, length units.</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="innerSquared">Inclusive lower limit on d², length².</param>
    /// <param name="outerSquared">Exclusive upper limit on d², length².</param>
    /// <param name="excludeSlot">Sorted slot (not original index) to skip, or −1.</param>
    /// <param name="buffer">Receives the neighbours (not cleared); its slots are this tree's sorted slots.</param>
    /// <exception cref="ArgumentNullException"><paramref name="buffer"/> is null.</exception>
    public int CollectInShell(double x, double y, double z, double innerSquared, double outerSquared, int excludeSlot, NeighbourBuffer buffer)
    {
        ArgumentNullException.ThrowIfNull(buffer);
        return CollectInShellNearBalls(x, y, z, innerSquared, outerSquared, excludeSlot, buffer, [], [], [], []);
    }

    private static double Near(double q, double lo, double hi) => q < lo ? lo - q : q > hi ? q - hi : 0.0;

    /// <summary>
    /// <see cref="CollectInShell"/> restricted to the union of the balls centred at <paramref name="cx"/>,
    /// <paramref name="cy"/>, <paramref name="cz"/> (relative to the query) with squared radii <paramref name="cr2"/>:
    /// subtrees whose box meets none of them are skipped, points are filtered by the shell only. For a convex Voronoi
    /// cell with vertices v (relative to its generator) the balls B(v, |v|) hold every point whose bisector can still cut
    /// it, so an elongated cell reaching into a sparse region does not gather the whole dense region its isotropic
    /// security ball would cover. No balls: no restriction.
    /// </summary>
    internal int CollectInShellNearBalls(double x, double y, double z, double innerSquared, double outerSquared, int excludeSlot, NeighbourBuffer buffer,
        ReadOnlySpan<double> cx, ReadOnlySpan<double> cy, ReadOnlySpan<double> cz, ReadOnlySpan<double> cr2)
    {
        if (!(outerSquared > innerSquared) || NodeCount == 0) return 0;
        int before = buffer.Count;
        Span<int> stack = stackalloc int[128];
        int top = 0;
        stack[top++] = 0;
        while (top > 0)
        {
            int node = stack[--top];
            double lx = BoxMinX[node] - x, hx = BoxMaxX[node] - x, ly = BoxMinY[node] - y, hy = BoxMaxY[node] - y, lz = BoxMinZ[node] - z, hz = BoxMaxZ[node] - z;
            double nx = Near(0, lx, hx), ny = Near(0, ly, hy), nz = Near(0, lz, hz);
            if (nx * nx + ny * ny + nz * nz >= outerSquared) continue;
            double fx = Math.Max(-lx, hx), fy = Math.Max(-ly, hy), fz = Math.Max(-lz, hz);
            if (fx * fx + fy * fy + fz * fz < innerSquared) continue;
            bool meets = cx.Length == 0;
            for (int k = 0; k < cx.Length && !meets; k++)
            {
                double ex = Near(cx[k], lx, hx), ey = Near(cy[k], ly, hy), ez = Near(cz[k], lz, hz);
                meets = ex * ex + ey * ey + ez * ez < cr2[k];
            }
            if (!meets) continue;
            int left = Left[node];
            if (left < 0)
            {
                buffer.AppendRange(SortedX, SortedY, SortedZ, NodeStart[node], NodeEnd[node], -x, -y, -z, innerSquared, outerSquared, excludeSlot);
                continue;
            }
            stack[top++] = Right[node];
            stack[top++] = left;
        }
        return buffer.Count - before;
    }

    /// <summary>A reusable query over this tree (one per thread).</summary>
    public KdTreeSearch CreateSearch() => new(this);

    /// <summary>Asserts the tree's invariants: every slot once, every point inside its leaf's box, children partition their parent.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken.</exception>
    public void CheckValidity()
    {
        var seen = new bool[Count];
        foreach (int i in SortedIndex)
        {
            if (seen[i]) throw new InvalidOperationException($"Point {i} appears twice in the tree.");
            seen[i] = true;
        }
        for (int k = 0; k < NodeCount; k++)
        {
            for (int s = NodeStart[k]; s < NodeEnd[k]; s++)
                if (SortedX[s] < BoxMinX[k] || SortedX[s] > BoxMaxX[k] || SortedY[s] < BoxMinY[k] || SortedY[s] > BoxMaxY[k]
                    || SortedZ[s] < BoxMinZ[k] || SortedZ[s] > BoxMaxZ[k])
                    throw new InvalidOperationException($"Slot {s} lies outside the box of node {k}.");
            if (Left[k] >= 0 && (NodeStart[Left[k]] != NodeStart[k] || NodeEnd[Right[k]] != NodeEnd[k] || NodeEnd[Left[k]] != NodeStart[Right[k]]))
                throw new InvalidOperationException($"The children of node {k} do not partition it.");
        }
    }

    private int Build(int start, int end)
    {
        int node = NodeCount++;
        NodeStart[node] = start;
        NodeEnd[node] = end;
        double minX = double.MaxValue, minY = double.MaxValue, minZ = double.MaxValue;
        double maxX = double.MinValue, maxY = double.MinValue, maxZ = double.MinValue;
        for (int s = start; s < end; s++)
        {
            double px = SortedX[s], py = SortedY[s], pz = SortedZ[s];
            if (px < minX) minX = px; if (px > maxX) maxX = px;
            if (py < minY) minY = py; if (py > maxY) maxY = py;
            if (pz < minZ) minZ = pz; if (pz > maxZ) maxZ = pz;
        }
        BoxMinX[node] = minX; BoxMinY[node] = minY; BoxMinZ[node] = minZ;
        BoxMaxX[node] = maxX; BoxMaxY[node] = maxY; BoxMaxZ[node] = maxZ;
        if (end - start <= LeafSize || (maxX == minX && maxY == minY && maxZ == minZ))
        {
            Left[node] = -1;
            Right[node] = -1;
            return node;
        }
        double ex = maxX - minX, ey = maxY - minY, ez = maxZ - minZ;
        double[] axis = ex >= ey && ex >= ez ? SortedX : ey >= ez ? SortedY : SortedZ;
        int mid = start + (end - start) / 2;
        Select(axis, start, end - 1, mid);
        Left[node] = Build(start, mid);
        Right[node] = Build(mid, end);
        return node;
    }

    /// <summary>Quickselect: puts the k-th smallest of key[lo..hi] at k, smaller keys before, larger after.</summary>
    private void Select(double[] key, int lo, int hi, int k)
    {
        while (hi > lo)
        {
            // Median of three keeps lattices and sorted inputs from the quadratic case.
            int m = lo + (hi - lo) / 2;
            if (key[m] < key[lo]) Swap(m, lo);
            if (key[hi] < key[lo]) Swap(hi, lo);
            if (key[hi] < key[m]) Swap(hi, m);
            double pivot = key[m];
            int i = lo, j = hi;
            while (i <= j)
            {
                while (key[i] < pivot) i++;
                while (key[j] > pivot) j--;
                if (i <= j) { Swap(i, j); i++; j--; }
            }
            if (k <= j) hi = j;
            else if (k >= i) lo = i;
            else return;
        }
    }

    private void Swap(int a, int b)
    {
        (SortedX[a], SortedX[b]) = (SortedX[b], SortedX[a]);
        (SortedY[a], SortedY[b]) = (SortedY[b], SortedY[a]);
        (SortedZ[a], SortedZ[b]) = (SortedZ[b], SortedZ[a]);
        (SortedIndex[a], SortedIndex[b]) = (SortedIndex[b], SortedIndex[a]);
    }
}
