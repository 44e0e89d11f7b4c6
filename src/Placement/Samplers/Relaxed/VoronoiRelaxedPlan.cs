using Placement.Relaxation;

namespace Placement.Samplers.Relaxed;

/// <summary>The plan of a <see cref="VoronoiRelaxedSampler"/>: the relaxed positions, computed once, handed out per batch.</summary>
public sealed class VoronoiRelaxedPlan : PrecomputedPlan
{
    internal VoronoiRelaxedPlan(double[] x, double[] y, double[] z, double massPerPoint, VoronoiRelaxationHistory history)
        : base(x, y, z, massPerPoint) => History = history;

    /// <summary>Convergence history of the relaxation (std ln(Vρ/m) overall and over the targeted cells, per iteration).</summary>
    public VoronoiRelaxationHistory History { get; }
}
