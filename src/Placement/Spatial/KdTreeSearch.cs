using System.Runtime.CompilerServices;

namespace Placement.Spatial;

/// <summary>
/// Incremental nearest-first enumeration of the points of a <see cref="KdTree"/> around a query position: each call
/// of <see cref="Next"/> returns the next nearest point. One instance per thread, reused across queries; allocates
/// nothing after warm-up.
/// </summary>
/// <remarks>
/// Best-first search (Hjaltason &amp; Samet 1999, ACM TODS 24, 265): one binary min-heap holds tree nodes keyed by
/// the squared distance from the query to their bounding box and points keyed by their squared distance; popping
/// a point returns it, popping a node pushes its children (or, for a leaf, its points). Because a node's key is a
/// lower bound for everything inside it, points come out in exact order of distance. A caller that lowers its
/// limit as it learns (a Voronoi cell's security radius, an SPH support) passes a non-increasing
/// <c>maxDistanceSquared</c>; entries beyond it are then never pushed.
/// </remarks>
public sealed class KdTreeSearch
{
    private readonly KdTree _tree;
    private double _qx, _qy, _qz;
    private int _exclude;
    private double[] _key = new double[64];
    private int[] _id = new int[64];
    private int _count;

    /// <summary>Creates a reusable search over <paramref name="tree"/>.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="tree"/> is null.</exception>
    public KdTreeSearch(KdTree tree)
    {
        ArgumentNullException.ThrowIfNull(tree);
        _tree = tree;
    }

    /// <summary>Starts a new query at (x, y, z), leaving out the point with original index <paramref name="exclude"/> (−1: none).</summary>
    public void Start(double x, double y, double z, int exclude)
    {
        _qx = x; _qy = y; _qz = z;
        _exclude = exclude;
        _count = 0;
        if (_tree.NodeCount > 0) Push(NodeDistanceSquared(0), 0);
    }

    /// <summary>
    /// Returns the next nearest point with squared distance below <paramref name="maxDistanceSquared"/>, or false when
    /// there is none. Pass a non-increasing limit over the calls of one query.
    /// </summary>
    public bool Next(double maxDistanceSquared, out NeighbourHit hit)
    {
        var t = _tree;
        while (_count > 0)
        {
            double key = _key[0];
            if (key >= maxDistanceSquared) break;
            int id = _id[0];
            Pop();
            if (id < 0)
            {
                int slot = ~id;
                hit = new NeighbourHit(slot, key, t.SortedX[slot] - _qx, t.SortedY[slot] - _qy, t.SortedZ[slot] - _qz);
                return true;
            }
            int left = t.Left[id];
            if (left < 0)
            {
                var xs = t.SortedX; var ys = t.SortedY; var zs = t.SortedZ;
                for (int s = t.NodeStart[id], end = t.NodeEnd[id]; s < end; s++)
                {
                    double dx = xs[s] - _qx, dy = ys[s] - _qy, dz = zs[s] - _qz;
                    double d2 = dx * dx + dy * dy + dz * dz;
                    if (d2 < maxDistanceSquared && t.SortedIndex[s] != _exclude) Push(d2, ~s);
                }
            }
            else
            {
                double dl = NodeDistanceSquared(left);
                if (dl < maxDistanceSquared) Push(dl, left);
                int right = t.Right[id];
                double dr = NodeDistanceSquared(right);
                if (dr < maxDistanceSquared) Push(dr, right);
            }
        }
        _count = 0;
        hit = default;
        return false;
    }

