namespace Placement.Bodies;

/// <summary>Where the specific internal energy u of the target state comes from.</summary>
public enum InternalEnergySource
{
    /// <summary>Ideal gas of adiabatic index γ: u = P / ((γ − 1) ρ) from the profile's pressure and density.</summary>
    IdealGas,

    /// <summary>The profile's own specific-internal-energy quantity (a carried column with the dimension length²/time², e.g. erg/g), for tables made with another equation of state.</summary>
    Profile,
}
