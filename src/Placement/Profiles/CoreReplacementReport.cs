using Placement.Units;

namespace Placement.Profiles;

/// <summary>What a core replacement did and how well the result holds together (see <see cref="CoreReplacement"/>).</summary>
/// <param name="Units">Units of every dimensional number below.</param>
/// <param name="PressureQuantity">Name of the carried quantity used as pressure.</param>
/// <param name="CutRadius">r_c, length units.</param>
/// <param name="SofteningLength">h of the core (spline support), length units.</param>
/// <param name="Index">Polytropic index n of the replaced gas.</param>
/// <param name="PolytropicConstant">K in P = Kρ^(1+1/n), pressure/density^(1+1/n) of <paramref name="Units"/>.</param>
/// <param name="CoreMass">m_c of the softened core, mass units (0 when the gas alone matches).</param>
/// <param name="OriginalMassInsideCut">M(r_c) of the original profile, mass units.</param>
/// <param name="GasMassInsideCut">Gas mass inside r_c after the replacement, mass units.</param>
/// <param name="OriginalCentralDensity">ρ(0) of the original profile, mass/length³ (+∞ for a cusp).</param>
/// <param name="CentralDensity">ρ(0) of the replaced gas, mass/length³.</param>
/// <param name="DensityAtCut">ρ(r_c) of the original profile, mass/length³.</param>
/// <param name="PressureAtCut">P(r_c) of the original profile, pressure units.</param>
/// <param name="DensityMismatch">|ρ_new(r_c) − ρ(r_c)| / ρ(r_c).</param>
/// <param name="PressureMismatch">|P_new(r_c) − P(r_c)| / P(r_c).</param>
/// <param name="MassMismatch">|m_gas(r_c) + m_c − M(r_c)| / M(r_c) as the shooting left it, before m_c absorbs it (see <see cref="CoreReplacement"/>).</param>
/// <param name="HydrostaticInside">Hydrostatic residual of the replaced gas with the core's softened gravity, 0 &lt; r &lt; r_c.</param>
/// <param name="HydrostaticOutside">Hydrostatic residual of the untouched profile outside the cut (up to 99 % of the mass).</param>
/// <param name="SolutionNodes">Points of the dense solution inside the cut.</param>
public sealed record CoreReplacementReport(
    UnitSystem Units,
    string PressureQuantity,
    double CutRadius,
    double SofteningLength,
    double Index,
    double PolytropicConstant,
    double CoreMass,
    double OriginalMassInsideCut,
    double GasMassInsideCut,
    double OriginalCentralDensity,
    double CentralDensity,
    double DensityAtCut,
    double PressureAtCut,
    double DensityMismatch,
    double PressureMismatch,
    double MassMismatch,
    HydrostaticResidual HydrostaticInside,
    HydrostaticResidual HydrostaticOutside,
    int SolutionNodes)
{
    /// <summary>Gas mass taken out of the region inside the cut (and put into the core), mass units.</summary>
    public double RemovedGasMass => OriginalMassInsideCut - GasMassInsideCut;
}
