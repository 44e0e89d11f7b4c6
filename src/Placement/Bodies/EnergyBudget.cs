using Placement.Units;

namespace Placement.Bodies;

/// <summary>Energy budget of a placed body next to the same integrals of its profile (<see cref="EnergyBudgets.Compute"/>).</summary>
/// <remarks>
/// Every energy is in mass·length²/time² of <paramref name="Units"/>; NaN where it cannot be formed (no internal
/// energies, no velocities, no pressure, no Ω(r)). Virial ratio (2K + 3(γ − 1)U) / (−W) = (2K + 3∫P dV)/(−W) for an
/// ideal gas: 1 for a body in equilibrium (virial theorem, standard textbook result); K counts as 0 when absent.
/// With a softened central core (<see cref="Profiles.IRadialProfile.CentralPointMass"/>) the gas also has the potential
/// energy W_c = Σ m Φ_c (∫ Φ_c dm) in the core's field, counted in the totals and the gravitational deviation, and the
/// virial theorem of the gas gains the core's Clausius term V_c = Σ m x·a_c = −G m_c Σ m g(r/h)/r, which replaces W_c in
/// the denominator: (2K + 3(γ − 1)U) / (−(W + V_c)). Both are 0 without a core.
/// </remarks>
/// <param name="Units">Unit system of every energy.</param>
/// <param name="Gamma">Adiabatic index used for the virial ratios.</param>
/// <param name="OpeningAngle">θ of the tree gravity for the points; 0 when the exact pairwise sum was used.</param>
/// <param name="PointsGravitational">W of the points, −G Σ_{i&lt;j} m_i m_j / r_ij.</param>
/// <param name="PointsThermal">U of the points, Σ m u.</param>
/// <param name="PointsKinetic">K of the points, ½ Σ m v².</param>
/// <param name="ProfileGravitational">W of the profile, −G ∫ M dM / r.</param>
/// <param name="ProfileThermal">U of the profile, ∫ u dm.</param>
/// <param name="ProfileRotational">T of the profile, ½ ∫ Ω² ϖ² dm for the given Ω(r).</param>
/// <param name="PointsCorePotential">W_c of the points, Σ m_i Φ_c(r_i) in the central core's softened potential.</param>
/// <param name="ProfileCorePotential">W_c of the profile, ∫ Φ_c dm.</param>
/// <param name="PointsCoreVirial">V_c of the points, −G m_c Σ m_i g(r_i/h)/r_i.</param>
/// <param name="ProfileCoreVirial">V_c of the profile, −G m_c ∫ g(r/h)/r dm.</param>
public sealed record EnergyBudget(
    UnitSystem Units,
    double Gamma,
    double OpeningAngle,
    double PointsGravitational,
    double PointsThermal,
    double PointsKinetic,
    double ProfileGravitational,
    double ProfileThermal,
    double ProfileRotational,
    double PointsCorePotential = 0,
    double ProfileCorePotential = 0,
    double PointsCoreVirial = 0,
    double ProfileCoreVirial = 0)
{
    /// <summary>(2K + 3(γ − 1)U) / (−W) of the points (dimensionless; NaN without U).</summary>
    public double PointsVirialRatio => Virial(PointsKinetic, PointsThermal, PointsGravitational + PointsCoreVirial);

    /// <summary>(2T + 3(γ − 1)U) / (−W) of the profile (dimensionless; NaN without U).</summary>
    public double ProfileVirialRatio => Virial(ProfileRotational, ProfileThermal, ProfileGravitational + ProfileCoreVirial);

    /// <summary>(W + W_c)_points / (W + W_c)_profile − 1 (dimensionless).</summary>
    public double GravitationalDeviation => (PointsGravitational + PointsCorePotential) / (ProfileGravitational + ProfileCorePotential) - 1;

    /// <summary>U_points / U_profile − 1 (dimensionless; NaN when either is missing).</summary>
    public double ThermalDeviation => PointsThermal / ProfileThermal - 1;

    /// <summary>K_points / T_profile − 1 (dimensionless; NaN when either is missing).</summary>
    public double KineticDeviation => PointsKinetic / ProfileRotational - 1;

    /// <summary>Total energy W + W_c + U + K of the points (NaN parts count as 0).</summary>
    public double PointsTotal => PointsGravitational + PointsCorePotential + Zero(PointsThermal) + Zero(PointsKinetic);

    /// <summary>Total energy W + W_c + U + T of the profile (NaN parts count as 0).</summary>
    public double ProfileTotal => ProfileGravitational + ProfileCorePotential + Zero(ProfileThermal) + Zero(ProfileRotational);

    private double Virial(double kinetic, double thermal, double gravitational) =>
        (2 * Zero(kinetic) + 3 * (Gamma - 1) * thermal) / -gravitational;

    private static double Zero(double v) => double.IsNaN(v) ? 0 : v;
}
