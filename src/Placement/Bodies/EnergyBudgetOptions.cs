namespace Placement.Bodies;

/// <summary>What <see cref="EnergyBudgets.Compute"/> includes and how it computes the points' gravitational energy.</summary>
public sealed record EnergyBudgetOptions
{
    /// <summary>Opening angle θ in [0, 1] of the tree gravity (<see cref="GravitationalEnergy.OfPointsByTree"/>); 0 uses the exact pairwise sum. Default 0.5.</summary>
    public double OpeningAngle { get; init; } = 0.5;

    /// <summary>Thermodynamics of the profile's thermal energy (γ and energy source); null leaves the thermal energies out.</summary>
    public ThermodynamicOptions? Thermodynamics { get; init; }

    /// <summary>Angular velocity Ω(r) of the profile (1/time, r the spherical radius) for its rotational energy; null for none.</summary>
    public Func<double, double>? AngularVelocity { get; init; }
}
