using System.Globalization;
using System.Text;
using Placement.Units;

namespace Placement.IO;

/// <summary>
/// The physical dimension of a per-point quantity as integer exponents of length, mass and time, used to
/// name its unit and its factor to cgs in any <see cref="UnitSystem"/>.
/// </summary>
/// <remarks>
/// A quantity with dimension L^a M^b T^c has, in a unit system whose units are ℓ cm, μ g and τ s,
/// the unit name <c>"M^b L^a / T^c"</c> built from the system's unit names and the cgs factor ℓ^a μ^b τ^c
/// (dimensional analysis, common practice). Example: density (a = −3, b = 1) in cgs is <c>g/cm^3</c>, factor 1.
/// </remarks>
/// <param name="Length">Exponent of length.</param>
/// <param name="Mass">Exponent of mass.</param>
/// <param name="Time">Exponent of time.</param>
public readonly record struct QuantityDimension(int Length, int Mass, int Time)
{
    /// <summary>A pure number (unit <c>1</c>).</summary>
    public static QuantityDimension Dimensionless => new(0, 0, 0);

    /// <summary>Length, L (positions, smoothing lengths).</summary>
    public static QuantityDimension LengthDimension => new(1, 0, 0);

    /// <summary>Mass, M.</summary>
    public static QuantityDimension MassDimension => new(0, 1, 0);

    /// <summary>Volume, L^3 (cell volumes).</summary>
    public static QuantityDimension Volume => new(3, 0, 0);

    /// <summary>Mass density, M L^-3.</summary>
    public static QuantityDimension Density => new(-3, 1, 0);

    /// <summary>Velocity, L T^-1.</summary>
    public static QuantityDimension Velocity => new(1, 0, -1);

    /// <summary>Specific energy, L^2 T^-2 (internal energy per unit mass).</summary>
    public static QuantityDimension SpecificEnergy => new(2, 0, -2);

    /// <summary>Acceleration, L T^-2.</summary>
    public static QuantityDimension Acceleration => new(1, 0, -2);

    /// <summary>Time, T.</summary>
    public static QuantityDimension TimeDimension => new(0, 0, 1);

    /// <summary>Factor that converts a value of this dimension in <paramref name="units"/> to cgs.</summary>
    /// <remarks>ℓ^a μ^b τ^c with ℓ, μ, τ the system's length, mass and time units in cm, g and s.</remarks>
    /// <param name="units">Unit system the value is expressed in.</param>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public double CgsFactor(UnitSystem units)
    {
        ArgumentNullException.ThrowIfNull(units);
        return Math.Pow(units.LengthInCm, Length) * Math.Pow(units.MassInGrams, Mass) * Math.Pow(units.TimeInSeconds, Time);
    }

    /// <summary>Unit name of this dimension in <paramref name="units"/>, e.g. <c>g/cm^3</c>, <c>cm/s</c>, <c>1</c>.</summary>
    /// <remarks>
    /// Positive exponents form the numerator (mass, length, time order), negative ones the denominator;
    /// unit names equal to <c>1</c> (dimensionless systems) are left out.
    /// </remarks>
    /// <param name="units">Unit system whose unit names are used.</param>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public string UnitName(UnitSystem units)
    {
        ArgumentNullException.ThrowIfNull(units);
        var numerator = new List<string>(3);
        var denominator = new List<string>(3);
        Append(units.MassUnitName, Mass, numerator, denominator);
        Append(units.LengthUnitName, Length, numerator, denominator);
        Append(units.TimeUnitName, Time, numerator, denominator);
        var text = new StringBuilder(numerator.Count == 0 ? "1" : string.Join(' ', numerator));
        if (denominator.Count == 1) text.Append('/').Append(denominator[0]);
        else if (denominator.Count > 1) text.Append("/(").Append(string.Join(' ', denominator)).Append(')');
        return text.ToString();
    }

    private static void Append(string name, int exponent, List<string> numerator, List<string> denominator)
    {
        if (exponent == 0 || name == "1") return;
        int magnitude = Math.Abs(exponent);
        string part = magnitude == 1 ? name : name + "^" + magnitude.ToString(CultureInfo.InvariantCulture);
        (exponent > 0 ? numerator : denominator).Add(part);
    }
}
