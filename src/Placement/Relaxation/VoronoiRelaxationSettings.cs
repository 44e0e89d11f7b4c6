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
    /// default 0.9). The volume correction then cancels the Lloyd part's first-order change of the cell volumes.
    /// </summary>
    /// <remarks>
    /// The volume correction is the minimum-norm step, blind to where the generator sits in its cell; the Lloyd part is
    /// what keeps cells centred. Measured at N = 1e5 from HEALPix shells, 15 iterations (n = 3/2 and n = 3 polytropes, a
    /// Hernquist cusp, the invented two-zone demo star), going from 0.3 to 0.9 cut the cells a moving-mesh code would
    /// correct from 4.2 / 6.7 / 8.3 / 13.8 % to 0.45 / 2.7 / 3.6 / 8.1 % and the SPH noise against ρ̃ by 5–14 %, while the
    /// body std ln(Vρ/m) rose from 0.013–0.014 to 0.017–0.018 (0.172 → 0.171 on the demo star).
    /// </remarks>
    public double LloydFraction { get; init; } = 0.9;

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
