namespace Placement.Bodies;

/// <summary>How <see cref="ThermodynamicFields.Compute"/> gives points their thermodynamic state.</summary>
public sealed record ThermodynamicOptions
{
    /// <summary>Adiabatic index γ of the gas, &gt; 1 (dimensionless); default 5/3 (monatomic ideal gas).</summary>
    public double Gamma { get; init; } = 5.0 / 3.0;

    /// <summary>Where the target specific internal energy comes from; default <see cref="InternalEnergySource.IdealGas"/>.</summary>
    public InternalEnergySource Source { get; init; } = InternalEnergySource.IdealGas;

    /// <summary>Which quantities are matched exactly; default <see cref="ThermodynamicMatch.DensityPressure"/>.</summary>
    public ThermodynamicMatch Match { get; init; } = ThermodynamicMatch.DensityPressure;

    /// <summary>Name of the profile quantity holding the specific internal energy when <see cref="Source"/> is
    /// <see cref="InternalEnergySource.Profile"/>; null picks the first quantity with the dimension length²/time².</summary>
    public string? InternalEnergyQuantity { get; init; }

    /// <summary>Checks the options.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><see cref="Gamma"/> is not finite and &gt; 1.</exception>
    public void Validate()
    {
        if (!(Gamma > 1) || !double.IsFinite(Gamma))
            throw new ArgumentOutOfRangeException(nameof(Gamma), Gamma, "The adiabatic index gamma must be finite and > 1.");
    }
}
