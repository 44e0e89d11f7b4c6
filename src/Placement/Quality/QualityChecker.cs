using Placement.Points;
using Placement.Profiles;
using Placement.Tessellation;

namespace Placement.Quality;

/// <summary>
/// Measures a point set against its target profile on its Voronoi cells: ln(Vρ/m) per cell, Voronoi density in
/// equal-mass radial bins, enclosed mass against M(r), and moving-mesh regularity; optionally the same for a
/// baseline set (a Poisson set of equal N) so every number has a reference.
/// </summary>
/// <remarks>
/// <para>m_i are the points' masses when they sum to more than zero, otherwise equal shares M_total/N of the
/// profile mass (mesh-generating points before their masses are set). V_i ρ_target(r_i)/m_i = 1 for a set whose
/// point density follows the profile exactly, so ln(Vρ/m) measures local density errors in natural units
/// (0.1 ≈ 10 %).</para>
/// <para>The profile is centred at the origin. Default domain: a ball at the origin just enclosing the profile
/// and every point.</para>
/// </remarks>
public static class QualityChecker
{
    private static readonly double[] PercentileLevels = [1, 5, 25, 50, 75, 95, 99];

    /// <summary>Points that must lie inside a radius before its relative enclosed-mass error counts in the maximum.</summary>
    public const int RelativeErrorMinimumPoints = 100;

    /// <summary>Measures <paramref name="points"/> against <paramref name="profile"/>.</summary>
    /// <param name="points">The point set (profile length and mass units).</param>
    /// <param name="profile">The target profile, centred at the origin.</param>
    /// <param name="domain">Tessellation domain; a ball enclosing profile and points when null.</param>
    /// <param name="options">Settings; <see cref="QualityOptions.Default"/> when null.</param>
    /// <param name="baseline">A comparison set (e.g. Poisson with the same N, from any sampler), or null.</param>
    /// <returns>The typed report.</returns>
    /// <exception cref="ArgumentException">The point set is empty, or its units differ from the profile's.</exception>
    public static QualityReport Evaluate(PointSet points, IRadialProfile profile, TessellationDomain? domain = null,
        QualityOptions? options = null, PointSet? baseline = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(profile);
        options ??= QualityOptions.Default;
        if (points.Count == 0) throw new ArgumentException("The point set is empty.", nameof(points));
        if (points.Units.Name != profile.Units.Name)
            throw new ArgumentException($"Point units '{points.Units.Name}' differ from profile units '{profile.Units.Name}'.", nameof(points));
        var report = EvaluateOne(points, profile, domain ?? EnclosingBall(points, profile, baseline), options);
        if (baseline is null) return report;
        // The baseline is a yardstick for the scatter; the kernel-smoothed SPH target (the costly part of its SPH check) is skipped there.
        var baseReport = EvaluateOne(baseline, profile, domain ?? EnclosingBall(points, profile, baseline), options with { SphSmoothedTarget = false });
        return report with { Baseline = baseReport };
    }

    private static TessellationDomain EnclosingBall(PointSet points, IRadialProfile profile, PointSet? baseline)
    {
        double r = profile.OuterRadius;
        for (int i = 0; i < points.Count; i++) r = Math.Max(r, points.Radius(i));
        if (baseline is not null)
            for (int i = 0; i < baseline.Count; i++) r = Math.Max(r, baseline.Radius(i));
        return TessellationDomain.Sphere(0, 0, 0, r * (1 + 1e-9) + 1e-300);
    }

