using Placement.Sph;

namespace Placement.Relaxation;

/// <summary>Settings of <see cref="KernelRelaxation"/>.</summary>
public sealed record RelaxationSettings
{
    /// <summary>Largest number of iterations (default 100).</summary>
    public int MaxIterations { get; init; } = 100;

    /// <summary>Stop when the rms step falls below this fraction of the local target spacing (default 1e-3).</summary>
    public double Tolerance { get; init; } = 1e-3;

    /// <summary>Kernel used for the repulsion (default Wendland C2).</summary>
    public SphKernel Kernel { get; init; } = SphKernel.WendlandC2;

    /// <summary>Neighbour number N_H that sets each point's support from the target density (default 64).</summary>
    public double NeighbourNumber { get; init; } = 64;

    /// <summary>Step factor β in δx = −β H² ∇S (default 0.1: on a HEALPix start of an n = 3/2 polytrope, 0.02 was 3× slower and 0.3 oscillated).</summary>
    public double StepFactor { get; init; } = 0.1;

    /// <summary>Largest step of one point in one iteration, in units of its local target spacing (default 0.1).</summary>
    public double MaxStepInSpacings { get; init; } = 0.1;

    /// <summary>Re-apply the radial rank stretch after every step, so the enclosed mass stays exact (default true).</summary>
    public bool KeepRadialMassExact { get; init; } = true;
}
