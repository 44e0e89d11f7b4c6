using System.Globalization;
using Placement.Relaxation;

namespace Placement.Samplers.Relaxed;

/// <summary>
/// Voronoi-based relaxation as a sampler: places points with a built-in start sampler, then relaxes them on their Voronoi
/// cells with <see cref="VoronoiRelaxation"/> (density-weighted Lloyd steps plus a Gauss–Newton volume correction); equal
/// masses. Catalogue name <c>voronoi-relaxed</c>.
/// </summary>
/// <remarks>
/// The start sampler runs with the same request (seed, mode, parallelism) and its default parameters. With
/// <c>radial=auto</c> (default) shell starts keep their radii and other starts are rank-stretched. With
/// <c>radial=keep</c> every point keeps its starting radius (shell starts keep their exact shell masses); with
/// <c>radial=rank-stretch</c> the radii are reset to the mass quantiles after every step. The plan carries the
/// convergence history and two notes: its first and last values, and the std ln(Vρ/m) of every iteration.
/// </remarks>
public sealed class VoronoiRelaxedSampler : IPointSampler
{
    /// <summary>Parameter: the start sampler.</summary>
    public const string StartParameter = "start";

    /// <summary>Parameter: iteration limit.</summary>
    public const string IterationsParameter = "iterations";

    /// <summary>Parameter: tolerance on the rms ln(Vρ/m) of the targeted cells.</summary>
    public const string ToleranceParameter = "tolerance";

    /// <summary>Parameter: Lloyd fraction α.</summary>
    public const string LloydParameter = "lloyd";

    /// <summary>Parameter: radial constraint.</summary>
    public const string RadialParameter = "radial";

    /// <inheritdoc />
    public string Name => "voronoi-relaxed";

    /// <inheritdoc />
    public SamplerDescription Describe() => new(Name,
        "Any built-in start (HEALPix shells by default) relaxed on its Voronoi cells: density-weighted Lloyd steps plus a Gauss-Newton correction of the cell volumes toward m/rho; radii kept (exact shell masses) or rank-stretched; equal masses.",
        [
            new(StartParameter, SamplerParameterKind.Choice, "healpix-shells", "", "Start sampler.",
                RelaxationStart.Choices),
            new(IterationsParameter, SamplerParameterKind.Integer, "15", "steps", "Iteration limit.", minimum: 0, maximum: 10_000),
            new(ToleranceParameter, SamplerParameterKind.Real, "0.002", "", "Stop when the rms ln(V rho/m) of the cells inside the body falls below this.", minimum: 0, maximum: 1),
            new(LloydParameter, SamplerParameterKind.Real, "0.9", "", "Fraction of the way to the rho^(5/3)-weighted centroid per step (0 = volume correction only).", minimum: 0, maximum: 1),
            new(RadialParameter, SamplerParameterKind.Choice, "auto", "", "keep: every point keeps its start radius; rank-stretch: radii reset to the mass quantiles after each step; auto: keep for shell starts, rank-stretch otherwise.",
                ["auto", "keep", "rank-stretch"]),
        ]);

    /// <inheritdoc />
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var values = request.ParametersFor(Describe());
        var placed = RelaxationStart.Place(request, values.GetChoice(StartParameter), out var start);
        var history = VoronoiRelaxation.Relax(placed, request.Profile, new VoronoiRelaxationSettings
        {
            MaxIterations = values.GetInt32(IterationsParameter),
            Tolerance = values.GetDouble(ToleranceParameter),
            LloydFraction = values.GetDouble(LloydParameter),
            Radial = RelaxationStart.RadialConstraintFor(values.GetChoice(RadialParameter), start.Name),
        }, request.Parallel);
        var plan = new VoronoiRelaxedPlan(placed.X, placed.Y, placed.Z, request.Profile.TotalMass / placed.Count, history);
        bool any = history.LogRatioStd.Length > 0;
        plan.Notes.Add(string.Create(CultureInfo.InvariantCulture,
            $"{start.Name} start relaxed on its Voronoi cells for {history.Iterations} iterations: std ln(Vρ/m) {(any ? history.LogRatioStd[0] : double.NaN):G3} → {(any ? history.LogRatioStd[history.ResultIndex] : double.NaN):G3} overall, {(any ? history.InteriorLogRatioStd[0] : double.NaN):G3} → {(any ? history.InteriorLogRatioStd[history.ResultIndex] : double.NaN):G3} in cells not cut by the surface; {(history.Converged ? "converged" : "iteration limit reached")}."));
        // The whole convergence history as a note, so `place --json` and the console carry it for plotting.
        var steps = new System.Text.StringBuilder("history per iteration, std ln(Vρ/m) overall / cells not cut by the surface (* = step undone):");
        for (int k = 0; k < history.LogRatioStd.Length; k++)
            steps.Append(CultureInfo.InvariantCulture, $" {history.LogRatioStd[k]:G4}/{history.InteriorLogRatioStd[k]:G4}{(history.Undone[k] ? "*" : "")}");
        plan.Notes.Add(steps.ToString());
        return plan;
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The plan is not a <see cref="VoronoiRelaxedPlan"/>.</exception>
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        if (plan is not VoronoiRelaxedPlan rp) throw new ArgumentException("Expected the plan made by this sampler's Plan.", nameof(plan));
        rp.CopyBatch(batch, output);
    }
}