    private static QualityReport EvaluateOne(PointSet points, IRadialProfile profile, TessellationDomain domain, QualityOptions options)
    {
        int n = points.Count;
        // Cell masses ∫ρ dV by quadrature give the target density averaged over exactly the cells in each radial bin.
        var tessellation = (options.Tessellation ?? TessellationOptions.Default) with
        {
            MassProfile = profile,
            MassQuadratureAngle = options.CellMassQuadratureAngle,
        };
        var cells = VoronoiTessellation.Compute(points, domain, tessellation);
        var radius = new double[n];
        for (int i = 0; i < n; i++) radius[i] = points.Radius(i);
        var rho = new double[n];
        profile.Density(radius, rho);
        double pointTotal = points.TotalMass();
        bool usePointMasses = pointTotal > 0;
        double share = profile.TotalMass / n;
        var mass = new double[n];
        for (int i = 0; i < n; i++) mass[i] = usePointMasses ? points.Mass[i] : share;

        var logRatio = new double[n];
        int outside = 0;
        for (int i = 0; i < n; i++)
        {
            if (rho[i] > 0 && mass[i] > 0) logRatio[i] = Math.Log(cells.Volume[i] * rho[i] / mass[i]);
            else { logRatio[i] = double.NaN; outside++; }
        }
        // The edge of the point distribution: a kernel that reaches past the outermost point sees vacuum there even when
        // the profile goes on (a steep envelope holding less than one layer of points), so it splits body from surface.
        double edge = 0;
        for (int i = 0; i < n; i++) if (rho[i] > 0) edge = Math.Max(edge, radius[i]);
        edge = Math.Min(edge, profile.OuterRadius);
        bool sphOn = options.SphNeighbourNumber > 0 && n > 1;
        var sph = sphOn ? Sph.SphDensity.Compute(points, options.SphKernel, options.SphNeighbourNumber) : null;
        return new QualityReport(
            n, profile.Fingerprint, domain.ToString(), profile.Units.LengthUnitName, profile.Units.MassUnitName,
            usePointMasses ? "point masses" : "equal shares of the profile mass",
            outside,
            LogStatistics(logRatio, points, radius, cells, options.WorstCells),
            SplitByRegion(logRatio, radius, rho, mass, edge, sph, cells.CutByDomain),
            Histogram.Of(logRatio, -options.HistogramRange, options.HistogramRange, options.HistogramBins),
            RadialDensity(profile, radius, mass, cells, options.RadialBins),
            Enclosed(profile, radius, mass),
            Regularity(cells, options),
            sph is null ? null : SphComparison(sph, profile, radius, rho, edge, OuterShells(points, radius), options),
            options.KeepPerPointValues ? logRatio : null,
            null);
    }

    private static LogRatioStatistics LogStatistics(double[] logRatio, PointSet points, double[] radius, VoronoiCells cells, int worstCount)
    {
        var finite = logRatio.Where(double.IsFinite).ToArray();
        int m = finite.Length;
        if (m == 0) return new LogRatioStatistics(0, double.NaN, double.NaN, double.NaN, PercentileLevels, PercentileLevels.Select(_ => double.NaN).ToArray(), double.NaN, []);
        double mean = finite.Average();
        double variance = 0, square = 0;
        foreach (double v in finite) { variance += (v - mean) * (v - mean); square += v * v; }
        Array.Sort(finite);
        var values = PercentileLevels.Select(p => Percentile(finite, p)).ToArray();
        double maxAbs = Math.Max(Math.Abs(finite[0]), Math.Abs(finite[^1]));
        var worst = Enumerable.Range(0, logRatio.Length)
            .Where(i => double.IsFinite(logRatio[i]))
            .OrderByDescending(i => Math.Abs(logRatio[i])).ThenBy(i => i)
            .Take(worstCount)
            .Select(i => new WorstCell(i, points.X[i], points.Y[i], points.Z[i], radius[i], logRatio[i], cells.Volume[i], cells.CutByDomain[i]))
            .ToArray();
        return new LogRatioStatistics(m, mean, Math.Sqrt(variance / m), Math.Sqrt(square / m), PercentileLevels, values, maxAbs, worst);
    }

    // Nearest-rank percentile of sorted values.
    private static double Percentile(double[] sorted, double p)
    {
        int rank = (int)Math.Ceiling(p / 100.0 * sorted.Length);
        return sorted[Math.Clamp(rank - 1, 0, sorted.Length - 1)];
    }

    private static double[] EqualMassEdges(IRadialProfile profile, int bins)
    {
        var edges = new double[bins + 1];
        for (int k = 0; k <= bins; k++) edges[k] = k == bins ? profile.OuterRadius : profile.RadiusOfEnclosedMass(profile.TotalMass * k / bins);
        edges[0] = 0;
        return edges;
    }

