using Placement.Parallelism;

namespace Placement.Bodies;

/// <summary>
/// Octree of point masses with monopole and quadrupole moments about each node's centre of mass, for the Barnes–Hut
/// potential of every point (Barnes &amp; Hut 1986, Nature 324, 446).
/// </summary>
/// <remarks>
/// <para>Layout: the points are copied in tree order into <c>_x, _y, _z, _m</c> (structure of arrays); node k covers the
/// contiguous range [Start, End) of that order, its non-empty children are the nodes FirstChild … FirstChild +
/// ChildCount − 1 (ChildCount = 0 for a leaf of at most <see cref="LeafSize"/> points). Built sequentially, so the
/// tree and every sum over it are the same on any thread count.</para>
/// <para>Node far field: φ(p) = −G [M / r + ½ Σ_ij Q_ij R_i R_j / r⁵], R = p − com, r = |R|, with the traceless
/// quadrupole Q_ij = Σ m (3 d_i d_j − d² δ_ij) about the centre of mass (the dipole vanishes there); children are
/// combined by the parallel-axis shift of Q (standard multipole expansion, e.g. Hernquist 1987, ApJS 64, 715).
/// A node of side s whose centre of mass is δ from its box centre is used when r θ &gt; s + δ θ, i.e. r &gt; s/θ + δ
/// (the Barnes–Hut s/r &lt; θ test made safe for offset centres of mass, common practice); for θ ≤ 1 a node is never
/// used for a point inside it, and θ = 0 opens every node (exact pairwise sum).</para>
/// </remarks>
internal sealed class GravityOctree
{
    public const int LeafSize = 8;
    private const int MaxDepth = 60;

    private readonly double[] _x, _y, _z, _m;
    private readonly int[] _order;
    private Node[] _nodes = new Node[64];
    private int _nodeCount;

    private struct Node
    {
        public double X, Y, Z, M, Qxx, Qyy, Qzz, Qxy, Qxz, Qyz, Size, Delta;
        public int FirstChild, ChildCount, Start, End;
    }

    public GravityOctree(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z, ReadOnlySpan<double> m)
    {
        int n = x.Length;
        _order = new int[n];
        for (int i = 0; i < n; i++) _order[i] = i;
        double minX = double.PositiveInfinity, minY = minX, minZ = minX, maxX = double.NegativeInfinity, maxY = maxX, maxZ = maxX;
        for (int i = 0; i < n; i++)
        {
            minX = Math.Min(minX, x[i]); maxX = Math.Max(maxX, x[i]);
            minY = Math.Min(minY, y[i]); maxY = Math.Max(maxY, y[i]);
            minZ = Math.Min(minZ, z[i]); maxZ = Math.Max(maxZ, z[i]);
        }
        double half = 0.5 * Math.Max(maxX - minX, Math.Max(maxY - minY, maxZ - minZ));
        half = half > 0 ? half * (1 + 1e-12) : 1;
        var scratch = new int[n];
        var (xs, ys, zs) = (x.ToArray(), y.ToArray(), z.ToArray());
        _nodeCount = 1;
        Build(0, 0, n, 0.5 * (minX + maxX), 0.5 * (minY + maxY), 0.5 * (minZ + maxZ), half, 0, xs, ys, zs, scratch);
        _x = new double[n]; _y = new double[n]; _z = new double[n]; _m = new double[n];
        for (int s = 0; s < n; s++)
        {
            int i = _order[s];
            _x[s] = x[i]; _y[s] = y[i]; _z[s] = z[i]; _m[s] = m[i];
        }
        Moments(0);
    }

    /// <summary>Number of nodes.</summary>
    public int NodeCount => _nodeCount;

    /// <summary>Original index of the point at tree position s.</summary>
    public ReadOnlySpan<int> Order => _order;

    private void Build(int node, int start, int end, double cx, double cy, double cz, double half, int depth,
        double[] x, double[] y, double[] z, int[] scratch)
    {
        ref var self = ref _nodes[node];
        self.Start = start; self.End = end; self.Size = 2 * half;
        self.X = cx; self.Y = cy; self.Z = cz; // box centre until Moments replaces it by the centre of mass
        if (end - start <= LeafSize || depth >= MaxDepth) return;
        Span<int> counts = stackalloc int[8];
        counts.Clear();
        for (int s = start; s < end; s++) counts[Octant(_order[s], cx, cy, cz, x, y, z)]++;
        Span<int> offset = stackalloc int[8];
        int children = 0;
        for (int o = 0, acc = start; o < 8; o++) { offset[o] = acc; acc += counts[o]; if (counts[o] > 0) children++; }
        for (int s = start; s < end; s++)
        {
            int i = _order[s];
            scratch[offset[Octant(i, cx, cy, cz, x, y, z)]++] = i;
        }
        Array.Copy(scratch, start, _order, start, end - start);
        int first = _nodeCount;
        _nodeCount += children;
        if (_nodeCount > _nodes.Length) Array.Resize(ref _nodes, Math.Max(_nodeCount, 2 * _nodes.Length));
        _nodes[node].FirstChild = first;
        _nodes[node].ChildCount = children;
        double h = 0.5 * half;
        for (int o = 0, child = first, lo = start; o < 8; o++)
        {
            if (counts[o] == 0) continue;
            Build(child++, lo, lo + counts[o], cx + ((o & 1) != 0 ? h : -h), cy + ((o & 2) != 0 ? h : -h), cz + ((o & 4) != 0 ? h : -h),
                h, depth + 1, x, y, z, scratch);
            lo += counts[o];
        }
    }

