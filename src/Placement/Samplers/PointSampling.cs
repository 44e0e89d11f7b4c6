using System.Globalization;
using Placement.Parallelism;
using Placement.Points;

namespace Placement.Samplers;

/// <summary>Runs any <see cref="IPointSampler"/>: plans, allocates, fills batches (in parallel) and records provenance.</summary>
public static class PointSampling
{
    /// <summary>Number of points per chunk when target densities are computed point by point.</summary>
    private const int DensityChunk = 256;

    /// <summary>
    /// Places points with <paramref name="sampler"/> for <paramref name="request"/>: calls
    /// <see cref="IPointSampler.Plan"/> once and <see cref="IPointSampler.Fill"/> once per batch.
    /// </summary>
    /// <remarks>
    /// Per batch the driver writes <see cref="PlannedBatch.MassPerPoint"/> into every mass, the batch layer into
    /// every layer index, and the target density: the batch's own density when it gives one, else ρ(|x|) once per batch when the batch lies at one radius, else in
    /// chunks of 256 points through the profile's batch <c>Density</c> call; where ρ is not finite (a cusp at r = 0)
    /// the point gets the mean density m / (4π/3 r(m)³) of the central ball holding its mass m. Batches run through
    /// <see cref="ParallelLoop"/>; jobs smaller than the settings' minimum chunk run on the calling thread.
    /// Memory: the point set takes 44 bytes per point (see <see cref="PointSet"/>), and nothing per point else.
    /// Provenance parameters are the sampler's parameter texts plus <c>mode</c> and <c>requested-count</c>.
    /// </remarks>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The sampler's parameters are invalid (from <see cref="IPointSampler.Plan"/>).</exception>
    /// <exception cref="InvalidOperationException">The sampler returned an invalid plan.</exception>
    public static SamplingResult Place(IPointSampler sampler, SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(sampler);
        ArgumentNullException.ThrowIfNull(request);
        var plan = sampler.Plan(request);
        plan.CheckValidity();
        var points = new PointSet(plan.Count, request.Profile.Units);
        Fill(sampler, request, plan, points);
        return new SamplingResult(points, plan);
    }

    /// <summary>
    /// Fills an existing point set from a plan already made by <paramref name="sampler"/> for
    /// <paramref name="request"/>: lets callers reuse one allocation (fresh memory is slow to touch) and time the
    /// placement alone. Everything else is as in <see cref="Place"/>.
    /// </summary>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentException">The point set's count differs from the plan's, or the parameters are not this sampler's.</exception>
    public static void Fill(IPointSampler sampler, SamplingRequest request, SamplingPlan plan, PointSet points)
    {
        ArgumentNullException.ThrowIfNull(sampler);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(points);
        if (points.Count != plan.Count)
            throw new ArgumentException($"The point set holds {points.Count} points; the plan needs {plan.Count}.", nameof(points));
        var parameters = request.ParametersFor(sampler.Describe());
        var settings = request.Parallel ?? ParallelSettings.Default;
        var batchSettings = plan.Count < settings.MinimumChunk
            ? ParallelSettings.Sequential
            : settings with { MinimumChunk = 1 };
        ParallelLoop.For(plan.Batches.Count, batchSettings, (first, end) =>
        {
            for (int k = first; k < end; k++) FillBatch(sampler, request, plan, k, points);
        });

        var texts = new Dictionary<string, string>(parameters.Texts, StringComparer.OrdinalIgnoreCase)
        {
            ["mode"] = request.Mode == SamplingMode.EqualMassParticles ? "equal-mass-particles" : "mesh-generators",
            ["requested-count"] = request.Count.ToString(CultureInfo.InvariantCulture),
        };
        points.Provenance = new Provenance
        {
            Sampler = sampler.Name,
            Parameters = texts,
            Seed = request.Seed,
            ProfileFingerprint = request.Profile.Fingerprint,
        };
    }

    private static void FillBatch(IPointSampler sampler, SamplingRequest request, SamplingPlan plan, int k, PointSet points)
    {
        var b = plan.Batches[k];
        if (b.Count == 0) return;
        points.Mass.AsSpan(b.Start, b.Count).Fill(b.MassPerPoint);
        points.Layer.AsSpan(b.Start, b.Count).Fill(b.Layer);
        var x = points.X.AsSpan(b.Start, b.Count);
        var y = points.Y.AsSpan(b.Start, b.Count);
        var z = points.Z.AsSpan(b.Start, b.Count);
        sampler.Fill(request, plan, k, new PointSpans(x, y, z));
        var rho = points.TargetDensity.AsSpan(b.Start, b.Count);
        if (double.IsFinite(b.Density))
        {
            rho.Fill(b.Density);
            return;
        }
        if (double.IsFinite(b.Radius))
        {
            rho.Fill(request.Profile.Density(b.Radius));
            return;
        }
        Span<double> r = stackalloc double[DensityChunk];
        for (int s = 0; s < b.Count; s += DensityChunk)
        {
            int n = Math.Min(DensityChunk, b.Count - s);
            for (int i = 0; i < n; i++)
            {
                double xi = x[s + i], yi = y[s + i], zi = z[s + i];
                r[i] = Math.Sqrt(xi * xi + yi * yi + zi * zi);
            }
            var part = rho.Slice(s, n);
            request.Profile.Density(r[..n], part);
            for (int i = 0; i < n; i++)
                if (!double.IsFinite(part[i])) part[i] = CuspDensity(request.Profile, points.Mass[b.Start + s + i]);
        }
    }

    /// <summary>
    /// Target density for a point where ρ is not finite (a central cusp at r = 0): the mean density of the central
    /// ball that holds the point's mass, m / (4π/3 r(m)³).
    /// </summary>
    private static double CuspDensity(Profiles.IRadialProfile profile, double mass)
    {
        double r = profile.RadiusOfEnclosedMass(Math.Min(mass, profile.TotalMass));
        return r > 0 ? mass / (4.0 / 3.0 * Math.PI * r * r * r) : 0.0;
    }
}