    private static int BinOf(double[] edges, double r)
    {
        int k = Array.BinarySearch(edges, r);
        if (k < 0) k = ~k - 1;
        return k;
    }

    private static RadialDensityComparison RadialDensity(IRadialProfile profile, double[] radius, double[] mass, VoronoiCells cells, int bins)
    {
        var edges = EqualMassEdges(profile, bins);
        var sumM = new double[bins]; var sumV = new double[bins]; var sumTarget = new double[bins]; var count = new int[bins];
        for (int i = 0; i < radius.Length; i++)
        {
            int k = BinOf(edges, radius[i]);
            if (k < 0 || k >= bins) continue;
            double v = cells.Volume[i];
            sumM[k] += mass[i]; sumV[k] += v; sumTarget[k] += cells.Mass![i]; count[k]++;
        }
        var target = new double[bins]; var measured = new double[bins]; var error = new double[bins];
        double rms = 0, max = 0; int used = 0;
        for (int k = 0; k < bins; k++)
        {
            target[k] = count[k] > 0 ? sumTarget[k] / sumV[k] : double.NaN;
            measured[k] = count[k] > 0 ? sumM[k] / sumV[k] : double.NaN;
            error[k] = measured[k] / target[k] - 1;
            if (!double.IsFinite(error[k])) continue;
            rms += error[k] * error[k]; max = Math.Max(max, Math.Abs(error[k])); used++;
        }
        return new RadialDensityComparison(edges[..^1], edges[1..], target, measured, error, count, used > 0 ? Math.Sqrt(rms / used) : double.NaN, max);
    }

    private static EnclosedMassComparison Enclosed(IRadialProfile profile, double[] radius, double[] mass)
    {
        int n = radius.Length;
        var order = new int[n];
        for (int i = 0; i < n; i++) order[i] = i;
        var keys = (double[])radius.Clone();
        Array.Sort(keys, order);
        const int samples = 200;
        int stride = Math.Max(1, n / samples);
        var r = new List<double>(); var model = new List<double>(); var points = new List<double>(); var relative = new List<double>();
        double inside = 0, maxTotal = 0, maxRelative = 0, total = profile.TotalMass;
        for (int a = 0; a < n;)
        {
            // The group [a, b) of points at one radius (to 1e-10 relative: a rotated shell's radii differ in the last
            // bits) counts half at that radius.
            int b = a;
            double group = 0, limit = keys[a] * (1 + 1e-10);
            while (b < n && keys[b] <= limit) group += mass[order[b++]];
            double rk = keys[a], mk = profile.EnclosedMass(rk), pk = inside + 0.5 * group;
            double rel = mk > 0 ? pk / mk - 1 : double.NaN;
            maxTotal = Math.Max(maxTotal, Math.Abs(pk - mk) / total);
            // Relative errors count only where at least 100 points lie inside, so one point is at most 1 % (near the
            // centre any discrete set has O(1) relative error); the error in units of the total mass counts everywhere.
            if (double.IsFinite(rel) && a >= RelativeErrorMinimumPoints) maxRelative = Math.Max(maxRelative, Math.Abs(rel));
            if (a / stride != b / stride || b == n)
            {
                r.Add(rk); model.Add(mk); points.Add(pk); relative.Add(rel);
            }
            inside += group;
            a = b;
        }
        return new EnclosedMassComparison([.. r], [.. model], [.. points], [.. relative], maxTotal, maxRelative);
    }

    /// <summary>Neighbour number of the target supports that split body from surface when the SPH check is off.</summary>
    private const double SplitNeighbourNumber = 64;

