using System.Globalization;
using Placement.Bodies;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Commands.Verbs;

/// <summary>The thermal energy of a profile as <c>inspect</c> shows it: ideal gas from the pressure, and the table's own u when it carries one.</summary>
/// <param name="Gamma">Adiabatic index of the ideal-gas value.</param>
/// <param name="IdealGas">∫ P/((γ−1)ρ) dm, NaN without pressure.</param>
/// <param name="FromTable">∫ u dm with the profile's specific-energy quantity, NaN without one.</param>
/// <param name="TableQuantity">Name of that quantity, or null.</param>
internal sealed record ProfileBudget(double Gamma, double IdealGas, double FromTable, string? TableQuantity)
{
    public static ProfileBudget Of(IRadialProfile profile, double gamma)
    {
        double ideal = ScaleHeights.PressureQuantity(profile) is null ? double.NaN : ThermalEnergy.OfProfile(profile, gamma);
        string? name = ThermodynamicFields.InternalEnergyQuantity(profile);
        double table = name is null ? double.NaN
            : ThermalEnergy.OfProfile(profile, new ThermodynamicOptions { Gamma = gamma, Source = InternalEnergySource.Profile, InternalEnergyQuantity = name });
        return new ProfileBudget(gamma, ideal, table, name);
    }

    public IEnumerable<string> Lines(UnitSystem units)
    {
        string unit = $"{units.MassUnitName} {units.LengthUnitName}^2/{units.TimeUnitName}^2";
        var c = CultureInfo.InvariantCulture;
        if (!double.IsNaN(IdealGas))
            yield return string.Create(c, $"thermal energy   U = {IdealGas:G6} {unit} (ideal gas, γ = {Gamma:G4}: ∫ P/((γ-1)ρ) dm)");
        if (TableQuantity is not null)
            yield return string.Create(c, $"thermal energy   U = {FromTable:G6} {unit} (the table's own '{TableQuantity}': ∫ u dm)");
        if (double.IsNaN(IdealGas) && TableQuantity is null)
            yield return "thermal energy   not defined: the profile carries no pressure and no specific internal energy";
    }
}
