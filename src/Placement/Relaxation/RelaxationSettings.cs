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

    /// <summary>Hold the radial mass distribution exact while points move, by <see cref="Radial"/> (default true).</summary>
    public bool KeepRadialMassExact { get; init; } = true;

    /// <summary>
    /// How the enclosed mass is held exact when <see cref="KeepRadialMassExact"/> is set: a rank stretch after every
    /// step (default), or every point kept on its starting radius (steps projected on its sphere), which keeps a shell
    /// start's shells and their exact masses.
    /// </summary>
    public RadialConstraint Radial { get; init; } = RadialConstraint.RankStretch;
}
