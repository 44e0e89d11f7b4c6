namespace Placement.Relaxation;

/// <summary>Settings of <see cref="VoronoiRelaxation"/>.</summary>
public sealed record VoronoiRelaxationSettings
{
    /// <summary>Largest number of iterations (default 40).</summary>
    public int MaxIterations { get; init; } = 40;

    /// <summary>Stop when the rms of ln(V ρ_target/m) over the targeted cells falls below this (default 0.002).</summary>
    public double Tolerance { get; init; } = 0.002;

    /// <summary>
    /// Fraction of the way to the density-weighted centroid each generator moves per iteration (Lloyd part, 0 to 1;
    /// default 0.3). The volume correction then cancels the Lloyd part's first-order change of the cell volumes.
    /// </summary>
    public double LloydFraction { get; init; } = 0.3;

    /// <summary>Exponent p of the Lloyd weight w = ρ^p (default 5/3: generator density ∝ w^{3/5} = ρ in 3-D).</summary>
    public double LloydWeightExponent { get; init; } = 5.0 / 3.0;

    /// <summary>Fraction of the Gauss–Newton volume correction applied per iteration (default 1).</summary>
    public double VolumeStepFraction { get; init; } = 1.0;

    /// <summary>Conjugate-gradient iterations of the Gauss–Newton solve per relaxation iteration (default 40).</summary>
    public int SolverIterations { get; init; } = 40;

    /// <summary>
    /// Levenberg–Marquardt shift ε of the Gauss–Newton solve, relative to diag(J Jᵀ) (default 0.1: on a HEALPix-shell start
    /// of an n = 3/2 polytrope with fixed radii, 5000 points, 1e-3 diverged, 1e-2 stalled at 0.027 and 0.1 or 0.3 reached 0.016–0.019).
    /// </summary>
    public double Regularisation { get; init; } = 0.1;

    /// <summary>Largest move of one generator in one iteration, in units of its cell radius (3V/4π)^{1/3} (default 0.25).</summary>
    public double MaxStepInCellRadii { get; init; } = 0.25;

    /// <summary>How the radii are held so the enclosed mass stays exact (default <see cref="RadialConstraint.KeepRadii"/>).</summary>
    public RadialConstraint Radial { get; init; } = RadialConstraint.KeepRadii;
}
