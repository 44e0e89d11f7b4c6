using Placement.Relaxation;

namespace Placement.Samplers.Relaxed;

/// <summary>The plan of a <see cref="RelaxedSampler"/>: the relaxed positions, computed once, handed out per batch.</summary>
public sealed class RelaxedPlan : SamplingPlan
{
    internal RelaxedPlan(int count, IReadOnlyList<PlannedBatch> batches, double[] x, double[] y, double[] z, RelaxationHistory history)
        : base(count, batches)
    {
        X = x;
        Y = y;
        Z = z;
        History = history;
    }

    internal double[] X { get; }

    internal double[] Y { get; }

    internal double[] Z { get; }

    /// <summary>Convergence history of the relaxation (rms step and kernel-sum scatter per iteration).</summary>
    public RelaxationHistory History { get; }
}
