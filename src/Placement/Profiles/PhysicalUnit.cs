using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>A named unit with its dimension (powers of length, mass, time, temperature) and its size in cgs.</summary>
/// <remarks>
/// Used for profile columns and carried quantities. <see cref="Parse"/> knows the units astrophysical tables use
/// (cm, m, km, R_sun; g, kg, M_sun; g/cm^3, kg/m^3, M_sun/R_sun^3; dyn/cm^2, Pa, erg/cm^3; K; erg/g, J/kg;
/// cm/s, km/s; s; dimensionless "1"). Solar values are those of <see cref="UnitSystem"/> (IAU 2015 B3).
/// </remarks>
/// <param name="Name">Display name, e.g. <c>g/cm^3</c>.</param>
/// <param name="InCgs">One of this unit in the cgs unit of the same dimension.</param>
/// <param name="Length">Power of length.</param>
/// <param name="Mass">Power of mass.</param>
/// <param name="Time">Power of time.</param>
/// <param name="Temperature">Power of temperature.</param>
public sealed record PhysicalUnit(string Name, double InCgs, int Length, int Mass, int Time, int Temperature)
{
    private static readonly Dictionary<string, PhysicalUnit> Known = BuildKnown();

    /// <summary>The dimensionless unit "1".</summary>
    public static PhysicalUnit One { get; } = new("1", 1, 0, 0, 0, 0);

    /// <summary>Names accepted by <see cref="Parse"/>.</summary>
    public static IReadOnlyCollection<string> KnownNames => Known.Keys;

    /// <summary>True when <paramref name="other"/> has the same dimension.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="other"/> is null.</exception>
    public bool SameDimension(PhysicalUnit other)
    {
        ArgumentNullException.ThrowIfNull(other);
        return Length == other.Length && Mass == other.Mass && Time == other.Time && Temperature == other.Temperature;
    }

    /// <summary>Factor f such that a value v in this unit equals f·v in <paramref name="target"/>.</summary>
    /// <exception cref="ArgumentException">The dimensions differ.</exception>
    public double FactorTo(PhysicalUnit target)
    {
        ArgumentNullException.ThrowIfNull(target);
        if (!SameDimension(target)) throw new ArgumentException($"Cannot convert '{Name}' to '{target.Name}': different dimensions.", nameof(target));
        return InCgs / target.InCgs;
    }

    /// <summary>The unit of the same dimension built from <paramref name="units"/>' length, mass and time units (temperature stays K).</summary>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public PhysicalUnit In(UnitSystem units) => ForSystem(units, Length, Mass, Time, Temperature);

    /// <summary>The unit length^l mass^m time^t K^k expressed in <paramref name="units"/>.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public static PhysicalUnit ForSystem(UnitSystem units, int length, int mass, int time, int temperature = 0)
    {
        ArgumentNullException.ThrowIfNull(units);
        double f = Math.Pow(units.LengthInCm, length) * Math.Pow(units.MassInGrams, mass) * Math.Pow(units.TimeInSeconds, time);
        var parts = new List<string>();
        void Add(string n, int p) { if (p == 1) parts.Add(n); else if (p != 0) parts.Add(string.Create(CultureInfo.InvariantCulture, $"{n}^{p}")); }
        Add(units.MassUnitName, mass);
        Add(units.LengthUnitName, length);
        Add(units.TimeUnitName, time);
        Add("K", temperature);
        string name = parts.Count == 0 ? "1" : string.Join(" ", parts);
        if (units.Name == "dimensionless" && temperature == 0) name = "1";
        return new PhysicalUnit(name, f, length, mass, time, temperature);
    }

    /// <summary>Parses a unit name (case-sensitive, spaces ignored).</summary>
    /// <param name="text">E.g. <c>cm</c>, <c>M_sun</c>, <c>g/cm^3</c>, <c>dyn/cm^2</c>, <c>K</c>, <c>1</c>.</param>
    /// <param name="unit">The unit when known.</param>
    /// <returns>False when the name is unknown.</returns>
    public static bool TryParse(string? text, out PhysicalUnit unit)
    {
        unit = One;
        if (text is null) return false;
        string key = text.Replace(" ", "", StringComparison.Ordinal);
        if (Known.TryGetValue(key, out var u)) { unit = u; return true; }
        return false;
    }

    /// <summary>Parses a unit name.</summary>
    /// <exception cref="ArgumentException">The name is unknown.</exception>
    public static PhysicalUnit Parse(string text)
    {
        if (TryParse(text, out var u)) return u;
        throw new ArgumentException($"Unknown unit '{text}'; known units: {string.Join(", ", Known.Keys)}.", nameof(text));
    }

    private static Dictionary<string, PhysicalUnit> BuildKnown()
    {
        const double rs = UnitSystem.SolarRadiusCm, ms = UnitSystem.SolarMassGrams;
        var list = new[]
        {
            new PhysicalUnit("cm", 1, 1, 0, 0, 0), new PhysicalUnit("m", 100, 1, 0, 0, 0), new PhysicalUnit("km", 1e5, 1, 0, 0, 0),
            new PhysicalUnit("R_sun", rs, 1, 0, 0, 0),
            new PhysicalUnit("g", 1, 0, 1, 0, 0), new PhysicalUnit("kg", 1000, 0, 1, 0, 0), new PhysicalUnit("M_sun", ms, 0, 1, 0, 0),
            new PhysicalUnit("g/cm^3", 1, -3, 1, 0, 0), new PhysicalUnit("kg/m^3", 1e-3, -3, 1, 0, 0),
            new PhysicalUnit("M_sun/R_sun^3", ms / (rs * rs * rs), -3, 1, 0, 0),
            new PhysicalUnit("dyn/cm^2", 1, -1, 1, -2, 0), new PhysicalUnit("erg/cm^3", 1, -1, 1, -2, 0), new PhysicalUnit("Pa", 10, -1, 1, -2, 0),
            new PhysicalUnit("K", 1, 0, 0, 0, 1),
            new PhysicalUnit("erg/g", 1, 2, 0, -2, 0), new PhysicalUnit("J/kg", 1e4, 2, 0, -2, 0),
            new PhysicalUnit("cm/s", 1, 1, 0, -1, 0), new PhysicalUnit("km/s", 1e5, 1, 0, -1, 0),
            new PhysicalUnit("s", 1, 0, 0, 1, 0),
            One,
        };
        var d = new Dictionary<string, PhysicalUnit>(StringComparer.Ordinal);
        foreach (var u in list) d[u.Name] = u;
        d["dimensionless"] = One;
        d["-"] = One;
        return d;
    }
}
