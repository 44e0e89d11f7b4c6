using Placement.Parallelism;
using Placement.Points;
using Placement.Spatial;

namespace Placement.Sph;

/// <summary>SPH kernel density estimates of a point set, with supports solved self-consistently for a neighbour number.</summary>
/// <remarks>
/// <para>Self-consistent supports: for each point i the support H_i solves (4π/3) H³ Σ_j W(r_ij, H) = N_H, i.e. the
/// kernel-weighted number density times the support volume equals the requested neighbour number (the usual
/// h–ρ relation h = η (m/ρ)^(1/3) written with the number density, so unequal masses are handled). The sum runs over
/// the k nearest points (self included) from a k-d tree; k starts at 1.6 N_H + 8 and doubles whenever the support
/// would reach past the farthest point fetched. The equation is monotone in H and is solved by Newton steps
/// safeguarded by bisection to a relative tolerance of 1e-10 in H.</para>
/// <para>Density: ρ_i = Σ_j m_j W(r_ij, H_i) including j = i, then for Wendland kernels the self-contribution
/// correction ρ_i ← ρ_i − ε m_i W(0, H_i) with ε from Dehnen &amp; Aly 2012 (eqs. 18–19).</para>
/// <para>Points are processed in tree order (spatially coherent), in fixed chunks, so results are bitwise identical
/// for any thread count. Memory: the tree (≈ 44 bytes per point) plus 20 bytes per point of results.</para>
/// </remarks>
public static class SphDensity
{
    /// <summary>Computes densities with supports solved for <paramref name="neighbourNumber"/>.</summary>
    /// <param name="points">The points; their masses are used.</param>
    /// <param name="kernel">The smoothing kernel.</param>
    /// <param name="neighbourNumber">N_H, the target neighbour number (e.g. 64), ≥ 2.</param>
    /// <param name="settings">Parallelism; results are identical for any setting.</param>
    /// <param name="correctSelfContribution">Apply the Wendland self-contribution correction (default true; no effect on B-splines).</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="neighbourNumber"/> &lt; 2 or not finite.</exception>
    /// <exception cref="ArgumentException">The set has fewer than 2 points.</exception>
    public static SphDensityResult Compute(PointSet points, SphKernel kernel, double neighbourNumber, ParallelSettings? settings = null, bool correctSelfContribution = true)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(kernel);
        if (!(neighbourNumber >= 2) || !double.IsFinite(neighbourNumber))
            throw new ArgumentOutOfRangeException(nameof(neighbourNumber), neighbourNumber, "Neighbour number must be finite and >= 2.");
        if (points.Count < 2) throw new ArgumentException("SPH densities need at least 2 points.", nameof(points));
        return Run(points, kernel, neighbourNumber, fixedSupport: double.NaN, settings, correctSelfContribution);
    }

    /// <summary>Computes densities with one fixed support H for every point (for noise studies against Poisson theory).</summary>
    /// <param name="points">The points; their masses are used.</param>
    /// <param name="kernel">The smoothing kernel.</param>
    /// <param name="support">Kernel support H, length units, &gt; 0.</param>
    /// <param name="meanNumberDensity">Mean number density n, used only to report N_H = (4π/3)H³n and for the Wendland correction.</param>
    /// <param name="settings">Parallelism; results are identical for any setting.</param>
    /// <param name="correctSelfContribution">Apply the Wendland self-contribution correction (default false here: fixed-H noise theory counts the full self term).</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="support"/> or <paramref name="meanNumberDensity"/> not finite and positive.</exception>
    public static SphDensityResult ComputeFixedSupport(PointSet points, SphKernel kernel, double support, double meanNumberDensity, ParallelSettings? settings = null, bool correctSelfContribution = false)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(kernel);
        if (!(support > 0) || !double.IsFinite(support)) throw new ArgumentOutOfRangeException(nameof(support), support, "Support must be finite and > 0.");
        if (!(meanNumberDensity > 0) || !double.IsFinite(meanNumberDensity))
            throw new ArgumentOutOfRangeException(nameof(meanNumberDensity), meanNumberDensity, "Mean number density must be finite and > 0.");
        double nh = 4.0 * Math.PI / 3.0 * support * support * support * meanNumberDensity;
        return Run(points, kernel, nh, support, settings, correctSelfContribution);
    }

    /// <summary>Largest grid-cell occupancy (in mean occupancies) for which the uniform grid is used; beyond it the k-d tree.</summary>
    private const double CrowdingLimit = 24;

    /// <summary>Which neighbour index to use (tests compare the two; users get the automatic choice).</summary>
    internal enum IndexChoice
    {
        Automatic,
        Grid,
        Tree,
    }

    /// <summary><see cref="Compute"/> with the neighbour index forced (for tests).</summary>
    internal static SphDensityResult ComputeWith(PointSet points, SphKernel kernel, double neighbourNumber, IndexChoice index) =>
        Run(points, kernel, neighbourNumber, double.NaN, null, true, index);

    private static SphDensityResult Run(PointSet points, SphKernel kernel, double neighbourNumber, double fixedSupport, ParallelSettings? settings, bool correct,
        IndexChoice index = IndexChoice.Automatic)
    {
        int n = points.Count;
        // Evenly spread sets: a uniform grid scanned row by row is several times faster than tree queries. Concentrated
        // sets (a stellar core holds far more points per cell than the envelope): the k-d tree, whose cost does not
        // depend on the spread. The choice depends only on the positions, so results stay reproducible.
        var grid = index == IndexChoice.Tree ? null : TryGrid(points, force: index == IndexChoice.Grid);
        if (grid is not null) return RunGrid(points, grid, kernel, neighbourNumber, fixedSupport, settings, correct);
        var tree = new KdTree(points.X, points.Y, points.Z);
        var density = new double[n];
        var supportOut = new double[n];
        var counts = new int[n];
        double epsilon = correct ? kernel.SelfContributionCorrection(neighbourNumber) : 0.0;
        double w0 = kernel.Shape(0);
        int startK = Math.Min(n, (int)Math.Ceiling(1.6 * neighbourNumber) + 8);
        ParallelLoop.For(n, settings, (s0, s1) =>
        {
            var search = tree.CreateSearch();
            int k = startK;
            var slots = new int[k];
            var d2 = new double[k];
            for (int s = s0; s < s1; s++)
            {
                int i = tree.SortedIndex[s];
                double qx = tree.SortedX[s], qy = tree.SortedY[s], qz = tree.SortedZ[s];
                int found;
                double h;
                while (true)
                {
                    found = search.Nearest(qx, qy, qz, -1, slots, d2);
                    h = double.IsNaN(fixedSupport) ? SolveSupport(kernel, neighbourNumber, d2.AsSpan(0, found)) : fixedSupport;
                    // Enough neighbours fetched when the support ends inside the farthest one (or all points are in).
                    if (found < k || k == n || h * h <= d2[found - 1]) break;
                    k = Math.Min(n, 2 * k);
                    slots = new int[k];
                    d2 = new double[k];
                }
                double sum = 0;
                int inside = 0;
                double inv = 1.0 / h;
                for (int j = 0; j < found; j++)
                {
                    if (d2[j] >= h * h) break;
                    int original = tree.SortedIndex[slots[j]];
                    sum += points.Mass[original] * kernel.Shape(Math.Sqrt(d2[j]) * inv);
                    inside++;
                }
                double norm = kernel.Normalisation * inv * inv * inv;
                double rho = norm * (sum - epsilon * points.Mass[i] * w0);
                density[i] = rho;
                supportOut[i] = h;
                counts[i] = inside;
                if (k != startK)
                {
                    k = startK;
                    slots = new int[k];
                    d2 = new double[k];
                }
            }
        });
        return new SphDensityResult(density, supportOut, counts, kernel, neighbourNumber);
    }

    private static PointGrid? TryGrid(PointSet points, bool force)
    {
        int n = points.Count;
        double minX = double.MaxValue, minY = double.MaxValue, minZ = double.MaxValue, maxX = double.MinValue, maxY = double.MinValue, maxZ = double.MinValue;
        for (int i = 0; i < n; i++)
        {
            minX = Math.Min(minX, points.X[i]); maxX = Math.Max(maxX, points.X[i]);
            minY = Math.Min(minY, points.Y[i]); maxY = Math.Max(maxY, points.Y[i]);
            minZ = Math.Min(minZ, points.Z[i]); maxZ = Math.Max(maxZ, points.Z[i]);
        }
        double pad = 1e-9 * Math.Max(maxX - minX, Math.Max(maxY - minY, maxZ - minZ)) + 1e-300;
        if (!(maxX - minX > 0 && maxY - minY > 0 && maxZ - minZ > 0)) return null;
        const double perCell = 2.0;
        var grid = new PointGrid(points.X, points.Y, points.Z, (minX - pad, minY - pad, minZ - pad), (maxX + pad, maxY + pad, maxZ + pad), false, perCell);
        int cells = grid.CellStart.Length - 1, crowded = 0;
        double mean = (double)n / cells;
        for (int c = 0; c < cells; c++) crowded = Math.Max(crowded, grid.CellStart[c + 1] - grid.CellStart[c]);
        return force || crowded <= CrowdingLimit * Math.Max(mean, 1.0) ? grid : null;
    }

    private static SphDensityResult RunGrid(PointSet points, PointGrid grid, SphKernel kernel, double neighbourNumber, double fixedSupport, ParallelSettings? settings, bool correct)
    {
        int n = points.Count;
        var density = new double[n];
        var supportOut = new double[n];
        var counts = new int[n];
        double epsilon = correct ? kernel.SelfContributionCorrection(neighbourNumber) : 0.0;
        double w0 = kernel.Shape(0);
        // Starting guess: the support that holds N_H points at the set's mean number density.
        double volume = grid.LengthX * grid.LengthY * grid.LengthZ;
        double guess = double.IsNaN(fixedSupport) ? Math.Cbrt(3.0 * neighbourNumber * volume / (4.0 * Math.PI * n)) : fixedSupport;
        ParallelLoop.For(n, settings, (s0, s1) =>
        {
            var buffer = new NeighbourBuffer(256);
            double previous = guess;
            for (int s = s0; s < s1; s++)
            {
                int i = grid.SortedIndex[s];
                double qx = grid.SortedX[s], qy = grid.SortedY[s], qz = grid.SortedZ[s];
                // Gather inside a radius a little beyond the previous point's support, then widen in shells until the
                // solved support ends inside what was gathered (each point is gathered once).
                double reach = double.IsNaN(fixedSupport) ? 1.25 * previous : fixedSupport * (1 + 1e-12);
                buffer.Clear();
                grid.CollectInShell(qx, qy, qz, 0, reach * reach, s, buffer);
                double h;
                while (true)
                {
                    if (!double.IsNaN(fixedSupport)) { h = fixedSupport; break; }
                    var gathered = buffer.DistanceSquared;
                    h = SolveSupportWithin(kernel, neighbourNumber, gathered, reach, previous);
                    if (!double.IsNaN(h) || gathered.Length + 1 >= n)
                    {
                        if (double.IsNaN(h)) h = reach; // every point gathered and still short of N_H: the set is smaller than the kernel
                        break;
                    }
                    double wider = 1.5 * reach;
                    grid.CollectInShell(qx, qy, qz, reach * reach, wider * wider, s, buffer);
                    reach = wider;
                }
                double inv = 1.0 / h, h2 = h * h;
                double sum = points.Mass[i] * w0;
                int inside = 1;
                var slots = buffer.Slot;
                var dist = buffer.DistanceSquared;
                for (int j = 0; j < dist.Length; j++)
                {
                    if (dist[j] >= h2) continue;
                    sum += points.Mass[grid.SortedIndex[slots[j]]] * kernel.Shape(Math.Sqrt(dist[j]) * inv);
                    inside++;
                }
                density[i] = kernel.Normalisation * inv * inv * inv * (sum - epsilon * points.Mass[i] * w0);
                supportOut[i] = h;
                counts[i] = inside;
                previous = h;
            }
        });
        return new SphDensityResult(density, supportOut, counts, kernel, neighbourNumber);
    }

    /// <summary>
    /// Solves (4π/3) C [w(0) + Σ_j w(r_j/H)] = N_H for H in (0, <paramref name="reach"/>) over unsorted squared
    /// distances of every neighbour within the reach (self excluded); NaN when the reach is too small.
    /// </summary>
    internal static double SolveSupportWithin(SphKernel kernel, double neighbourNumber, ReadOnlySpan<double> d2, double reach, double guess)
    {
        double target = neighbourNumber / (4.0 * Math.PI / 3.0 * kernel.Normalisation) - kernel.Shape(0);
        var (atReach, _) = SumAndSlope(kernel, d2, reach, sorted: false);
        if (atReach < target) return double.NaN;
        return Newton(kernel, d2, target, 0, reach, guess > 0 && guess < reach ? guess : 0.5 * reach, sorted: false);
    }

    /// <summary>Solves (4π/3) C Σ_j w(r_j/H) = N_H for H over ascending squared distances (self at distance 0 included).</summary>
    internal static double SolveSupport(SphKernel kernel, double neighbourNumber, ReadOnlySpan<double> d2)
    {
        double target = neighbourNumber / (4.0 * Math.PI / 3.0 * kernel.Normalisation);
        // Bracket: H just above the nearest non-self distance gives a small sum; grow H until the sum exceeds the target.
        int m = d2.Length;
        double lo = 0, hi = Math.Sqrt(d2[Math.Min(m - 1, Math.Max(1, (int)neighbourNumber))]);
        if (!(hi > 0)) hi = double.Epsilon * 1e10;
        while (Sum(kernel, d2, hi) < target)
        {
            lo = hi;
            hi *= 1.5;
            if (hi > 1e6 * Math.Sqrt(d2[m - 1]) + 1e-300) return hi; // all points fetched already: the caller widens k
        }
        return Newton(kernel, d2, target, lo, hi, 0.5 * (lo + hi), sorted: true);
    }

    /// <summary>
    /// Newton steps on f(H) = Σ_j w(r_j/H) − target from <paramref name="h"/>, kept inside the bracket [lo, hi] where f
    /// changes sign (the sum is piecewise smooth in H: its slope jumps when a neighbour enters the support); relative
    /// tolerance 1e-10 in H.
    /// </summary>
    private static double Newton(SphKernel kernel, ReadOnlySpan<double> d2, double target, double lo, double hi, double h, bool sorted)
    {
        for (int iteration = 0; iteration < 200; iteration++)
        {
            var (sum, slope) = SumAndSlope(kernel, d2, h, sorted);
            double f = sum - target;
            if (f > 0) hi = h; else lo = h;
            double next = slope > 0 ? h - f / slope : 0.5 * (lo + hi);
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
            if (Math.Abs(next - h) <= 1e-10 * h || hi - lo <= 1e-12 * hi) return next;
            h = next;
        }
        return h;
    }

    private static double Sum(SphKernel kernel, ReadOnlySpan<double> d2, double h) => SumAndSlope(kernel, d2, h, sorted: true).Sum;

    /// <summary>Σ_j w(r_j/H) and its derivative with respect to H, Σ_j w'(q_j)(−q_j/H).</summary>
    private static (double Sum, double Slope) SumAndSlope(SphKernel kernel, ReadOnlySpan<double> d2, double h, bool sorted)
    {
        double inv = 1.0 / h, sum = 0, slope = 0;
        double h2 = h * h;
        for (int j = 0; j < d2.Length; j++)
        {
            if (d2[j] >= h2)
            {
                if (sorted) break;
                continue;
            }
            double q = Math.Sqrt(d2[j]) * inv;
            sum += kernel.Shape(q);
            slope -= kernel.ShapeDerivative(q) * q * inv;
        }
        return (sum, slope);
    }
}
