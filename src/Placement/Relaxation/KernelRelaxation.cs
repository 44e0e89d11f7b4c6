using System.Diagnostics;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Spatial;

namespace Placement.Relaxation;

/// <summary>
/// Density-adaptive relaxation of any point set toward the target profile by kernel repulsion (particle shifting),
/// with the radial mass distribution kept exact by a rank stretch after every step.
/// </summary>
/// <remarks>
/// <para>Each point i gets a target support H_i = (3 N_H m_i / (4π ρ_t(r_i)))^(1/3), so a set that follows the target
/// density has about N_H neighbours inside it (the h ∝ (m/ρ)^(1/3) resolution of Diehl et al. 2015, PASA 32, e048).
/// With target volumes V_j = m_j / ρ_t(r_j) the kernel sum S_i = Σ_j V_j W(r_ij, H_i) is ≈ 1 wherever the point
/// density matches the target; each point steps down its gradient, δx_i = −β H_i² ∇S_i (clipped to a fraction of the
/// local spacing), which pushes points out of over-dense spots into under-dense ones. This is the particle-shifting
/// idea of moving particles down a concentration gradient (Lind et al. 2012, J. Comput. Phys. 231, 1499), written
/// with the target volumes so that the equilibrium follows a non-uniform ρ_t.</para>
/// <para>Outer surface: a point near the surface has no neighbours outside and is pushed outward; after every step
/// <see cref="RadialRankStretch"/> moves every point back along its direction to the radius enclosing (k + ½)/N of the
/// mass, so the radial profile (and the enclosed mass, to half a point) stays exact while the repulsion only reorders
/// points tangentially and locally. Points never leave [0, R]. With <see cref="RadialConstraint.KeepRadii"/> every step
/// is projected on the sphere through the point and the point put back on its own radius instead: a shell start keeps
/// its shells (exact shell masses, the outermost layer where the start put it) and only the tangential arrangement
/// relaxes.</para>
/// <para>All points move at once from the same state (Jacobi steps), computed in fixed chunks over a k-d tree, so
/// the result is identical for any thread count. Cost per iteration: one tree build and one neighbour query per point.</para>
/// </remarks>
public static class KernelRelaxation
{
    /// <summary>Relaxes <paramref name="points"/> in place toward <paramref name="profile"/>; returns the history.</summary>
    /// <param name="points">Points to move (positions change; masses are kept; target densities are refreshed).</param>
    /// <param name="profile">Target profile, in the same units as the points.</param>
    /// <param name="settings">Settings; defaults when null.</param>
    /// <param name="parallel">Parallelism; results are identical for any setting.</param>
    /// <param name="progress">Receives the fraction of the iteration limit done.</param>
    /// <exception cref="ArgumentException">The point set and the profile use different units, or a point has zero mass.</exception>
    public static RelaxationHistory Relax(PointSet points, IRadialProfile profile, RelaxationSettings? settings = null,
        ParallelSettings? parallel = null, IProgress<double>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(profile);
        settings ??= new RelaxationSettings();
        if (points.Units.Name != profile.Units.Name)
            throw new ArgumentException($"Points are in '{points.Units.Name}' units but the profile is in '{profile.Units.Name}'.", nameof(points));
        int n = points.Count;
        var steps = new List<double>();
        var scatter = new List<double>();
        var seconds = new List<double>();
        if (n < 2) return new RelaxationHistory([], [], [], true);
        for (int i = 0; i < n; i++)
            if (!(points.Mass[i] > 0)) throw new ArgumentException($"Point {i} has mass {points.Mass[i]}; relaxation needs positive masses.", nameof(points));

        var support = new double[n];
        var volume = new double[n];
        var dx = new double[n];
        var dy = new double[n];
        var dz = new double[n];
        var lnS = new double[n];
        var step2 = new double[n];
        var kernel = settings.Kernel;
        double[] gx0 = [], gy0 = [], gz0 = [], gv = [];
        double supportFactor = 3.0 * settings.NeighbourNumber / (4.0 * Math.PI);
        bool converged = false;
        bool keepRadii = settings.KeepRadialMassExact && settings.Radial == RadialConstraint.KeepRadii;
        double[]? startRadius = null;
        if (keepRadii)
        {
            startRadius = new double[n];
            for (int i = 0; i < n; i++) startRadius[i] = points.Radius(i);
        }
        for (int iteration = 0; iteration < settings.MaxIterations; iteration++)
        {
            var clock = Stopwatch.StartNew();
            // Target volumes and supports at the current radii; a point at zero target density (the surface of a body whose
            // density falls to zero) borrows the density just inside so its volume stays finite.
            double rSafe = profile.OuterRadius * (1 - 1e-9);
            ParallelLoop.For(n, parallel, (s, e) =>
            {
                for (int i = s; i < e; i++)
                {
                    double r = Math.Min(points.Radius(i), rSafe);
                    double rho = profile.Density(r);
                    if (!(rho > 0)) rho = SurfaceDensity(profile, r);
                    volume[i] = points.Mass[i] / rho;
                    support[i] = Math.Cbrt(supportFactor * volume[i]);
                }
            });
            // Mirror ghosts across the surface (r → 2R − r along the same direction) for every point whose support reaches
            // past R, so surface points see a full neighbourhood instead of being pushed outward into empty space.
            int ghosts = 0;
            double big = profile.OuterRadius;
            for (int i = 0; i < n; i++) if (points.Radius(i) + support[i] > big) ghosts++;
            EnsureLength(ref gx0, n + ghosts); EnsureLength(ref gy0, n + ghosts); EnsureLength(ref gz0, n + ghosts); EnsureLength(ref gv, n + ghosts);
            Array.Copy(points.X, gx0, n); Array.Copy(points.Y, gy0, n); Array.Copy(points.Z, gz0, n); Array.Copy(volume, gv, n);
            for (int i = 0, g = n; i < n; i++)
            {
                double r = points.Radius(i);
                if (r + support[i] <= big || !(r > 0)) continue;
                double f = (2 * big - r) / r;
                gx0[g] = points.X[i] * f; gy0[g] = points.Y[i] * f; gz0[g] = points.Z[i] * f; gv[g] = volume[i];
                g++;
            }
            int total = n;
            for (int i = 0; i < n; i++) if (points.Radius(i) + support[i] > big && points.Radius(i) > 0) total++;
            var tree = new KdTree(gx0.AsSpan(0, total), gy0.AsSpan(0, total), gz0.AsSpan(0, total));
            var allVolume = gv;
            double beta = settings.StepFactor, maxStep = settings.MaxStepInSpacings;
            ParallelLoop.For(n, parallel, (s, e) =>
            {
                var search = tree.CreateSearch();
                for (int i = s; i < e; i++)
                {
                    double h = support[i], inv = 1.0 / h;
                    double norm = kernel.Normalisation * inv * inv * inv;
                    double sum = volume[i] * norm * kernel.Shape(0), gx = 0, gy = 0, gz = 0;
                    search.Start(points.X[i], points.Y[i], points.Z[i], i);
                    while (search.Next(h * h, out var hit))
                    {
                        int j = tree.SortedIndex[hit.Slot];
                        double r = Math.Sqrt(hit.DistanceSquared);
                        double q = r * inv;
                        sum += allVolume[j] * norm * kernel.Shape(q);
                        if (r > 0)
                        {
                            // ∇_i W(|x_i − x_j|) = (C/H⁴) w'(q) (x_i − x_j)/r; hit.D* = x_j − x_i.
                            double f = -allVolume[j] * norm * inv * kernel.ShapeDerivative(q) / r;
                            gx += f * hit.Dx; gy += f * hit.Dy; gz += f * hit.Dz;
                        }
                    }
                    lnS[i] = Math.Log(sum);
                    double sx = -beta * h * h * gx, sy = -beta * h * h * gy, sz = -beta * h * h * gz;
                    if (keepRadii) SphericalSteps.Project(points.X[i], points.Y[i], points.Z[i], ref sx, ref sy, ref sz);
                    double spacing = Math.Cbrt(volume[i]);
                    double len = Math.Sqrt(sx * sx + sy * sy + sz * sz), cap = maxStep * spacing;
                    if (len > cap) { double c = cap / len; sx *= c; sy *= c; sz *= c; len = cap; }
                    dx[i] = sx; dy[i] = sy; dz[i] = sz;
                    step2[i] = (len / spacing) * (len / spacing);
                }
            });
            double meanLn = 0, sumStep = 0;
            for (int i = 0; i < n; i++) { meanLn += lnS[i]; sumStep += step2[i]; }
            meanLn /= n;
            double var = 0;
            for (int i = 0; i < n; i++) var += (lnS[i] - meanLn) * (lnS[i] - meanLn);
            for (int i = 0; i < n; i++)
            {
                points.X[i] += dx[i];
                points.Y[i] += dy[i];
                points.Z[i] += dz[i];
            }
            if (keepRadii) SphericalSteps.BackToRadii(points.X, points.Y, points.Z, startRadius!, parallel);
            else if (settings.KeepRadialMassExact) RadialRankStretch.Apply(profile, points.X, points.Y, points.Z);
            double rms = Math.Sqrt(sumStep / n);
            steps.Add(rms);
            scatter.Add(Math.Sqrt(var / n));
            seconds.Add(clock.Elapsed.TotalSeconds);
            progress?.Report((iteration + 1.0) / settings.MaxIterations);
            if (rms < settings.Tolerance) { converged = true; break; }
        }
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++) points.TargetDensity[i] = profile.Density(points.Radius(i));
        });
        return new RelaxationHistory([.. steps], [.. scatter], [.. seconds], converged);
    }

    private static void EnsureLength(ref double[] array, int length)
    {
        if (array.Length < length) array = new double[Math.Max(length, array.Length + array.Length / 2)];
    }

    /// <summary>The last positive density inward of r (for points at a zero-density surface).</summary>
    private static double SurfaceDensity(IRadialProfile profile, double r)
    {
        double probe = r;
        for (int k = 0; k < 60; k++)
        {
            probe *= 1 - Math.Pow(2, k - 40);
            double rho = profile.Density(probe);
            if (rho > 0) return rho;
        }
        return profile.TotalMass / (4.0 / 3.0 * Math.PI * Math.Pow(profile.OuterRadius, 3));
    }
}
