using Placement.Bodies;

namespace Placement.Commands.Reports;

/// <summary>The "body" section of the place report and summary: thermodynamics, resolution and energy budget (each null when not asked for).</summary>
internal sealed record BodyReport(BodyThermodynamicsSection? Thermodynamics, BodyResolutionSection? Resolution, BodyEnergySection? Energy)
{
    /// <summary>Per-point columns that carry a profile quantity: column name → quantity name (not reported; used to fill a background medium).</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public Dictionary<string, string> CarriedColumns { get; init; } = new(StringComparer.Ordinal);
}

/// <summary>How the points got their internal energy and what the match costs.</summary>
/// <param name="Gamma">Adiabatic index.</param>
/// <param name="EnergySource">'ideal-gas' or 'profile:NAME'.</param>
/// <param name="Match">'density+pressure' or 'density+entropy'.</param>
/// <param name="PointDensity">The point density estimate: 'sph' or 'voronoi'.</param>
/// <param name="Columns">Per-point columns written, with their units.</param>
/// <param name="PressureDeviation">Implied pressure (γ−1)ρ_pt u against the profile's P.</param>
/// <param name="EntropyDeviation">Implied adiabat against the profile's K = P/ρ^γ.</param>
/// <param name="DensityDeviation">Point density against the profile's.</param>
/// <param name="UndefinedPoints">Points at or beyond the surface (u = 0).</param>
internal sealed record BodyThermodynamicsSection(
    double Gamma, string EnergySource, string Match, string PointDensity, IReadOnlyDictionary<string, string> Columns,
    RelativeDeviation PressureDeviation, RelativeDeviation EntropyDeviation, RelativeDeviation DensityDeviation, int UndefinedPoints);

/// <summary>Cells per pressure scale height of the placed points, per radial bin.</summary>
internal sealed record BodyResolutionSection(
    string LengthUnit, string Spacing, double Threshold, double InnerRadius, double MassFraction, double MinimumCellsPerScaleHeight,
    double LimitingRadius, double PointsNeeded, double[] Radius, double[] ScaleHeight, double[] SpacingLength, double[] CellsPerScaleHeight, double[] PointsNeededPerBin);

/// <summary>The energy budget of the points against the profile (energies in <paramref name="EnergyUnit"/>).</summary>
internal sealed record BodyEnergySection(
    string EnergyUnit, double OpeningAngle, double Gamma, BodyEnergies Points, BodyEnergies Profile,
    double GravitationalDeviation, double ThermalDeviation, double KineticDeviation);

/// <summary>
/// Gravitational (gas self-energy), the gas's potential energy in a softened central core's field (0 without one),
/// thermal and kinetic (or rotational) energy, their total and the virial ratio (2K + 3(γ−1)U)/(−(W + V_core)).
/// </summary>
internal sealed record BodyEnergies(double Gravitational, double CorePotential, double Thermal, double Kinetic, double Total, double VirialRatio);