    private static LogRatioSplit SplitByRegion(double[] logRatio, double[] radius, double[] rho, double[] mass, double outer,
        Sph.SphDensityResult? sph, bool[] cut)
    {
        double nh = sph?.NeighbourNumber ?? SplitNeighbourNumber;
        double factor = 3.0 * nh / (4.0 * Math.PI);
        double bodySum = 0, bodySum2 = 0, surfSum = 0, surfSum2 = 0, cutSum = 0, cutSum2 = 0, inSum = 0, inSum2 = 0;
        int body = 0, surface = 0, cutCount = 0, inCount = 0;
        for (int i = 0; i < radius.Length; i++)
        {
            double v = logRatio[i];
            if (!double.IsFinite(v)) continue;
            if (cut[i]) { cutSum += v; cutSum2 += v * v; cutCount++; }
            else { inSum += v; inSum2 += v * v; inCount++; }
            double h = sph is not null ? sph.Support[i] : Math.Cbrt(factor * mass[i] / rho[i]);
            if (radius[i] + h < outer) { bodySum += v; bodySum2 += v * v; body++; }
            else { surfSum += v; surfSum2 += v * v; surface++; }
        }
        static double Mean(double s, int c) => c > 0 ? s / c : double.NaN;
        static double Std(double s, double s2, int c) => c > 0 ? Math.Sqrt(Math.Max(0, s2 / c - (s / c) * (s / c))) : double.NaN;
        return new LogRatioSplit(sph is not null ? "sph" : "target", nh, body, Mean(bodySum, body), Std(bodySum, bodySum2, body),
            surface, Mean(surfSum, surface), Std(surfSum, surfSum2, surface),
            cutCount, Mean(cutSum, cutCount), Std(cutSum, cutSum2, cutCount), Std(inSum, inSum2, inCount), outer);
    }

    private static SphDensityComparison SphComparison(Sph.SphDensityResult sph, IRadialProfile profile, double[] radius, double[] rho, double edge,
        bool[]? outerShell, QualityOptions options)
    {
        int bins = options.RadialBins;
        var edges = EqualMassEdges(profile, bins);
        var target = new Moments(bins);
        double[]? smoothed = options.SphSmoothedTarget ? Sph.KernelSmoothedProfile.Compute(profile, options.SphKernel, radius, sph.Support) : null;
        var versusSmoothed = new Moments(bins);
        // By shells (only when the set is on shells): all but the outermost two, and those two.
        Accumulator shellBody = new(), shellBodySmoothed = new(), outerShells = new();
        double big = edge;
        for (int i = 0; i < radius.Length; i++)
        {
            if (!(rho[i] > 0)) continue;
            int k = BinOf(edges, radius[i]);
            bool body = radius[i] + sph.Support[i] < big;
            target.Add(k, body, sph.Density[i] / rho[i] - 1);
            if (smoothed is not null && smoothed[i] > 0) versusSmoothed.Add(k, body, sph.Density[i] / smoothed[i] - 1);
            if (outerShell is null) continue;
            if (outerShell[i]) { outerShells.Add(sph.Density[i] / rho[i] - 1); continue; }
            shellBody.Add(sph.Density[i] / rho[i] - 1);
            if (smoothed is not null && smoothed[i] > 0) shellBodySmoothed.Add(sph.Density[i] / smoothed[i] - 1);
        }
        var (bias, scatter) = target.PerBin();
        return new SphDensityComparison(options.SphKernel.Name, options.SphNeighbourNumber, edges[..^1], edges[1..], bias, scatter, target.Count,
            target.Body.N, target.Body.Mean, target.Body.Rms, target.Surface.N, target.Surface.Mean, target.Surface.Rms,
            smoothed is null ? null : versusSmoothed.PerBin().Bias,
            smoothed is null ? double.NaN : versusSmoothed.Body.Mean,
            smoothed is null ? double.NaN : versusSmoothed.Body.Rms,
            smoothed is null ? double.NaN : versusSmoothed.Surface.Rms,
            edge,
            shellBody.N, shellBody.Rms, smoothed is null ? double.NaN : shellBodySmoothed.Rms,
            outerShells.N, outerShells.Rms);
    }

