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

    /// <summary>3∫P dV / (−W): 1 for a profile in hydrostatic equilibrium (virial theorem).</summary>
    public static double VirialRatio(IRadialProfile profile) => 2 * OfProfile(profile, 5.0 / 3.0) / -GravitationalEnergy.OfProfile(profile);
}
