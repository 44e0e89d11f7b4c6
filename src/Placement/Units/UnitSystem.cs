namespace Placement.Units;

/// <summary>
/// The units in which every length, mass and derived quantity of a profile or point set is expressed.
/// </summary>
/// <remarks>
/// Placement never converts silently: a profile carries its <see cref="UnitSystem"/>, samplers write
/// points in the same units, and files record them. Conversion factors are to cgs (centimetre, gram,
/// second). Solar values: R_sun = 6.957e10 cm and M_sun = 1.98841e33 g (IAU 2015 Resolution B3
/// nominal values; M_sun from the nominal GM_sun = 1.3271244e26 cm^3 s^-2 and G = 6.67430e-8 cgs,
/// CODATA 2018).
/// </remarks>
/// <param name="Name">Short name written to files, e.g. <c>cgs</c> or <c>solar</c>.</param>
/// <param name="LengthUnitName">Name of the length unit, e.g. <c>cm</c>.</param>
/// <param name="MassUnitName">Name of the mass unit, e.g. <c>g</c>.</param>
/// <param name="TimeUnitName">Name of the time unit, e.g. <c>s</c>.</param>
/// <param name="LengthInCm">One length unit in centimetres.</param>
/// <param name="MassInGrams">One mass unit in grams.</param>
/// <param name="TimeInSeconds">One time unit in seconds.</param>
public sealed record UnitSystem(
    string Name,
    string LengthUnitName,
    string MassUnitName,
    string TimeUnitName,
    double LengthInCm,
    double MassInGrams,
    double TimeInSeconds)
{
    /// <summary>Newton's constant in cgs, cm^3 g^-1 s^-2 (CODATA 2018).</summary>
    public const double GravitationalConstantCgs = 6.67430e-8;

    /// <summary>Nominal solar radius in cm (IAU 2015 Resolution B3).</summary>
    public const double SolarRadiusCm = 6.957e10;

    /// <summary>Solar mass in g, GM_sun(nominal, IAU 2015 B3) / G(CODATA 2018).</summary>
    public const double SolarMassGrams = 1.3271244e26 / GravitationalConstantCgs;

    /// <summary>Centimetre, gram, second.</summary>
    public static UnitSystem Cgs { get; } = new("cgs", "cm", "g", "s", 1.0, 1.0, 1.0);

    /// <summary>Solar radius, solar mass, and the time unit that makes G = 1 in these units.</summary>
    public static UnitSystem Solar { get; } = new(
        "solar", "R_sun", "M_sun", "t_dyn_sun", SolarRadiusCm, SolarMassGrams,
        Math.Sqrt(SolarRadiusCm * SolarRadiusCm * SolarRadiusCm / (GravitationalConstantCgs * SolarMassGrams)));

    /// <summary>Dimensionless units (G = 1, lengths and masses as given), for analytic models.</summary>
    public static UnitSystem Dimensionless { get; } = new("dimensionless", "1", "1", "1", 1.0, 1.0, 1.0);

    /// <summary>Name of the density unit, e.g. <c>g/cm^3</c>.</summary>
    public string DensityUnitName => $"{MassUnitName}/{LengthUnitName}^3";

    /// <summary>One density unit in g cm^-3.</summary>
    public double DensityInGramsPerCm3 => MassInGrams / (LengthInCm * LengthInCm * LengthInCm);

    /// <summary>Newton's constant expressed in this system (1 for <see cref="Solar"/> and <see cref="Dimensionless"/>).</summary>
    public double GravitationalConstant =>
        ReferenceEquals(this, Dimensionless) || Name == "dimensionless"
            ? 1.0
            : GravitationalConstantCgs * MassInGrams * TimeInSeconds * TimeInSeconds / (LengthInCm * LengthInCm * LengthInCm);

    /// <summary>Looks up a built-in unit system by name (<c>cgs</c>, <c>solar</c>, <c>dimensionless</c>), case-insensitive.</summary>
    /// <exception cref="ArgumentException">The name is not a built-in unit system.</exception>
    public static UnitSystem Parse(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        return name.Trim().ToLowerInvariant() switch
        {
            "cgs" => Cgs,
            "solar" => Solar,
            "dimensionless" or "none" or "code" => Dimensionless,
            _ => throw new ArgumentException($"Unknown unit system '{name}'; expected 'cgs', 'solar' or 'dimensionless'.", nameof(name)),
        };
    }
}
