using System.Globalization;
using Placement.Profiles;

namespace Placement.Samplers.Shells;

/// <summary>
/// Concentric equal-mass shells of 12 N_side² points each, plus a small central cluster, chosen from a profile's
/// enclosed mass so that every shell holds exactly its profile mass and its cells are close to a chosen aspect.
/// </summary>
/// <remarks>
/// <para>Point mass m = M/N for the requested N, which is met exactly: the central cluster holds c = N mod 12 points
/// (layer 0) and the shells (layers 1 … K) hold 12 Σ N_k² = N − c.</para>
/// <para>Shell k spans [r_{k−1}, r_k] with M(r_k) = m C_k, C_k the number of points inside r_k, so the points'
/// enclosed mass equals M(r) at every boundary to within the rounding of r(M). Its points lie at the mass
/// midpoint radius r(m (C_{k−1} + 6N_k²)).</para>
/// <para>N_side is chosen shell by shell from the centre outward so that the radial thickness over the tangential
/// spacing, (r_k − r_{k−1}) / (r_mid √(π/3) / N_k), is closest to the target aspect (1 = cubic cells; from
/// 4πr²Δr/N = Δr³). Only M(r) and r(M) are used, so steep envelopes and cusps need no special handling. Density
/// steps (<see cref="IRadialProfile.DensitySteps"/>) split the body into segments that end on a shell boundary each: a
/// shell straddling a step would put its points' cells across two densities (ln(Vρ/m) of order the log contrast for
/// a whole shell). The step's boundary falls at the count c + 12j nearest to M(r_s)/m, so within six points' mass of
/// the step; the two shells flanking it have their points mirrored about it, so the Voronoi face between them lies on
/// the step (not where the light side is so sparse that even a 12-point flank is over twice the designed thickness). In each segment the outward pass stops when the remaining mass cannot fill a shell of the target
/// aspect; then the last six shells are re-chosen together with the remainder (as one more shell, or spread over them when it is
/// small) so that 12 Σ N_k² matches the count exactly, each N_k as close as possible (relative error) to its
/// greedy value; a search over nearby integers finds such sums (more parts and wider windows are tried if the
/// nearest fail; with five or more parts there is no number-theoretic obstruction). Two more closings are tried: the last
/// ten greedy shells and the remainder re-spaced as one smooth run of real N_side at a common aspect (K shells, the
/// fractional count rounded down or up), rounded either to the nearest integers with the exact sum or by a search that
/// minimises the predicted cell-volume error. Of all closings the one whose predicted ln(V ρ / m) over the segment has
/// the smallest rms (with a shape term for shells beyond 1.5× the target aspect either way) is kept — 1-D: a shell's cells reach from the midpoint between its points' radius and its inner
/// neighbour's to the midpoint with its outer neighbour's — because integer N_side cannot follow a smooth run closely
/// where N_side is small, and equal or jumping N_side next to each other move the faces off the shell boundaries (the
/// next shell's cells are then too large or small as a whole). The outermost shell always
/// ends at R: where an extended envelope holds less than one shell's worth of mass, that shell is radially thick
/// (its points sit at the envelope's mass midpoint), which is the resolution limit of equal-mass points.</para>
/// <para>Centre: c = 1 puts one point at the origin; c ≥ 2 puts c points on a sphere at the mass midpoint radius
/// r(m c/2) of the central ball, in the directions of a spherical Fibonacci set (z_j = 1 − (2j+1)/c,
/// φ_j = j·π(3 − √5)), turned by the cluster's own random rotation; c = 0 means the first shell starts at r = 0. A single central point
/// gets the mean density of the central ball as its target density (finite even at a cusp).</para>
/// </remarks>
public sealed class ShellLayout
{
    private const int SearchBudget = 2_000_000;
    private const int TailShells = 6;

    private ShellLayout(int count, double pointMass, int centreCount, double centreRadius, double centreOuterRadius,
        int[] nSide, int[] firstPoint, double[] inner, double[] outer, double[] pointRadius, double[] enclosedCount,
        DensityJump[] steps)
    {
        Steps = steps;
        Count = count;
        PointMass = pointMass;
        CentreCount = centreCount;
        CentreRadius = centreRadius;
        CentreOuterRadius = centreOuterRadius;
        NSide = nSide;
        FirstPoint = firstPoint;
        InnerRadius = inner;
        OuterRadius = outer;
        PointRadius = pointRadius;
        EnclosedCount = enclosedCount;
    }

    /// <summary>Total number of points N (equals the requested count).</summary>
    public int Count { get; }

    /// <summary>Mass of every point, M/N, in mass units.</summary>
    public double PointMass { get; }

    /// <summary>Number of points in the central cluster (layer 0), N mod 12.</summary>
    public int CentreCount { get; }

    /// <summary>Radius at which the central cluster's points lie (0 when it is one point), length units.</summary>
    public double CentreRadius { get; }

    /// <summary>Outer radius of the central ball, r(m·CentreCount), length units.</summary>
    public double CentreOuterRadius { get; }