    /// <summary>
    /// For a set on shells, marks the points of the outermost two shells; null for any other set. A set is on shells when
    /// every point carries a layer index (≥ 0), there are at least three layers, and each layer's points share one radius
    /// (to 1e-9 relative): the layers of a shell sampler, kept by relaxations that move points only tangentially.
    /// </summary>
    private static bool[]? OuterShells(PointSet points, double[] radius)
    {
        var layer = points.Layer;
        int top = -1;
        foreach (int l in layer)
        {
            if (l < 0) return null;
            top = Math.Max(top, l);
        }
        var lo = new double[top + 1];
        var hi = new double[top + 1];
        Array.Fill(lo, double.PositiveInfinity);
        for (int i = 0; i < radius.Length; i++)
        {
            lo[layer[i]] = Math.Min(lo[layer[i]], radius[i]);
            hi[layer[i]] = Math.Max(hi[layer[i]], radius[i]);
        }
        // Used layers (an unused index keeps lo = +∞); each must be one radius.
        var used = new List<int>();
        for (int l = 0; l <= top; l++)
        {
            if (double.IsPositiveInfinity(lo[l])) continue;
            if (hi[l] - lo[l] > 1e-9 * hi[l]) return null;
            used.Add(l);
        }
        if (used.Count < 3) return null;
        // The two layers of largest radius (ties between layers cannot occur on distinct shells; ordered by index then).
        used.Sort((p, q) => hi[q] != hi[p] ? hi[q].CompareTo(hi[p]) : q.CompareTo(p));
        int first = used[0], second = used[1];
        var mask = new bool[radius.Length];
        for (int i = 0; i < mask.Length; i++) mask[i] = layer[i] == first || layer[i] == second;
        return mask;
    }

    /// <summary>Sums of e and e² per radial bin and over the body / surface points.</summary>
    private sealed class Moments(int bins)
    {
        private readonly double[] _sum = new double[bins], _sum2 = new double[bins];

        public int[] Count { get; } = new int[bins];

        public Accumulator Body { get; } = new();

        public Accumulator Surface { get; } = new();

        public void Add(int bin, bool body, double e)
        {
            if (bin >= 0 && bin < Count.Length) { _sum[bin] += e; _sum2[bin] += e * e; Count[bin]++; }
            (body ? Body : Surface).Add(e);
        }

        public (double[] Bias, double[] Scatter) PerBin()
        {
            var bias = new double[Count.Length]; var scatter = new double[Count.Length];
            for (int k = 0; k < Count.Length; k++)
            {
                bias[k] = Count[k] > 0 ? _sum[k] / Count[k] : double.NaN;
                scatter[k] = Count[k] > 0 ? Math.Sqrt(Math.Max(0, _sum2[k] / Count[k] - bias[k] * bias[k])) : double.NaN;
            }
            return (bias, scatter);
        }
    }

    /// <summary>Count, mean and rms of a stream of values (NaN when empty).</summary>
    private sealed class Accumulator
    {
        private double _sum, _sum2;

        public int N { get; private set; }

        public double Mean => N > 0 ? _sum / N : double.NaN;

        public double Rms => N > 0 ? Math.Sqrt(_sum2 / N) : double.NaN;

        public void Add(double e) { _sum += e; _sum2 += e * e; N++; }
    }

    private static RegularityStatistics Regularity(VoronoiCells cells, QualityOptions options)
    {
        var offsets = new List<double>(cells.Count);
        var angles = new List<double>(cells.Count);
        int overOffset = 0, overAngle = 0, overEither = 0;
        double faces = 0;
        for (int i = 0; i < cells.Count; i++)
        {
            if (cells.CutByDomain[i]) continue;
            double d = cells.CentroidOffset[i] / cells.CellRadius(i), a = cells.MaxFaceAngleRatio[i];
            offsets.Add(d); angles.Add(a);
            bool o = d > options.OffsetThreshold, f = a > options.FaceAngleThreshold;
            if (o) overOffset++;
            if (f) overAngle++;
            if (o || f) overEither++;
            faces += cells.FaceCount[i];
        }
        int m = offsets.Count;
        if (m == 0)
            return new RegularityStatistics(0, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN,
                options.OffsetThreshold, options.FaceAngleThreshold, double.NaN, double.NaN, double.NaN, double.NaN);
        var so = offsets.ToArray(); Array.Sort(so);
        var sa = angles.ToArray(); Array.Sort(sa);
        return new RegularityStatistics(m, so.Average(), Percentile(so, 95), so[^1], sa.Average(), Percentile(sa, 95), sa[^1],
            options.OffsetThreshold, options.FaceAngleThreshold, (double)overOffset / m, (double)overAngle / m, (double)overEither / m, faces / m);
    }
}
