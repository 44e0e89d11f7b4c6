using Placement.Profiles;

namespace Placement.Samplers.Shells;

/// <summary>A sampling plan for a shell sampler: batch 0 is the central cluster (layer 0), batch k ≥ 1 is shell k.</summary>
public sealed class ShellPlan : SamplingPlan
{
    /// <summary>Creates the plan for <paramref name="layout"/> with the sampler's parsed <paramref name="parameters"/>.</summary>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    public ShellPlan(ShellLayout layout, SamplerParameterValues parameters) : base(CheckNotNull(layout).Count, MakeBatches(layout))
    {
        ArgumentNullException.ThrowIfNull(parameters);
        Layout = layout;
        Parameters = parameters;
    }

    /// <summary>The shells: N_side, boundaries, point radii.</summary>
    public ShellLayout Layout { get; }

    /// <summary>The sampler's parameters, parsed once for all shells.</summary>
    public SamplerParameterValues Parameters { get; }

    /// <inheritdoc />
    /// <remarks>Also checks the shells against the profile (<see cref="ShellLayout.CheckValidity"/>).</remarks>
    public override void CheckValidity(IRadialProfile profile, double relativeTolerance = 1e-12)
    {
        base.CheckValidity(profile, relativeTolerance);
        Layout.CheckValidity(profile, relativeTolerance);
    }

    private static ShellLayout CheckNotNull(ShellLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        return layout;
    }

    private static PlannedBatch[] MakeBatches(ShellLayout layout)
    {
        var batches = new PlannedBatch[layout.ShellCount + 1];
        // A single central point stands for the whole central ball: give it the ball's mean density (finite at cusps).
        double ballDensity = layout.CentreCount == 1 && layout.CentreOuterRadius > 0
            ? layout.PointMass / (4.0 / 3.0 * Math.PI * Math.Pow(layout.CentreOuterRadius, 3))
            : double.NaN;
        batches[0] = new PlannedBatch(0, layout.CentreCount, 0, layout.PointMass, layout.CentreRadius, ballDensity);
        for (int k = 0; k < layout.ShellCount; k++)
            batches[k + 1] = new PlannedBatch(layout.FirstPoint[k], layout.ShellPointCount(k), k + 1, layout.PointMass, layout.PointRadius[k]);
        return batches;
    }
}