    /// <summary>Number of shells K (layers 1 … K).</summary>
    public int ShellCount => NSide.Count;

    /// <summary>N_side of each shell, index 0 … K−1 for layers 1 … K.</summary>
    public IReadOnlyList<int> NSide { get; }

    /// <summary>Index of each shell's first point in the point set.</summary>
    public IReadOnlyList<int> FirstPoint { get; }

    /// <summary>Inner boundary radius of each shell, length units.</summary>
    public IReadOnlyList<double> InnerRadius { get; }

    /// <summary>Outer boundary radius of each shell, length units; the last equals the profile's outer radius.</summary>
    public IReadOnlyList<double> OuterRadius { get; }

    /// <summary>Radius of each shell's points (the shell's mass midpoint), length units.</summary>
    public IReadOnlyList<double> PointRadius { get; }

    /// <summary>Number of points inside each shell's outer boundary, C_k (as a double for mass products).</summary>
    public IReadOnlyList<double> EnclosedCount { get; }

    /// <summary>
    /// The density steps a shell boundary was put on, ascending: the profile's declared steps and, unless the layout was
    /// built without them, the jumps <see cref="DensityJumps.Find"/> found for this point mass; steps above or below
    /// which less than one shell remains are not among them.
    /// </summary>
    public IReadOnlyList<DensityJump> Steps { get; }

    /// <summary>Points in shell <paramref name="k"/> (0-based), 12 N_side².</summary>
    public int ShellPointCount(int k) => 12 * NSide[k] * NSide[k];

    /// <summary>
    /// Radial thickness over tangential spacing of shell <paramref name="k"/>: (r_out − r_in) N_side / (r_pt √(π/3)).
    /// </summary>
    public double Aspect(int k) => (OuterRadius[k] - InnerRadius[k]) * NSide[k] / (PointRadius[k] * Math.Sqrt(Math.PI / 3));