    private static int Octant(int i, double cx, double cy, double cz, double[] x, double[] y, double[] z) =>
        (x[i] >= cx ? 1 : 0) | (y[i] >= cy ? 2 : 0) | (z[i] >= cz ? 4 : 0);

    /// <summary>Mass, centre of mass, quadrupole and centre offset δ of node k and, first, of its subtree.</summary>
    private void Moments(int k)
    {
        ref var node = ref _nodes[k];
        double boxX = node.X, boxY = node.Y, boxZ = node.Z;
        double mass = 0, sx = 0, sy = 0, sz = 0;
        if (node.ChildCount == 0)
        {
            for (int s = node.Start; s < node.End; s++) { mass += _m[s]; sx += _m[s] * _x[s]; sy += _m[s] * _y[s]; sz += _m[s] * _z[s]; }
        }
        else
        {
            for (int c = node.FirstChild; c < node.FirstChild + node.ChildCount; c++)
            {
                Moments(c);
                ref var child = ref _nodes[c];
                mass += child.M; sx += child.M * child.X; sy += child.M * child.Y; sz += child.M * child.Z;
            }
        }
        node = ref _nodes[k];
        // Massless nodes keep the box centre (they contribute nothing anyway).
        double gx = mass > 0 ? sx / mass : boxX, gy = mass > 0 ? sy / mass : boxY, gz = mass > 0 ? sz / mass : boxZ;
        double qxx = 0, qyy = 0, qzz = 0, qxy = 0, qxz = 0, qyz = 0;
        if (node.ChildCount == 0)
        {
            for (int s = node.Start; s < node.End; s++)
                AddPoint(_m[s], _x[s] - gx, _y[s] - gy, _z[s] - gz, ref qxx, ref qyy, ref qzz, ref qxy, ref qxz, ref qyz);
        }
        else
        {
            for (int c = node.FirstChild; c < node.FirstChild + node.ChildCount; c++)
            {
                ref var child = ref _nodes[c];
                qxx += child.Qxx; qyy += child.Qyy; qzz += child.Qzz; qxy += child.Qxy; qxz += child.Qxz; qyz += child.Qyz;
                AddPoint(child.M, child.X - gx, child.Y - gy, child.Z - gz, ref qxx, ref qyy, ref qzz, ref qxy, ref qxz, ref qyz);
            }
        }
        node.M = mass; node.X = gx; node.Y = gy; node.Z = gz;
        node.Qxx = qxx; node.Qyy = qyy; node.Qzz = qzz; node.Qxy = qxy; node.Qxz = qxz; node.Qyz = qyz;
        double ox = gx - boxX, oy = gy - boxY, oz = gz - boxZ;
        node.Delta = Math.Sqrt(ox * ox + oy * oy + oz * oz);
    }

    private static void AddPoint(double m, double dx, double dy, double dz,
        ref double qxx, ref double qyy, ref double qzz, ref double qxy, ref double qxz, ref double qyz)
    {
        double d2 = dx * dx + dy * dy + dz * dz;
        qxx += m * (3 * dx * dx - d2); qyy += m * (3 * dy * dy - d2); qzz += m * (3 * dz * dz - d2);
        qxy += m * 3 * dx * dy; qxz += m * 3 * dx * dz; qyz += m * 3 * dy * dz;
    }

    /// <summary>Σ_j≠i m_j / |x_i − x_j| (the potential without −G) for every point, in tree order.</summary>
    /// <remarks>
    /// One walk per leaf serves all its points (Barnes 1990's grouping): a node is used for the whole leaf when
    /// (r − b) θ &gt; s + δ θ, r the distance from the centre of the leaf's bounding sphere (radius b) to the node's centre of
    /// mass, which implies the per-point test for every point of the leaf; otherwise it is opened, and a leaf that is
    /// opened is summed directly. Each point's sum runs in the walk's fixed order.
    /// </remarks>
    /// <param name="theta">Opening angle θ in [0, 1].</param>
    /// <param name="parallel">Parallelism over leaves; the bits do not depend on it.</param>
    /// <exception cref="ArgumentException">Two points coincide.</exception>
    public double[] Potentials(double theta, ParallelSettings parallel)
    {
        var phi = new double[_x.Length];
        var leaves = Leaves();
        ParallelLoop.For(leaves.Length, parallel with { MinimumChunk = Math.Min(parallel.MinimumChunk, 32) }, (start, end) =>
        {
            var stack = new int[8 * (MaxDepth + 2)];
            for (int l = start; l < end; l++) LeafPotentials(leaves[l], theta, stack, phi);
        });
        return phi;
    }

