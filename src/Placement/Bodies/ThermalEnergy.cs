using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Thermal energy of a profile that carries pressure, for an ideal gas of adiabatic index γ.</summary>
/// <remarks>
/// U = ∫ P/(γ − 1) dV = ∫ (P/ρ)/(γ − 1) dM, by 4-point Gauss–Legendre on equal mass panels. The pressure is the
/// profile's quantity with the dimension of pressure (<see cref="ScaleHeights.PressureQuantity"/>). For a body in
/// hydrostatic equilibrium the virial theorem gives 3∫P dV = −W, i.e. 2U = −W for γ = 5/3 (standard textbook result),
/// which <see cref="VirialRatio"/> reports as a check of the profile's equilibrium.
/// </remarks>
public static class ThermalEnergy
{
    /// <summary>U for adiabatic index <paramref name="gamma"/> (&gt; 1), in mass·length²/time² of the profile's units.</summary>
    /// <exception cref="InvalidOperationException">The profile carries no pressure.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="gamma"/> ≤ 1.</exception>
    public static double OfProfile(IRadialProfile profile, double gamma, int panels = 2000)
    {
        ArgumentNullException.ThrowIfNull(profile);
        if (!(gamma > 1)) throw new ArgumentOutOfRangeException(nameof(gamma), gamma, "The adiabatic index must exceed 1.");
        string name = ScaleHeights.PressureQuantity(profile)
            ?? throw new InvalidOperationException("The profile carries no pressure, so its thermal energy is undefined.");
        double u = MassCoordinateQuadrature.Integrate(profile, (_, r) =>
        {
            double rho = profile.Density(r);
            return rho > 0 && profile.TryQuantity(name, r, out double p) ? p / rho : 0;
        }, panels);
        return u / (gamma - 1);
    }

    /// <summary>U = ∫ u dm of the profile for the energy source of <paramref name="options"/>, in mass·length²/time² of its units.</summary>
    /// <remarks>Ideal gas: as <see cref="OfProfile(IRadialProfile, double, int)"/>. Profile source: ∫ u(r(m)) dm with the
    /// profile's specific-energy quantity (<see cref="ThermodynamicFields.InternalEnergyQuantity"/>), same quadrature.</remarks>
    /// <exception cref="InvalidOperationException">The profile lacks the pressure or specific-energy quantity the source needs.</exception>
    /// <exception cref="ArgumentOutOfRangeException">γ is not finite and &gt; 1.</exception>
    /// <exception cref="ArgumentException">The named energy quantity is absent.</exception>
    public static double OfProfile(IRadialProfile profile, ThermodynamicOptions options, int panels = 2000)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (options.Source == InternalEnergySource.IdealGas) return OfProfile(profile, options.Gamma, panels);
        string name = options.InternalEnergyQuantity ?? ThermodynamicFields.InternalEnergyQuantity(profile)
            ?? throw new InvalidOperationException("The profile carries no specific internal energy (length^2/time^2).");
        if (!profile.TryQuantity(name, 0, out _)) throw new ArgumentException($"The profile carries no quantity '{name}'.", nameof(options));
        return MassCoordinateQuadrature.Integrate(profile, (_, r) => profile.TryQuantity(name, r, out double u) ? u : 0, panels);
    }

    /// <summary>U = Σ m_i u_i of points with specific internal energies u_i (length²/time²), in mass·length²/time².</summary>
    /// <exception cref="ArgumentException"><paramref name="internalEnergy"/> does not have one value per point.</exception>
    public static double OfPoints(Points.PointSet points, double[] internalEnergy)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(internalEnergy);
        if (internalEnergy.Length != points.Count)
            throw new ArgumentException($"{internalEnergy.Length} internal energies for {points.Count} points.", nameof(internalEnergy));
        double sum = 0;
        for (int i = 0; i < internalEnergy.Length; i++) sum += points.Mass[i] * internalEnergy[i];
        return sum;
    }

    /// <summary>3∫P dV / (−(W + V_c)): 1 for a profile in hydrostatic equilibrium (virial theorem; V_c is the Clausius term of a softened central core, <see cref="GravitationalEnergy.VirialOfCentralField"/>, 0 without one).</summary>
    public static double VirialRatio(IRadialProfile profile) =>
        2 * OfProfile(profile, 5.0 / 3.0) / -(GravitationalEnergy.OfProfile(profile) + GravitationalEnergy.VirialOfCentralField(profile));
}