    /// <summary>
    /// The k = <c>slots.Length</c> nearest points to (x, y, z) other than <paramref name="exclude"/>, sorted by distance:
    /// depth-first descent, nearer child first, pruning nodes farther than the current k-th distance (a bounded max-heap).
    /// Faster than <see cref="Next"/> when the number of neighbours is known in advance.
    /// </summary>
    /// <param name="x">Query x, length units.</param>
    /// <param name="y">Query y.</param>
    /// <param name="z">Query z.</param>
    /// <param name="exclude">Original index to leave out, or −1.</param>
    /// <param name="slots">Receives the sorted slots (tree order) of the neighbours; its length is k.</param>
    /// <param name="distanceSquared">Receives their squared distances, ascending; same length as <paramref name="slots"/>.</param>
    /// <returns>How many neighbours were found (less than k only when the tree holds fewer points).</returns>
    /// <exception cref="ArgumentException">The two output spans differ in length.</exception>
    public int Nearest(double x, double y, double z, int exclude, Span<int> slots, Span<double> distanceSquared)
    {
        if (slots.Length != distanceSquared.Length) throw new ArgumentException("Output spans must have the same length.", nameof(distanceSquared));
        int k = slots.Length;
        var t = _tree;
        if (k == 0 || t.NodeCount == 0) return 0;
        _qx = x; _qy = y; _qz = z;
        int found = 0;
        double worst = double.PositiveInfinity;
        // Explicit stack of (node, lower bound); _id/_key double as the stack storage.
        int top = 0;
        EnsureCapacity(64);
        _id[top] = 0; _key[top] = 0; top++;
        var xs = t.SortedX; var ys = t.SortedY; var zs = t.SortedZ;
        while (top > 0)
        {
            top--;
            int node = _id[top];
            if (_key[top] >= worst) continue;
            int left = t.Left[node];
            if (left < 0)
            {
                for (int s = t.NodeStart[node], end = t.NodeEnd[node]; s < end; s++)
                {
                    double dx = xs[s] - x, dy = ys[s] - y, dz = zs[s] - z;
                    double d2 = dx * dx + dy * dy + dz * dz;
                    if (d2 >= worst || t.SortedIndex[s] == exclude) continue;
                    // Insertion into the ascending list (k is small: tens).
                    int i = found < k ? found++ : k - 1;
                    while (i > 0 && distanceSquared[i - 1] > d2)
                    {
                        distanceSquared[i] = distanceSquared[i - 1];
                        slots[i] = slots[i - 1];
                        i--;
                    }
                    distanceSquared[i] = d2;
                    slots[i] = s;
                    if (found == k) worst = distanceSquared[k - 1];
                }
                continue;
            }
            int right = t.Right[node];
            double dl = NodeDistanceSquared(left), dr = NodeDistanceSquared(right);
            EnsureCapacity(top + 2);
            // Push the farther child first so the nearer one is explored first.
            if (dl <= dr)
            {
                if (dr < worst) { _id[top] = right; _key[top] = dr; top++; }
                if (dl < worst) { _id[top] = left; _key[top] = dl; top++; }
            }
            else
            {
                if (dl < worst) { _id[top] = left; _key[top] = dl; top++; }
                if (dr < worst) { _id[top] = right; _key[top] = dr; top++; }
            }
        }
        _count = 0;
        return found;
    }

    private void EnsureCapacity(int n)
    {
        if (n <= _key.Length) return;
        int size = Math.Max(n, _key.Length * 2);
        Array.Resize(ref _key, size);
        Array.Resize(ref _id, size);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private double NodeDistanceSquared(int node)
    {
        var t = _tree;
        double dx = Gap(_qx, t.BoxMinX[node], t.BoxMaxX[node]);
        double dy = Gap(_qy, t.BoxMinY[node], t.BoxMaxY[node]);
        double dz = Gap(_qz, t.BoxMinZ[node], t.BoxMaxZ[node]);
        return dx * dx + dy * dy + dz * dz;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Gap(double q, double lo, double hi) => q < lo ? lo - q : q > hi ? q - hi : 0.0;

    private void Push(double key, int id)
    {
        if (_count == _key.Length)
        {
            Array.Resize(ref _key, _count * 2);
            Array.Resize(ref _id, _count * 2);
        }
        int i = _count++;
        while (i > 0)
        {
            int parent = (i - 1) >> 1;
            if (_key[parent] <= key) break;
            _key[i] = _key[parent];
            _id[i] = _id[parent];
            i = parent;
        }
        _key[i] = key;
        _id[i] = id;
    }

    private void Pop()
    {
        int last = --_count;
        if (last == 0) return;
        double key = _key[last];
        int id = _id[last];
        int i = 0;
        while (true)
        {
            int child = 2 * i + 1;
            if (child >= last) break;
            if (child + 1 < last && _key[child + 1] < _key[child]) child++;
            if (_key[child] >= key) break;
            _key[i] = _key[child];
            _id[i] = _id[child];
            i = child;
        }
        _key[i] = key;
        _id[i] = id;
    }
}