    /// <summary>Leaf node indices in tree order (depth first, children in octant order).</summary>
    private int[] Leaves()
    {
        var leaves = new List<int>();
        var stack = new Stack<int>();
        stack.Push(0);
        while (stack.Count > 0)
        {
            int k = stack.Pop();
            if (_nodes[k].ChildCount == 0) { leaves.Add(k); continue; }
            for (int c = _nodes[k].FirstChild + _nodes[k].ChildCount - 1; c >= _nodes[k].FirstChild; c--) stack.Push(c);
        }
        return [.. leaves];
    }

    private void LeafPotentials(int leaf, double theta, int[] stack, double[] phi)
    {
        int s0 = _nodes[leaf].Start, s1 = _nodes[leaf].End;
        double minX = double.PositiveInfinity, minY = minX, minZ = minX, maxX = double.NegativeInfinity, maxY = maxX, maxZ = maxX;
        for (int s = s0; s < s1; s++)
        {
            minX = Math.Min(minX, _x[s]); maxX = Math.Max(maxX, _x[s]);
            minY = Math.Min(minY, _y[s]); maxY = Math.Max(maxY, _y[s]);
            minZ = Math.Min(minZ, _z[s]); maxZ = Math.Max(maxZ, _z[s]);
        }
        double cx = 0.5 * (minX + maxX), cy = 0.5 * (minY + maxY), cz = 0.5 * (minZ + maxZ);
        double b = 0.5 * Math.Sqrt((maxX - minX) * (maxX - minX) + (maxY - minY) * (maxY - minY) + (maxZ - minZ) * (maxZ - minZ));
        int top = 0;
        stack[top++] = 0;
        var nodes = _nodes;
        while (top > 0)
        {
            ref var node = ref nodes[stack[--top]];
            double ox = cx - node.X, oy = cy - node.Y, oz = cz - node.Z;
            double gap = Math.Sqrt(ox * ox + oy * oy + oz * oz) - b;
            if (gap * theta > node.Size + node.Delta * theta)
            {
                for (int s = s0; s < s1; s++)
                {
                    double rx = _x[s] - node.X, ry = _y[s] - node.Y, rz = _z[s] - node.Z;
                    double inv2 = 1 / (rx * rx + ry * ry + rz * rz), inv = Math.Sqrt(inv2);
                    double quad = node.Qxx * rx * rx + node.Qyy * ry * ry + node.Qzz * rz * rz
                        + 2 * (node.Qxy * rx * ry + node.Qxz * rx * rz + node.Qyz * ry * rz);
                    phi[s] += node.M * inv + 0.5 * quad * inv2 * inv2 * inv;
                }
            }
            else if (node.ChildCount == 0)
            {
                for (int s = s0; s < s1; s++)
                {
                    double px = _x[s], py = _y[s], pz = _z[s], sum = 0;
                    for (int j = node.Start; j < node.End; j++)
                    {
                        if (j == s) continue;
                        double dx = _x[j] - px, dy = _y[j] - py, dz = _z[j] - pz;
                        double d2 = dx * dx + dy * dy + dz * dz;
                        if (d2 == 0) throw new ArgumentException($"Points {_order[s]} and {_order[j]} coincide; the potential energy is infinite.");
                        sum += _m[j] / Math.Sqrt(d2);
                    }
                    phi[s] += sum;
                }
            }
            else
            {
                for (int c = node.FirstChild + node.ChildCount - 1; c >= node.FirstChild; c--) stack[top++] = c;
            }
        }
    }

    /// <summary>Mass of the point at tree position s.</summary>
    public double MassAt(int s) => _m[s];

    /// <summary>Asserts the invariants: children partition their parent's range, node masses add up, every point lies in its leaf's range once.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken.</exception>
    public void CheckValidity()
    {
        var seen = new bool[_order.Length];
        foreach (int i in _order)
        {
            if (seen[i]) throw new InvalidOperationException($"Point {i} appears twice in the tree order.");
            seen[i] = true;
        }
        for (int k = 0; k < _nodeCount; k++)
        {
            var node = _nodes[k];
            if (node.ChildCount == 0) continue;
            int at = node.Start;
            double mass = 0;
            for (int c = node.FirstChild; c < node.FirstChild + node.ChildCount; c++)
            {
                if (_nodes[c].Start != at) throw new InvalidOperationException($"Node {c} does not start where its sibling ends.");
                at = _nodes[c].End;
                mass += _nodes[c].M;
            }
            if (at != node.End) throw new InvalidOperationException($"The children of node {k} do not cover its range.");
            if (Math.Abs(mass - node.M) > 1e-12 * Math.Abs(node.M)) throw new InvalidOperationException($"Node {k} mass {node.M} differs from its children's {mass}.");
        }
    }
}
