using System.Diagnostics;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Tessellation;

namespace Placement.Relaxation;

/// <summary>
/// Relaxation of any point set toward the target profile on its Voronoi cells: density-weighted Lloyd steps for cell
/// regularity plus a Gauss–Newton correction of the cell volumes toward V_i = m_i/ρ_target(r_i), with the enclosed mass
/// kept exact by a radial constraint (fixed radii, or a rank stretch after every step).
/// </summary>
/// <remarks>
/// <para>Residual: g_i = ln(V_i ρ_target(r_i)/m_i), the quality checker's measure. Its derivative with respect to the
/// generators is exact for the volumes (<see cref="VoronoiCellGradients"/>): J_i = (1/V_i) ∂V_i/∂x. The target
/// ρ_target(r_i) is held fixed over a step (radii are set by the rank stretch, and ln ρ has no derivative at density
/// steps), so the correction only rearranges volumes.</para>
/// <para>Step: each generator first moves a fraction α of the way to its cell's centroid weighted by w = ρ^{5/3} (Lloyd
/// 1982; Du, Faber &amp; Gunzburger 1999, SIAM Review 41, 637: generator density ∝ w^{3/5} = ρ in 3-D), L_i = α(c_w,i − x_i).
/// The volume correction is the minimum-norm δ with J δ = −(g + J L) (damped Gauss–Newton: (J Jᵀ) λ = −(g + J L) by
/// Jacobi-preconditioned conjugate gradients, δ = Jᵀ λ), so to first order the Lloyd part leaves the volumes alone and the
/// correction removes the residual. The total L + β δ is capped at a fraction of each cell's radius.</para>
/// <para>Outer surface: the cells tile the ball of the profile radius R. Cells cut by it are left out of the residual:
/// where the density falls steeply to the surface, ρ_target at a generator differs from its cell's mean density by a
/// factor of order one and the cut cells must absorb whatever volume the interior leaves inside R (Σ V_i = (4/3)πR³),
/// so they are free; they still take Lloyd steps and keep their radii (or mass-fraction radii). The quality report gives
/// body, surface and cut cells apart. Limit: for ρ ∝ (R − r)^k at the surface, a layer of cells reaching R whose
/// generators sit at the layer's mass midpoint has ρ(r_i)/ρ̄_layer = (k + 1) 2^(−k/(k+1)) in the planar limit, i.e.
/// ln(Vρ/m) ≈ +0.50 for k = 3/2 and +0.87 for k = 3 [computed]; with the enclosed mass held exact at that radius no
/// step removes it, so the overall std ln(Vρ/m) stays near √f·Δ (f the fraction of cut cells, Δ that offset) whatever
/// the interior reaches.</para>
/// <para>Safeguard: a step that raises the rms residual of the targeted cells is undone and the next step's length
/// halved (the factor grows back by 1.5 after each accepted step), so the result is never worse than the start by that measure.</para>
/// <para>Radii (<see cref="VoronoiRelaxationSettings.Radial"/>): with <see cref="RadialConstraint.KeepRadii"/> every step is
/// projected on the tangent plane (the solve uses J P, P = I − r̂r̂ᵀ) and each point is put back on its own sphere, so the
/// enclosed mass is exactly the start's (shell starts keep their exact shell masses); with
/// <see cref="RadialConstraint.RankStretch"/> <see cref="RadialRankStretch"/> moves the k-th nearest point to the radius
/// enclosing (k + ½)/N of the mass after every step (exact to half a point whatever the step; equal masses). Cells whose
/// ρ_target changes by more than a factor e across them (a density step runs through the cell) are left out of the
/// residual like the cut cells: no arrangement makes V ρ(r_i) = m there. Known steps (declared ones,
/// <see cref="IRadialProfile.DensitySteps"/>, and jumps too narrow for the points, <see cref="DensityJumps.Find"/>) are different: a step-aware shell start ends a shell on each and mirrors
/// the points of the two flanking shells about it, so the face between the two flanking shells lies on the step and ρ_target(r_i) stands for
/// their cells; generators within two cell radii of a known step are targeted but never moved.</para>
/// <para>Deterministic: the tessellation, the geometry and every per-point loop run in fixed chunks that write only their
/// own entries, and sums are taken sequentially, so the same input gives the same bits on any number of threads. Buffers
/// (tessellator, gradients, solver vectors) are reused across iterations. Cost per iteration: one tessellation with face
/// lists, one face rebuild (about as long), and 2 × <see cref="VoronoiRelaxationSettings.SolverIterations"/> sparse products.</para>
/// </remarks>
public static class VoronoiRelaxation
{
    /// <summary>Relaxes <paramref name="points"/> in place toward <paramref name="profile"/>; returns the history.</summary>
    /// <param name="points">Points to move (positions change; masses are kept; target densities are refreshed); profile length units, centred at the origin.</param>
    /// <param name="profile">Target profile, in the same units as the points.</param>
    /// <param name="settings">Settings; defaults when null.</param>
    /// <param name="parallel">Parallelism; results are identical for any setting.</param>
    /// <param name="progress">Receives the fraction of the iteration limit done.</param>
    /// <exception cref="ArgumentException">The units differ, a point has non-positive mass, or a point lies outside the profile radius.</exception>
    public static VoronoiRelaxationHistory Relax(PointSet points, IRadialProfile profile, VoronoiRelaxationSettings? settings = null,
        ParallelSettings? parallel = null, IProgress<double>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(profile);
        settings ??= new VoronoiRelaxationSettings();
        if (points.Units.Name != profile.Units.Name)
            throw new ArgumentException($"Points are in '{points.Units.Name}' units but the profile is in '{profile.Units.Name}'.", nameof(points));
        int n = points.Count;
        double big = profile.OuterRadius;
        for (int i = 0; i < n; i++)
        {
            if (!(points.Mass[i] > 0)) throw new ArgumentException($"Point {i} has mass {points.Mass[i]}; relaxation needs positive masses.", nameof(points));
            if (!(points.Radius(i) <= big))
                throw new ArgumentException($"Point {i} lies at radius {points.Radius(i)}, outside the profile radius {big}.", nameof(points));
        }
        var history = new Recorder();
        if (n < 5) return history.Finish(false);

        // The quality checker's ball: the profile radius, enlarged by 1e-9 so points on the surface lie inside.
        var domain = TessellationDomain.Sphere(0, 0, 0, big * (1 + 1e-9) + 1e-300);
        var tessellator = new VoronoiTessellator(domain, new TessellationOptions { KeepFaces = true, Parallel = parallel });
        var geometry = new VoronoiCellGradients();
        var w = new Workspace(n)
        {
            // The same steps a shell start ends shells on for this point mass: declared ones and jumps found in ρ.
            Steps = [.. DensityJumps.Find(profile, points.TotalMass() / n).Select(j => j.Radius)],
        };
        double[] x = points.X, y = points.Y, z = points.Z, mass = points.Mass;
        bool tangential = settings.Radial == RadialConstraint.KeepRadii;
        for (int i = 0; i < n; i++) w.Radius[i] = points.Radius(i);
        bool converged = false;
        // Trust factor on the whole step: a step that raises the targeted rms is undone and the next one halved; each
        // accepted step lets the factor grow back toward 1. So the result is never worse than the start.
        double trust = 1, accepted = double.PositiveInfinity;
        for (int iteration = 0; ; iteration++)
        {
            var clock = Stopwatch.StartNew();
            var cells = tessellator.Compute(x, y, z);
            Residuals(cells, x, y, z, mass, profile, w, parallel, out double std, out double interiorStd, out double interiorRms, out double maxAbs);
            if (interiorRms > accepted)
            {
                Array.Copy(w.SavedX, x, n); Array.Copy(w.SavedY, y, n); Array.Copy(w.SavedZ, z, n);
                trust *= 0.5;
                history.Add(std, interiorStd, maxAbs, 0, clock.Elapsed.TotalSeconds, true);
                if (iteration >= settings.MaxIterations || trust < 1.0 / 64) break;
                continue;
            }
            accepted = interiorRms;
            bool last = iteration >= settings.MaxIterations || interiorRms < settings.Tolerance;
            if (last)
            {
                converged = interiorRms < settings.Tolerance;
                history.Add(std, interiorStd, maxAbs, 0, clock.Elapsed.TotalSeconds, false);
                break;
            }
            Array.Copy(x, w.SavedX, n); Array.Copy(y, w.SavedY, n); Array.Copy(z, w.SavedZ, n);
            geometry.Update(x, y, z, cells, settings.LloydFraction > 0 ? profile : null, settings.LloydWeightExponent, parallel);
            double rmsStep = Step(cells, geometry, x, y, z, w, settings, tangential, trust, parallel);
            trust = Math.Min(1, 1.5 * trust);
            if (settings.Radial == RadialConstraint.RankStretch) RadialRankStretch.Apply(profile, x, y, z);
            else SphericalSteps.BackToRadii(x, y, z, w.Radius, parallel);
            history.Add(std, interiorStd, maxAbs, rmsStep, clock.Elapsed.TotalSeconds, false);
            progress?.Report((iteration + 1.0) / Math.Max(1, settings.MaxIterations));
        }
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++) points.TargetDensity[i] = profile.Density(points.Radius(i));
        });
        return history.Finish(converged);
    }

    /// <summary>Largest change of ln ρ_target across a cell (between r ∓ its cell radius) for the cell to be targeted.</summary>
    private const double StraddleLimit = 1.0;

    // True when ρ_target changes by more than a factor e across the cell: a density step or a steep edge runs through it,
    // so ρ_target at the generator does not stand for the cell and no arrangement makes V ρ(r_i) = m there.
    private static bool Straddles(IRadialProfile profile, double r, double cellRadius)
    {
        double inner = profile.Density(Math.Max(0, r - cellRadius)), outer = profile.Density(Math.Min(profile.OuterRadius, r + cellRadius));
        if (!(inner > 0) || !(outer > 0)) return true;
        return Math.Abs(Math.Log(inner / outer)) > StraddleLimit;
    }

    // True when a known density step of the profile passes within `reach` of r: the flanking shells a step-aware start
    // put on either side of the step (their shared face on the step, their points half a shell from it) stay put.
    private static bool NextToStep(double[] steps, double r, double reach)
    {
        for (int k = 0; k < steps.Length; k++)
            if (Math.Abs(r - steps[k]) < reach) return true;
        return false;
    }

    // g_i = ln(V_i ρ_t(r_i)/m_i) for every cell; InvVolume_i = 1/V_i for the targeted cells (not cut by the domain, ρ_t > 0,
    // not straddling a density step), else 0.
    private static void Residuals(VoronoiCells cells, double[] x, double[] y, double[] z, double[] mass, IRadialProfile profile, Workspace w,
        ParallelSettings? parallel, out double std, out double interiorStd, out double interiorRms, out double maxAbs)
    {
        int n = cells.Count;
        var steps = w.Steps;
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                double r = Math.Sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
                double rho = profile.Density(r);
                double v = cells.Volume[i];
                w.G[i] = rho > 0 ? Math.Log(v * rho / mass[i]) : double.NaN;
                // A cell next to a known step is targeted (a step-aware start ends its cell on the step, so ρ_t(r_i) stands
                // for it) but its generator stays put; other cells across a steep change are left out.
                bool frozen = NextToStep(steps, r, 2 * cells.CellRadius(i));
                w.Frozen[i] = frozen;
                w.InvVolume[i] = rho > 0 && !cells.CutByDomain[i] && (frozen || !Straddles(profile, r, cells.CellRadius(i))) ? 1.0 / v : 0;
            }
        });
        w.AnyFrozen = steps.Length > 0 && Array.IndexOf(w.Frozen, true) >= 0;
        double sum = 0, sum2 = 0, isum = 0, isum2 = 0, max = 0;
        int count = 0, interior = 0;
        for (int i = 0; i < n; i++)
        {
            double g = w.G[i];
            if (!double.IsFinite(g)) continue;
            sum += g; sum2 += g * g; count++;
            if (w.InvVolume[i] == 0) continue;
            isum += g; isum2 += g * g; interior++;
            max = Math.Max(max, Math.Abs(g));
        }
        std = count > 0 ? Math.Sqrt(Math.Max(0, sum2 / count - (sum / count) * (sum / count))) : double.NaN;
        interiorStd = interior > 0 ? Math.Sqrt(Math.Max(0, isum2 / interior - (isum / interior) * (isum / interior))) : double.NaN;
        interiorRms = interior > 0 ? Math.Sqrt(isum2 / interior) : 0;
        maxAbs = max;
    }

    private static double Step(VoronoiCells cells, VoronoiCellGradients geo, double[] x, double[] y, double[] z, Workspace w,
        VoronoiRelaxationSettings settings, bool tangential, double trust, ParallelSettings? parallel)
    {
        // With fixed radii every motion is projected on the tangent plane: the solve then uses J P, P = I − r̂r̂ᵀ per point.
        var tx = tangential ? x : null; var ty = tangential ? y : null; var tz = tangential ? z : null;
        int n = cells.Count;
        double alpha = settings.LloydFraction;
        var wcx = geo.WeightedCentroidX; var wcy = geo.WeightedCentroidY; var wcz = geo.WeightedCentroidZ;
        for (int i = 0; i < n; i++)
        {
            w.Lx[i] = alpha * (wcx[i] - x[i]);
            w.Ly[i] = alpha * (wcy[i] - y[i]);
            w.Lz[i] = alpha * (wcz[i] - z[i]);
            if (tangential) SphericalSteps.Project(x[i], y[i], z[i], ref w.Lx[i], ref w.Ly[i], ref w.Lz[i]);
            if (w.Frozen[i]) { w.Lx[i] = 0; w.Ly[i] = 0; w.Lz[i] = 0; }
        }
        // Right-hand side b = −(g + J L) on the targeted rows, and the Jacobi preconditioner diag(J Jᵀ).
        ApplyJ(geo, w.InvVolume, w.Lx, w.Ly, w.Lz, w.Q, parallel);
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                double iv = w.InvVolume[i];
                if (iv == 0) { w.B[i] = 0; w.Diag[i] = 1; continue; }
                w.B[i] = -(w.G[i] + w.Q[i]);
                double d = Sq(geo.SelfGradientX[i]) + Sq(geo.SelfGradientY[i]) + Sq(geo.SelfGradientZ[i]);
                for (int f = geo.FaceStart[i]; f < geo.FaceStart[i + 1]; f++)
                    d += Sq(geo.NeighbourGradientX[f]) + Sq(geo.NeighbourGradientY[f]) + Sq(geo.NeighbourGradientZ[f]);
                w.Diag[i] = d * iv * iv;
            }
        });
        Solve(geo, w, settings.SolverIterations, settings.Regularisation, tx, ty, tz, parallel);
        // δ = (J P)ᵀ λ; total step L + β δ, capped at a fraction of the cell radius.
        ApplyJt(geo, w.InvVolume, w.Lambda, w.Dx, w.Dy, w.Dz, tx, ty, tz, w.AnyFrozen ? w.Frozen : null, parallel);
        double beta = settings.VolumeStepFraction, cap = settings.MaxStepInCellRadii * trust;
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                double sx = trust * (w.Lx[i] + beta * w.Dx[i]), sy = trust * (w.Ly[i] + beta * w.Dy[i]), sz = trust * (w.Lz[i] + beta * w.Dz[i]);
                double radius = cells.CellRadius(i), len = Math.Sqrt(sx * sx + sy * sy + sz * sz), limit = cap * radius;
                if (len > limit) { double c = limit / len; sx *= c; sy *= c; sz *= c; len = limit; }
                x[i] += sx; y[i] += sy; z[i] += sz;
                w.Q[i] = Sq(len / radius);
            }
        });
        double sum = 0;
        for (int i = 0; i < n; i++) sum += w.Q[i];
        return Math.Sqrt(sum / n);
    }

    // Jacobi-preconditioned conjugate gradients on (J Jᵀ + εD) λ = b over the targeted rows (λ = 0 elsewhere). The shift εD
    // (D = diag J Jᵀ) damps directions the step cannot reach: with fixed radii the volume of a whole shell of cells barely
    // changes under tangential moves, so its mean residual would otherwise draw huge, useless steps.
    private static void Solve(VoronoiCellGradients geo, Workspace w, int iterations, double regularisation, double[]? tx, double[]? ty, double[]? tz, ParallelSettings? parallel)
    {
        int n = geo.Count;
        double shift = regularisation;
        Array.Clear(w.Lambda, 0, n);
        for (int i = 0; i < n; i++) { w.R[i] = w.B[i]; w.Zv[i] = w.R[i] / w.Diag[i]; w.P[i] = w.Zv[i]; }
        double rz = Dot(w.R, w.Zv, n), start = Dot(w.R, w.R, n);
        for (int k = 0; k < iterations && rz > 0; k++)
        {
            ApplyJt(geo, w.InvVolume, w.P, w.Dx, w.Dy, w.Dz, tx, ty, tz, w.AnyFrozen ? w.Frozen : null, parallel);
            ApplyJ(geo, w.InvVolume, w.Dx, w.Dy, w.Dz, w.Q, parallel);
            for (int i = 0; i < n; i++) w.Q[i] += shift * w.Diag[i] * w.P[i];
            double pq = Dot(w.P, w.Q, n);
            if (!(pq > 0)) break;
            double a = rz / pq;
            for (int i = 0; i < n; i++) { w.Lambda[i] += a * w.P[i]; w.R[i] -= a * w.Q[i]; w.Zv[i] = w.R[i] / w.Diag[i]; }
            double next = Dot(w.R, w.Zv, n);
            if (Dot(w.R, w.R, n) < 1e-8 * start) break;
            double b = next / rz;
            rz = next;
            for (int i = 0; i < n; i++) w.P[i] = w.Zv[i] + b * w.P[i];
        }
    }

    // (J v)_i = (1/V_i)(∂V_i/∂x_i · v_i + Σ_f ∂V_i/∂x_j · v_j) for targeted rows, 0 elsewhere.
    private static void ApplyJ(VoronoiCellGradients geo, double[] invVolume, double[] vx, double[] vy, double[] vz, double[] result, ParallelSettings? parallel)
    {
        ParallelLoop.For(geo.Count, parallel, (s, e) =>
        {
            var start = geo.FaceStart; var nb = geo.FaceNeighbour;
            var gx = geo.NeighbourGradientX; var gy = geo.NeighbourGradientY; var gz = geo.NeighbourGradientZ;
            for (int i = s; i < e; i++)
            {
                double iv = invVolume[i];
                if (iv == 0) { result[i] = 0; continue; }
                double sum = geo.SelfGradientX[i] * vx[i] + geo.SelfGradientY[i] * vy[i] + geo.SelfGradientZ[i] * vz[i];
                for (int f = start[i]; f < start[i + 1]; f++)
                {
                    int j = nb[f];
                    if (j >= 0) sum += gx[f] * vx[j] + gy[f] * vy[j] + gz[f] * vz[j];
                }
                result[i] = iv * sum;
            }
        });
    }

    // (Jᵀ λ)_k = (λ_k/V_k) ∂V_k/∂x_k + Σ_i (λ_i/V_i) ∂V_i/∂x_k over the neighbours i of k (a gather through the reverse faces).
    // With tangent projection (px, py, pz = positions) each result vector is projected on the plane normal to its point's radius.
    private static void ApplyJt(VoronoiCellGradients geo, double[] invVolume, double[] lambda, double[] rx, double[] ry, double[] rz,
        double[]? px, double[]? py, double[]? pz, bool[]? frozen, ParallelSettings? parallel)
    {
        ParallelLoop.For(geo.Count, parallel, (s, e) =>
        {
            var start = geo.FaceStart; var nb = geo.FaceNeighbour; var rev = geo.ReverseFace;
            var gx = geo.NeighbourGradientX; var gy = geo.NeighbourGradientY; var gz = geo.NeighbourGradientZ;
            for (int k = s; k < e; k++)
            {
                double a = lambda[k] * invVolume[k];
                double sx = a * geo.SelfGradientX[k], sy = a * geo.SelfGradientY[k], sz = a * geo.SelfGradientZ[k];
                for (int f = start[k]; f < start[k + 1]; f++)
                {
                    int i = nb[f], g = rev[f];
                    if (i < 0 || g < 0) continue;
                    double b = lambda[i] * invVolume[i];
                    if (b == 0) continue;
                    sx += b * gx[g]; sy += b * gy[g]; sz += b * gz[g];
                }
                if (px is not null) SphericalSteps.Project(px[k], py![k], pz![k], ref sx, ref sy, ref sz);
                if (frozen is not null && frozen[k]) { sx = 0; sy = 0; sz = 0; }
                rx[k] = sx; ry[k] = sy; rz[k] = sz;
            }
        });
    }

    private static double Dot(double[] a, double[] b, int n)
    {
        double sum = 0;
        for (int i = 0; i < n; i++) sum += a[i] * b[i];
        return sum;
    }

    private static double Sq(double v) => v * v;

    private sealed class Workspace(int n)
    {
        public readonly double[] SavedX = new double[n], SavedY = new double[n], SavedZ = new double[n];
        public readonly double[] Radius = new double[n], G = new double[n], InvVolume = new double[n], B = new double[n], Diag = new double[n], Q = new double[n];
        public readonly double[] Lambda = new double[n], R = new double[n], Zv = new double[n], P = new double[n];
        public readonly double[] Lx = new double[n], Ly = new double[n], Lz = new double[n], Dx = new double[n], Dy = new double[n], Dz = new double[n];
        public readonly bool[] Frozen = new bool[n];
        public bool AnyFrozen;
        public double[] Steps { get; init; } = [];
    }

    private sealed class Recorder
    {
        private readonly List<double> _std = [], _interior = [], _max = [], _step = [], _seconds = [];
        private readonly List<bool> _undone = [];

        public void Add(double std, double interior, double max, double step, double seconds, bool undone)
        {
            _std.Add(std); _interior.Add(interior); _max.Add(max); _step.Add(step); _seconds.Add(seconds); _undone.Add(undone);
        }

        public VoronoiRelaxationHistory Finish(bool converged) =>
            new([.. _std], [.. _interior], [.. _max], [.. _step], [.. _seconds], [.. _undone], converged);
    }
}
