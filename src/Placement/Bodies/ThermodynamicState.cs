namespace Placement.Bodies;

/// <summary>The thermodynamic state given to a set of points (see <see cref="ThermodynamicFields.Compute"/>).</summary>
/// <param name="Options">The options used (γ, energy source, match).</param>
/// <param name="InternalEnergy">Specific internal energy u of every point, length²/time² of the point set's units.</param>
/// <param name="Carried">Every quantity the profile carries (pressure, temperature, composition …) at every point's radius, each in its own unit.</param>
/// <param name="PressureQuantity">Name of the profile quantity used as pressure, or null when the profile carries none.</param>
/// <param name="InternalEnergyQuantity">Name of the profile quantity used as u (source <see cref="InternalEnergySource.Profile"/>), else null.</param>
/// <param name="PressureDeviation">Implied pressure (γ − 1) ρ_pt u of each point against the reference pressure at its radius (profile P, or (γ − 1) ρ u of the profile when it carries no pressure).</param>
/// <param name="EntropyDeviation">Implied adiabat (γ − 1) u ρ_pt^(1−γ) against the reference K = P_ref / ρ^γ at the point's radius.</param>
/// <param name="DensityDeviation">Point density estimate ρ_pt against the profile density ρ(r).</param>
/// <param name="UndefinedCount">Points where the target state is undefined (zero density or pressure: at or beyond the surface); their u is 0.</param>
public sealed record ThermodynamicState(
    ThermodynamicOptions Options,
    double[] InternalEnergy,
    IReadOnlyList<CarriedQuantity> Carried,
    string? PressureQuantity,
    string? InternalEnergyQuantity,
    RelativeDeviation PressureDeviation,
    RelativeDeviation EntropyDeviation,
    RelativeDeviation DensityDeviation,
    int UndefinedCount);
