using Placement.Relaxation;

namespace Placement.Samplers.Relaxed;

/// <summary>The plan of a <see cref="RelaxedSampler"/>: the relaxed positions, computed once, handed out per batch.</summary>
public sealed class RelaxedPlan : PrecomputedPlan
{
    internal RelaxedPlan(double[] x, double[] y, double[] z, double massPerPoint, RelaxationHistory history)
        : base(x, y, z, massPerPoint) => History = history;

    /// <summary>Convergence history of the relaxation (rms step and kernel-sum scatter per iteration).</summary>
    public RelaxationHistory History { get; }
}