    /// <summary>Builds the layout for <paramref name="count"/> points on <paramref name="profile"/>.</summary>
    /// <param name="profile">Target profile.</param>
    /// <param name="count">Number of points N ≥ 1.</param>
    /// <param name="aspect">Target radial thickness over tangential spacing (1 = cubic cells), in [0.05, 20].</param>
    /// <param name="findSteps">True (default) to treat as steps, besides the declared ones, the density jumps that points of
    /// this mass cannot resolve (<see cref="DensityJumps.Find"/>), such as a composition change a table resolves over
    /// one row; false to use only <see cref="IRadialProfile.DensitySteps"/>.</param>
    /// <exception cref="ArgumentOutOfRangeException">N or the aspect is out of range.</exception>
    public static ShellLayout Build(IRadialProfile profile, int count, double aspect = 1.0, bool findSteps = true)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        if (!(aspect >= 0.05 && aspect <= 20)) throw new ArgumentOutOfRangeException(nameof(aspect), aspect, "Aspect must be in [0.05, 20].");
        var b = new Builder(profile, count, aspect, findSteps);
        return b.Run();
    }

    /// <summary>
    /// Asserts the layout's invariants against <paramref name="profile"/>: counts add up, radii increase and stay
    /// within [0, R], every point radius lies inside its shell, and M(r_k) = m C_k at every boundary within
    /// <paramref name="relativeTolerance"/> × M.
    /// </summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the shell.</exception>
    public void CheckValidity(IRadialProfile profile, double relativeTolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(profile);
        var inv = CultureInfo.InvariantCulture;
        long next = CentreCount;
        double previous = CentreOuterRadius;
        double mTot = profile.TotalMass;
        for (int k = 0; k < ShellCount; k++)
        {
            if (FirstPoint[k] != next) throw new InvalidOperationException(string.Create(inv, $"Shell {k + 1} starts at point {FirstPoint[k]}; expected {next}."));
            next += ShellPointCount(k);
            if (EnclosedCount[k] != next) throw new InvalidOperationException(string.Create(inv, $"Shell {k + 1} encloses {EnclosedCount[k]} points; expected {next}."));
            if (InnerRadius[k] != previous || !(OuterRadius[k] >= InnerRadius[k]))
                throw new InvalidOperationException(string.Create(inv, $"Shell {k + 1} spans [{InnerRadius[k]}, {OuterRadius[k]}] after a boundary at {previous}."));
            if (!(PointRadius[k] >= InnerRadius[k] && PointRadius[k] <= OuterRadius[k]))
                throw new InvalidOperationException(string.Create(inv, $"Shell {k + 1} points at r = {PointRadius[k]} lie outside [{InnerRadius[k]}, {OuterRadius[k]}]."));
            double err = Math.Abs(profile.EnclosedMass(OuterRadius[k]) - PointMass * EnclosedCount[k]);
            if (!(err <= relativeTolerance * mTot))
                throw new InvalidOperationException(string.Create(inv, $"Shell {k + 1}: M(r_out) differs from the points' enclosed mass by {err} (M = {mTot})."));
            previous = OuterRadius[k];
        }
        if (next != Count) throw new InvalidOperationException(string.Create(inv, $"Shells hold {next} points; expected {Count}."));
        if (ShellCount > 0 && OuterRadius[^1] > profile.OuterRadius * (1 + 1e-14))
            throw new InvalidOperationException(string.Create(inv, $"Outer shell ends at {OuterRadius[^1]} beyond R = {profile.OuterRadius}."));
    }

    private sealed class Builder(IRadialProfile profile, int count, double aspect, bool findSteps)
    {
        private readonly double _m = profile.TotalMass / count;

        public ShellLayout Run()
        {
            int c = count % 12;
            var sides = new List<int>();
            long enclosed = c;
            // Segments end at the density steps (each moved to the nearest count c + 12j, so whole shells fill it) and at
            // the surface. Next to a step the two flanking shells' points sit mirrored about it (see Flank), so the Voronoi
            // boundary between them (the bisector) falls on the step; the rest of each segment is filled by the greedy
            // pass and closed exactly by the tail search.
            var ends = SegmentEnds(c);
            // Flanks per step: inner[k] ends segment k, outer[k] starts segment k + 1. A step whose flanks do not leave room
            // in either segment keeps none (both together, so the inner one is never mirrored to an outer one not placed).
            int steps = ends.Count - 1;
            var inner = new int[steps];
            var outer = new int[steps];
            for (int k = 0; k < steps; k++)
            {
                outer[k] = Flank(ends[k].End, ends[k].Step, outward: true);
                inner[k] = Flank(ends[k].End, ends[k].Step, outward: false);
            }
            long Points(int side) => 12L * side * side;
            for (int k = 0; k < steps; k++)
            {
                long below = ends[k].End - (k == 0 ? c : ends[k - 1].End), above = ends[k + 1].End - ends[k].End;
                long belowUsed = Points(inner[k]) + (k > 0 ? Points(outer[k - 1]) : 0);
                long aboveUsed = Points(outer[k]) + (k + 1 < steps ? Points(inner[k + 1]) : 0);
                if (belowUsed >= below || aboveUsed >= above || inner[k] == 0 || outer[k] == 0) inner[k] = outer[k] = 0;
            }
            // The last placed layer (the central cluster, or none when c = 0): the inner neighbour of the next shell when
            // predicting where the Voronoi faces between shells fall.
            var previous = new Layer(c, c <= 1 ? 0.0 : RadiusAt(c / 2.0), 0.0);
            for (int k = 0; k < ends.Count; k++)
            {
                var (end, _) = ends[k];
                int first = k > 0 ? outer[k - 1] : 0;
                int last = k < steps ? inner[k] : 0;
                var segment = new List<int>();
                if (first > 0) { segment.Add(first); enclosed += 12L * first * first; }
                long fillEnd = end - 12L * last * last;
                // Beyond the segment: the next segment's first (flank) shell, or the surface.
                double nextPoint = k == ends.Count - 1 ? double.NaN
                    : k < steps && outer[k] > 0 ? RadiusAt(end + 6.0 * outer[k] * outer[k]) : FirstGreedyPoint(end, ends[k + 1].End);
                var fill = BestFill(enclosed, fillEnd, segment, last, previous, nextPoint);
                segment.AddRange(fill);
                if (last > 0) segment.Add(last);
                sides.AddRange(segment);
                enclosed = end;
                previous = Chain(end - SumPoints(segment), segment, previous, null, null);
            }
            return Assemble(c, sides, [.. ends.Take(steps).Select(e => e.Step)]);
        }

        /// <summary>
        /// Points' radius of the first greedy shell of the segment [<paramref name="from"/>, <paramref name="to"/>): where
        /// a step has no flanks the last shell below it faces that shell, not the step (+∞ when no shell of the target
        /// aspect fits, read as a face on the step).
        /// </summary>
        private double FirstGreedyPoint(long from, long to)
        {
            long q = (to - from) / 12;
            if (q < 1) return double.PositiveInfinity;
            var (n, capped) = BestNSide(from, RadiusAt(from), q);
            return capped ? double.PositiveInfinity : RadiusAt(from + 6.0 * n * n);
        }

        /// <summary>
        /// N_side of the shell flanking the step at <paramref name="step"/> (boundary count <paramref name="boundary"/>)
        /// on one side. The outer flank has radial thickness t = √(d_in d_out) (times a^{2/3} for a target aspect a),
        /// d = (m/ρ)^{1/3} the cubic-cell spacing just inside and just outside the step; the inner flank puts its points'
        /// radius (its mass midpoint) at the mirror image of the outer flank's about the boundary, so the bisector between
        /// the two — their shared Voronoi face — lies on the step. Both then have about the same thickness and aspects
        /// (d_out/d_in)^{±3/4}, whose product is 1.
        /// </summary>
        private int Flank(long boundary, DensityJump step, bool outward)
        {
            double dIn = Math.Cbrt(_m / step.InnerDensity), dOut = Math.Cbrt(_m / step.OuterDensity);
            if (!double.IsFinite(dIn) || !double.IsFinite(dOut)) return 0;
            double t = Math.Sqrt(dIn * dOut) * Math.Pow(_targetAspect, 2.0 / 3.0); // thickness a·ℓ with ℓ ∝ a^(−1/3) at fixed volume
            double rb = RadiusAt(boundary);
            double light = profile.EnclosedMass(Math.Min(rb + t, profile.OuterRadius)) - profile.EnclosedMass(rb);
            int nOut = Math.Max(1, (int)Math.Round(Math.Sqrt(light / (12 * _m))));
            // Where the light side holds much less than a shell of 12 points in the designed thickness (a sparse layer over
            // a dense one, e.g. a 1e4 step with few points beyond it), the outer flank is far thicker than t, and its mirror
            // image would pull the dense side's mass from deep inside into one thick inner flank (seen: 46128 of 5e4
            // points on one shell of aspect 50). No flanks then (0); the step still falls on a shell boundary.
            if (!(RadiusAt(boundary + 12.0 * nOut * nOut) - rb <= 2 * t)) return 0;
            if (outward) return nOut;
            // The inner flank is matched to the outer one as rounded (its N_side is the coarser): its mass midpoint goes to
            // the mirror image of the outer flank's points, 2 r_b − p_out, so the bisector between them is the step.
            long outCount = 12L * nOut * nOut;
            double pOut = RadiusAt(boundary + outCount / 2.0);
            double mirror = Math.Max(0, 2 * rb - pOut);
            double half = profile.EnclosedMass(rb) - profile.EnclosedMass(mirror);
            return Math.Max(1, (int)Math.Round(Math.Sqrt(half / (6 * _m))));
        }

        /// <summary>
        /// Point counts at which shell boundaries must fall, with the step radius: each density step r_s at
        /// c + 12 round((M(r_s)/m − c)/12) (within six points' mass of the step), then N (step NaN). A step is dropped
        /// when a segment it bounds cannot hold even one shell of the target aspect (a layer thinner than the local
        /// point spacing, such as a tenuous envelope over a few points): such a layer is below the resolution of
        /// equal-mass points either way, and a shell of a dozen points spread over it would stand for it worse than the
        /// neighbouring shell's points.
        /// </summary>
        private List<(long End, DensityJump Step)> SegmentEnds(int c)
        {
            var ends = new List<(long End, DensityJump Step)>();
            long previous = c;
            var jumps = findSteps ? DensityJumps.Find(profile, _m) : DensityJumps.Declared(profile);
            foreach (var step in jumps)
            {
                long target = c + 12 * (long)Math.Round((profile.EnclosedMass(step.Radius) / _m - c) / 12);
                if (target > previous && target < count) { ends.Add((target, step)); previous = target; }
            }
            ends.Add((count, default));
            for (bool changed = true; changed && ends.Count > 1;)
            {
                changed = false;
                for (int k = 0; k < ends.Count; k++)
                {
                    long start = k == 0 ? c : ends[k - 1].End;
                    if (!Unresolved(start, ends[k].End)) continue;
                    // Merge with the next segment (drop this end), or, for the last one, with the previous.
                    ends.RemoveAt(k < ends.Count - 1 ? k : k - 1);
                    changed = true;
                    break;
                }
            }
            return ends;
        }

        // True when the points [start, end) cannot fill one shell of the target aspect.
        private bool Unresolved(long start, long end)
        {
            long q = (end - start) / 12;
            return q < 1 || BestNSide(start, RadiusAt(start), q).Capped;
        }

        private double RadiusAt(double points) =>
            points <= 0 ? 0.0 : points >= count ? profile.OuterRadius : profile.RadiusOfEnclosedMass(Math.Min(profile.TotalMass, points * _m));

        private readonly double _targetAspect = aspect;

        /// <summary>
        /// The fill of points [from, to) between a segment's flanks. Candidates: the greedy outward pass of shells closest
        /// to the target aspect closed by <see cref="FinishTail"/>, and the same greedy start closed by
        /// <see cref="SmoothTargets"/> with the fractional shell count rounded down or up. Where the fill meets a flank or an
        /// awkward remainder (a shell much thinner than its neighbours, or pairs of equal N_side in a short segment), the
        /// faces between unlike shells move off the shell boundaries and whole shells of cells come out too large or too
        /// small; so the candidate whose shells' predicted ln(V ρ / m) has the smallest rms, with
        /// <see cref="ShapePenalty"/> added, is kept (ties to the first). The prediction is the 1-D one: shell j's cells
        /// reach from the midpoint between its points' radius and its inner neighbour's to the midpoint with its outer
        /// neighbour's, and hold the profile mass between them (the surface shell, reaching R, is left out of the
        /// prediction, its offset being the surface layer's, but not of the shape term).
        /// </summary>
        private List<int> BestFill(long from, long to, List<int> head, int tail, Layer previous, double nextPoint)
        {
            var greedy = Greedy(from, to, out long q);
            var candidates = new List<List<int>>();
            var classic = new List<int>(greedy);
            if (q > 0) FinishTail(classic, q);
            candidates.Add(classic);
            long start = from - SumPoints(head);
            if (q > 0)
            {
                int w = Math.Min(SmoothWindow, greedy.Count);
                long total = q;
                for (int i = greedy.Count - w; i < greedy.Count; i++) total += (long)greedy[i] * greedy[i];
                var fixedPart = new List<int>(head);
                fixedPart.AddRange(greedy.Take(greedy.Count - w));
                long windowStart = start + SumPoints(fixedPart);
                foreach (bool up in new[] { false, true })
                {
                    var targets = SmoothTargets(windowStart, total, up);
                    if (targets is null) continue;
                    var near = NearIntegers(total, targets);
                    if (near is not null) candidates.Add([.. greedy.Take(greedy.Count - w), .. near]);
                    var predicted = PredictedSearch(start, fixedPart, targets, total, tail, previous, nextPoint);
                    if (predicted is not null) candidates.Add([.. greedy.Take(greedy.Count - w), .. predicted]);
                }
            }
            List<int>? best = null;
            double bestCost = double.PositiveInfinity;
            foreach (var fill in candidates)
            {
                var shells = new List<int>(head);
                shells.AddRange(fill);
                if (tail > 0) shells.Add(tail);
                double cost = PredictedRms(start, shells, previous, nextPoint);
                if (cost < bestCost) { bestCost = cost; best = fill; }
            }
            return best!;
        }

        // Greedy shells from `from` until capped; `remainder` is what is left of (to − from)/12 in units of N².
        private List<int> Greedy(long from, long to, out long remainder)
        {
            long enclosed = from;
            long q = (to - enclosed) / 12;
            double rIn = RadiusAt(enclosed);
            var fill = new List<int>();
            while (q > 0)
            {
                var (best, capped) = BestNSide(enclosed, rIn, q);
                if (capped) break; // what is left cannot fill a shell of the target aspect
                fill.Add(best);
                enclosed += 12L * best * best;
                q -= (long)best * best;
                rIn = RadiusAt(enclosed);
            }
            remainder = q;
            return fill;
        }

        // Shells taken back from the greedy pass when closing smoothly.
        private const int SmoothWindow = 10;

        /// <summary>
        /// Real N_side for re-spacing a run of <paramref name="total"/> (units of N²) from count <paramref name="start"/> —
        /// the greedy fill's last (up to) ten shells and the remainder — as one smooth run: the aspect a′ is found
        /// (bisection) at which real-valued shells of aspect a′ fill the run with a whole number K of shells, K the run's
        /// fractional count at the target aspect rounded down or up. Null when no such a′ lies within e^(±3) of the target.
        /// </summary>
        private List<double>? SmoothTargets(long start, long total, bool roundUp)
        {
            double fractional = RealShells(start, total, _targetAspect, null);
            int k = roundUp ? (int)Math.Ceiling(fractional) : (int)Math.Floor(fractional);
            if (k < 1 || k > 4 * SmoothWindow) return null;
            // The count falls as a′ grows: find a′ with exactly k shells.
            double lo = Math.Log(_targetAspect) - 3, hi = Math.Log(_targetAspect) + 3;
            if (RealShells(start, total, Math.Exp(lo), null) < k || RealShells(start, total, Math.Exp(hi), null) > k) return null;
            for (int it = 0; it < 60; it++)
            {
                double mid = 0.5 * (lo + hi);
                if (RealShells(start, total, Math.Exp(mid), null) > k) lo = mid; else hi = mid;
            }
            var targets = new List<double>();
            RealShells(start, total, Math.Exp(hi), targets);
            while (targets.Count > k) targets.RemoveAt(targets.Count - 1);
            if (targets.Count < k) return null;
            // The last real shell absorbs what the bisection left (tiny).
            double used = 0;
            for (int i = 0; i < k - 1; i++) used += targets[i] * targets[i];
            targets[^1] = Math.Sqrt(Math.Max(total - used, 1.0));
            return targets;
        }

        // Integers near the targets (relative error) with Σ N² = total, as in FinishTail; null if none found.
        private static int[]? NearIntegers(long total, List<double> targets)
        {
            double smallest = double.PositiveInfinity;
            foreach (double t in targets) smallest = Math.Min(smallest, t);
            int deltaMax = Math.Max(2, (int)Math.Ceiling(0.3 * smallest));
            for (int delta = 1; delta <= 2 * deltaMax; delta *= 2)
            {
                var found = SumOfSquares.NearTargets(total, [.. targets], Math.Min(delta, deltaMax), SearchBudget);
                if (found is not null) return found;
            }
            return null;
        }

        // Nodes visited by one PredictedSearch (each costs two profile look-ups).
        private const int PredictedBudget = 40_000;

        /// <summary>
        /// Integers N_i within ±max(2, 0.3 t_i) of the real targets t_i with Σ N_i² = <paramref name="total"/> that minimise
        /// the predicted Σ ln²(V ρ / m) (see <see cref="PredictedRms"/>) of the window's shells, of the fixed shell before
        /// it and of the tail flank after it: a depth-first search, nearest-to-target first, pruned by the best sum found
        /// and stopped after <see cref="PredictedBudget"/> nodes. Integer N_side cannot follow a smooth run exactly when
        /// N_side is small (a step of one is a large share); this picks the rounding whose faces between unlike shells
        /// fall nearest the shell boundaries, where rounding toward the targets alone can pair up equal N_side.
        /// </summary>
        private int[]? PredictedSearch(long start, List<int> fixedPart, List<double> targets, long total, int tail,
            Layer previous, double nextPoint)
        {
            int k = targets.Count;
            var (lo, hi, minRest, maxRest) = SumOfSquares.Windows([.. targets], t => Math.Max(2, (int)Math.Ceiling(0.3 * t)));
            if (total < minRest[0] || total > maxRest[0]) return null;
            // The layer just before the window (the last fixed shell, or what precedes the segment).
            var before = Chain(start, fixedPart, previous, null, null);
            long count = start + SumPoints(fixedPart);
            var current = new int[k];
            int[]? best = null;
            double bestScore = double.PositiveInfinity;
            int visited = 0;
            Search(0, count, total, before.Points, before.Radius, before.LowerMass, 0.0);
            return best;

            // Error of a layer of `points` points (n = 12 N² for a shell) once the next point radius is known; NaN next =
            // surface (not counted), +∞ = its own outer boundary `end`.
            double Closing(long points, double p, double lower, long end, double next, out double upper)
            {
                upper = double.IsNaN(next) ? double.NaN : double.IsPositiveInfinity(next) ? profile.EnclosedMass(RadiusAt(end)) : profile.EnclosedMass(0.5 * (p + next));
                return double.IsNaN(upper) ? 0.0 : LogMassRatio(upper, lower, points);
            }

            void Search(int i, long at, long remaining, long pointsBefore, double pBefore, double lowerBefore, double score)
            {
                if (++visited > PredictedBudget || score >= bestScore) return;
                long centreN = Math.Clamp((long)Math.Round(targets[i]), lo[i], hi[i]);
                for (long step = 0; SumOfSquares.NextCandidate(centreN, ref step, i, remaining, lo, hi, minRest, maxRest, out long a, out long rest); step++)
                {
                    if (i == k - 1 && rest != 0) continue;
                    long size = 12 * a * a;
                    double p = RadiusAt(at + size / 2.0);
                    double lower = 0.0, s = score + ShapePenalty(at, (int)a);
                    if (pointsBefore > 0)
                    {
                        lower = profile.EnclosedMass(0.5 * (pBefore + p));
                        double e = LogMassRatio(lower, lowerBefore, pointsBefore);
                        s += e * e;
                    }
                    current[i] = (int)a;
                    if (i < k - 1)
                    {
                        Search(i + 1, at + size, rest, size, p, lower, s);
                    }
                    else
                    {
                        // Close the window: its last shell, then the tail flank (if any), against what lies beyond.
                        long end = at + size;
                        if (tail > 0)
                        {
                            long tailSize = 12L * tail * tail;
                            double pt = RadiusAt(end + tailSize / 2.0);
                            double e = Closing(size, p, lower, end, pt, out double upper);
                            double et = Closing(tailSize, pt, upper, end + tailSize, nextPoint, out _);
                            s += e * e + et * et;
                        }
                        else
                        {
                            double e = Closing(size, p, lower, end, nextPoint, out _);
                            s += e * e;
                        }
                        if (s < bestScore) { bestScore = s; best = (int[])current.Clone(); }
                    }
                    if (visited > PredictedBudget) return;
                }
            }
        }

        /// <summary>
        /// Real-valued shells of aspect <paramref name="a"/> from count <paramref name="start"/> over <paramref name="total"/>
        /// (units of N²): returns how many fit, the last one fractional (by its share of Σ N²); their N_side go to
        /// <paramref name="sides"/> when given.
        /// </summary>
        private double RealShells(long start, long total, double a, List<double>? sides)
        {
            double enclosed = start, left = total, shells = 0;
            while (left > 1e-9 && shells < 8 * SmoothWindow)
            {
                double rIn = RadiusAt(enclosed);
                // Aspect grows with N (thicker and finer): bisect on log N for aspect = a.
                double lo = 0, hi = Math.Log(Math.Sqrt(Math.Max(left, 1.0)) * 4 + 4);
                for (int it = 0; it < 50; it++)
                {
                    double mid = 0.5 * (lo + hi);
                    if (RealLogAspect(enclosed, rIn, Math.Exp(mid)) < Math.Log(a)) lo = mid; else hi = mid;
                }
                double n = Math.Exp(0.5 * (lo + hi));
                double n2 = n * n;
                sides?.Add(n);
                if (n2 >= left) return shells + left / n2;
                shells += 1;
                left -= n2;
                enclosed += 12 * n2;
            }
            return shells;
        }

        // log of the aspect of a shell of real N_side n starting at count `enclosed` (radius rIn).
        private double RealLogAspect(double enclosed, double rIn, double n)
        {
            double shell = 12 * n * n;
            double rOut = RadiusAt(enclosed + shell);
            double rMid = RadiusAt(enclosed + shell / 2);
            double spacing = rMid * Math.Sqrt(Math.PI / 3) / n;
            return Math.Log(Math.Max((rOut - rIn) / spacing, 1e-300));
        }

        private static long SumPoints(List<int> sides)
        {
            long s = 0;
            foreach (int n in sides) s += 12L * n * n;
            return s;
        }

        /// <summary>A layer of points for the 1-D face prediction: its point count (0: none, the next shell's cells reach
        /// the centre), its points' radius, and the profile mass inside its lower face.</summary>
        private readonly record struct Layer(long Points, double Radius, double LowerMass);

        // ln(mass between the faces / mass of the layer's points).
        private double LogMassRatio(double upper, double lower, long points) => Math.Log(Math.Max(upper - lower, 1e-300) / (points * _m));

        /// <summary>
        /// Walks <paramref name="shells"/> (starting at count <paramref name="start"/>, after <paramref name="previous"/>)
        /// and returns the last shell as a layer (or <paramref name="previous"/> when there are none); fills each shell's
        /// points' radius and lower-face mass when the lists are given. Faces lie midway between neighbours' radii.
        /// </summary>
        private Layer Chain(long start, List<int> shells, Layer previous, List<double>? radius, List<double>? lowerMass)
        {
            long enclosed = start;
            var last = previous;
            foreach (int n in shells)
            {
                long size = 12L * n * n;
                double p = RadiusAt(enclosed + size / 2.0);
                double lower = last.Points > 0 ? profile.EnclosedMass(0.5 * (last.Radius + p)) : 0.0;
                radius?.Add(p);
                lowerMass?.Add(lower);
                last = new Layer(size, p, lower);
                enclosed += size;
            }
            return last;
        }

        /// <summary>
        /// rms of the 1-D prediction of ln(V ρ / m) over <paramref name="previous"/> (when it has points) and
        /// <paramref name="shells"/> (starting at count <paramref name="start"/>): faces midway between neighbouring layers'
        /// point radii; NaN <paramref name="nextPoint"/> means the last shell is the surface one (left out), +∞ that its
        /// outer face is its own outer boundary.
        /// </summary>
        private double PredictedRms(long start, List<int> shells, Layer previous, double nextPoint)
        {
            int k = shells.Count;
            if (k == 0) return 0;
            var p = new List<double>(k);
            var lower = new List<double>(k);
            Chain(start, shells, previous, p, lower);
            double sum = 0;
            int counted = 0;
            if (previous.Points > 0)
            {
                double e = LogMassRatio(lower[0], previous.LowerMass, previous.Points);
                sum += e * e;
                counted++;
            }
            long end = start + SumPoints(shells);
            long at = start;
            for (int i = 0; i < k; i++)
            {
                sum += ShapePenalty(at, shells[i]);
                at += 12L * shells[i] * shells[i];
            }
            for (int i = 0; i < k; i++)
            {
                long points = 12L * shells[i] * shells[i];
                double upper;
                if (i + 1 < k) upper = lower[i + 1];
                else if (double.IsNaN(nextPoint))
                {
                    // The surface shell holds the mass up to R by construction, but where the density above its points
                    // falls by more than SurfaceContrast before R (a layer too light for a shell of its own, merged into
                    // this segment) its cells swell into that layer: scored in volume form, ρ(p) ΔV / (N m), so the
                    // closing spreads the swelling over more cells. Smooth surfaces (ρ(p) / mean above p ≈ 2.4 for a
                    // (R − r)³ surface) are left out as before.
                    double big = profile.OuterRadius, rp = p[i];
                    double above = profile.TotalMass - profile.EnclosedMass(rp);
                    double meanAbove = above / (4.0 / 3.0 * Math.PI * (big * big * big - rp * rp * rp));
                    if (profile.Density(rp) > SurfaceContrast * meanAbove)
                    {
                        double rLow = profile.RadiusOfEnclosedMass(Math.Min(lower[i], profile.TotalMass));
                        double volume = 4.0 / 3.0 * Math.PI * (big * big * big - rLow * rLow * rLow);
                        double ev = Math.Log(Math.Max(profile.Density(rp) * volume, 1e-300) / (points * _m));
                        sum += ev * ev;
                        counted++;
                    }
                    break;
                }
                else upper = profile.EnclosedMass(double.IsPositiveInfinity(nextPoint) ? RadiusAt(end) : 0.5 * (p[i] + nextPoint));
                double e = LogMassRatio(upper, lower[i], points);
                sum += e * e;
                counted++;
            }
            return Math.Sqrt(sum / Math.Max(counted, 1));
        }

        // Density at the surface shell's points over the mean density above them beyond which its cells are scored by
        // volume (see PredictedRms): well above the ≈ 2.4 of a polytrope-like surface, far below a merged light layer's 100+.
        private const double SurfaceContrast = 10.0;

        // Aspects within this factor of the target cost nothing in the closing's score.
        private const double AspectBand = 1.5;

        /// <summary>
        /// The shape term of a closing's score for the shell of <paramref name="n"/> starting at count
        /// <paramref name="enclosed"/>: (|ln(aspect / target)| − ln 1.5)² beyond a factor 1.5 of the target aspect, else 0.
        /// It keeps the predicted-error choice from buying even cell volumes with cells a mesh code would correct, such as a
        /// shell of a dozen points spread thin over a steep envelope.
        /// </summary>
        private double ShapePenalty(long enclosed, int n)
        {
            double excess = Math.Abs(LogAspectError(enclosed, RadiusAt(enclosed), n)) - Math.Log(AspectBand);
            return excess > 0 ? excess * excess : 0.0;
        }

        /// <summary>log(aspect of the shell with this N_side starting at rIn / target aspect).</summary>
        private double LogAspectError(long enclosed, double rIn, int n)
        {
            long shell = 12L * n * n;
            double rOut = RadiusAt(enclosed + shell);
            double rMid = RadiusAt(enclosed + shell / 2.0);
            double spacing = rMid * Math.Sqrt(Math.PI / 3) / n;
            double ratio = (rOut - rIn) / spacing;
            return Math.Log(Math.Max(ratio, 1e-300) / _targetAspect);
        }

        /// <summary>
        /// The N_side in [1, ⌊√q⌋] whose shell aspect is closest to the target (bisection on the crossing), and
        /// whether even the largest shell that fits the remaining q is thinner than the target.
        /// </summary>
        private (int Best, bool Capped) BestNSide(long enclosed, double rIn, long q)
        {
            int hi = (int)Math.Min(SumOfSquares.ISqrt(q), 13_000);
            if (LogAspectError(enclosed, rIn, hi) < 0) return (hi, true);
            int lo = 1;
            if (LogAspectError(enclosed, rIn, lo) >= 0) return (lo, false);
            while (hi - lo > 1)
            {
                int mid = lo + (hi - lo) / 2;
                if (LogAspectError(enclosed, rIn, mid) >= 0) hi = mid; else lo = mid;
            }
            return (Math.Abs(LogAspectError(enclosed, rIn, lo)) <= Math.Abs(LogAspectError(enclosed, rIn, hi)) ? lo : hi, false);
        }

        /// <summary>
        /// Makes Σ N² of the outer shells match the remaining q exactly: the last (up to) six greedy shells are
        /// taken back and, with the remainder either as one more shell (when it is at least about a third of the
        /// last shell's aspect) or spread over them, re-chosen near their greedy N_side (see the type remarks).
        /// </summary>
        private static void FinishTail(List<int> sides, long remainder)
        {
            int w = Math.Min(TailShells, sides.Count);
            var targets = new List<double>();
            long total = remainder;
            for (int i = sides.Count - w; i < sides.Count; i++)
            {
                targets.Add(sides[i]);
                total += (long)sides[i] * sides[i];
            }
            sides.RemoveRange(sides.Count - w, w);
            double extra = Math.Sqrt(remainder);
            if (w == 0 || extra >= 0.7 * targets[^1]) targets.Add(extra);
            else
            {
                double scale = Math.Sqrt((double)total / (total - remainder));
                for (int i = 0; i < targets.Count; i++) targets[i] *= scale;
            }
            var near = NearIntegers(total, targets);
            if (near is not null)
            {
                sides.AddRange(near);
                return;
            }
            // Fallback (tiny counts or number-theoretic bad luck): equal parts, one more shell each round; always
            // ends, since q ones is a solution.
            for (int l = Math.Max(1, targets.Count); ; l++)
            {
                double a = Math.Sqrt((double)total / l);
                var equal = new double[l];
                Array.Fill(equal, a);
                var found = SumOfSquares.NearTargets(total, equal, (int)Math.Ceiling(a) + 1, SearchBudget);
                if (found is not null)
                {
                    sides.AddRange(found);
                    return;
                }
            }
        }

        private ShellLayout Assemble(int c, List<int> sides, DensityJump[] steps)
        {
            int k = sides.Count;
            var first = new int[k];
            var inner = new double[k];
            var outer = new double[k];
            var pointR = new double[k];
            var enclosedCount = new double[k];
            long enclosed = c;
            double centreOuter = RadiusAt(c);
            double rIn = centreOuter;
            for (int s = 0; s < k; s++)
            {
                long shell = 12L * sides[s] * sides[s];
                first[s] = (int)enclosed;
                inner[s] = rIn;
                pointR[s] = RadiusAt(enclosed + shell / 2.0);
                enclosed += shell;
                outer[s] = RadiusAt(enclosed);
                enclosedCount[s] = enclosed;
                rIn = outer[s];
            }
            double centreR = c <= 1 ? 0.0 : RadiusAt(c / 2.0);
            return new ShellLayout(count, _m, c, centreR, centreOuter, [.. sides], first, inner, outer, pointR, enclosedCount, steps);
        }
    }
}
