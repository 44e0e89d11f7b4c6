using System.Globalization;
using Placement.Relaxation;

namespace Placement.Samplers.Relaxed;

/// <summary>
/// Density-adaptive relaxation as a sampler: places points with a built-in start sampler, then relaxes them toward
/// the target density with <see cref="KernelRelaxation"/>; equal masses. Catalogue name <c>relaxed</c>.
/// </summary>
/// <remarks>
/// The start sampler runs with the same request (seed, mode, parallelism) and its default parameters. Relaxation
/// moves points down the gradient of the kernel sum of target volumes and keeps the enclosed mass exact by a rank
/// stretch after every step (see <see cref="KernelRelaxation"/>); the plan carries the convergence history.
/// </remarks>
public sealed class RelaxedSampler : IPointSampler
{
    /// <summary>Parameter: the start sampler.</summary>
    public const string StartParameter = "start";

    /// <summary>Parameter: relaxation iterations.</summary>
    public const string IterationsParameter = "iterations";

    /// <summary>Parameter: neighbour number of the repulsion kernel.</summary>
    public const string NeighboursParameter = "neighbours";

    /// <summary>Parameter: how the enclosed mass is held exact (keep, rank-stretch, auto).</summary>
    public const string RadialParameter = "radial";

    /// <inheritdoc />
    public string Name => "relaxed";

    /// <inheritdoc />
    public SamplerDescription Describe() => new(Name,
        "Any built-in start (HEALPix shells by default) relaxed toward the target density by kernel repulsion, enclosed mass kept exact by a rank stretch; equal masses.",
        [
            new(StartParameter, SamplerParameterKind.Choice, "healpix-shells", "", "Start sampler.",
                RelaxationStart.Choices),
            new(IterationsParameter, SamplerParameterKind.Integer, "30", "steps", "Relaxation iterations.", minimum: 0, maximum: 100_000),
            new(NeighboursParameter, SamplerParameterKind.Real, "64", "", "Neighbour number N_H of the repulsion kernel (Wendland C2).", minimum: 8, maximum: 1000),
            new(RadialParameter, SamplerParameterKind.Choice, "rank-stretch", "", "keep: every point keeps its start radius (shell starts keep their shells); rank-stretch: radii reset to the mass quantiles after each step; auto: keep for shell starts, rank-stretch otherwise.",
                ["auto", "keep", "rank-stretch"]),
        ]);

    /// <inheritdoc />
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var values = request.ParametersFor(Describe());
        var placed = RelaxationStart.Place(request, values.GetChoice(StartParameter), out var start);
        var history = KernelRelaxation.Relax(placed, request.Profile, new RelaxationSettings
        {
            MaxIterations = values.GetInt32(IterationsParameter),
            NeighbourNumber = values.GetDouble(NeighboursParameter),
            Radial = RelaxationStart.RadialConstraintFor(values.GetChoice(RadialParameter), start.Name),
        }, request.Parallel);
        var plan = new RelaxedPlan(placed.X, placed.Y, placed.Z, request.Profile.TotalMass / placed.Count, history);
        plan.Notes.Add(string.Create(CultureInfo.InvariantCulture,
            $"{start.Name} start relaxed for {history.Iterations} iterations (last rms step {(history.Iterations > 0 ? history.RmsStep[^1] : 0):G3} of the local spacing, kernel-sum scatter {(history.Iterations > 0 ? history.KernelSumScatter[^1] : double.NaN):G3}); {(history.Converged ? "converged" : "iteration limit reached")}."));
        return plan;
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The plan is not a <see cref="RelaxedPlan"/>.</exception>
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        if (plan is not RelaxedPlan rp) throw new ArgumentException("Expected the plan made by this sampler's Plan.", nameof(plan));
        rp.CopyBatch(batch, output);
    }
}
