namespace Placement.Bodies;

/// <summary>Which two profile quantities the points' thermodynamic state reproduces exactly at their positions.</summary>
/// <remarks>
/// A point whose own density ρ_pt (its SPH or Voronoi estimate) differs from the profile's ρ(r) cannot match density,
/// pressure and entropy at once; the choice says which one gives way. For an ideal gas P = (γ − 1) ρ u and the
/// adiabat K = P / ρ^γ (standard thermodynamics of a γ-law gas).
/// </remarks>
public enum ThermodynamicMatch
{
    /// <summary>u = u(r) of the profile, i.e. P(r) / ((γ − 1) ρ(r)) for an ideal gas: the target pressure at the target density; the pressure the points then carry, (γ − 1) ρ_pt u, deviates from P(r) by ρ_pt / ρ(r).</summary>
    DensityPressure,

    /// <summary>u = u(r) (ρ_pt / ρ(r))^(γ − 1): the profile's adiabat K(r) = P / ρ^γ kept at the point's own density, so the implied pressure K ρ_pt^γ deviates from P(r) by (ρ_pt / ρ(r))^γ.</summary>
    DensityEntropy,
}
