using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>A named unit with its dimension (powers of length, mass, time, temperature) and its size in cgs.</summary>
/// <remarks>
/// <see cref="Parse"/> reads products and quotients of base units with integer powers, e.g. <c>g/cm^3</c>,
/// <c>dyn/cm^2</c>, <c>erg/g</c>, <c>M_sun/R_sun^3</c>, <c>M_sun*R_sun^-1*t_dyn_sun^-2</c>, evaluated left to right
/// (each <c>/</c> inverts only the factor after it). Base units: length cm, m, km, R_sun, au, pc, kpc; mass g, kg,
/// M_sun; time s, yr, t_dyn_sun (the <see cref="UnitSystem.Solar"/> time unit); temperature K; derived dyn, erg, Pa, J;
/// dimensionless <c>1</c> (also <c>dimensionless</c> or <c>-</c>). Solar values are those of <see cref="UnitSystem"/>
/// (IAU 2015 B3); au = 1.495978707e13 cm (IAU 2012 B2), pc = (648000/π) au (IAU 2015 B2), yr = 365.25 d (Julian).
/// </remarks>
/// <param name="Name">Display name, e.g. <c>g/cm^3</c>.</param>
/// <param name="InCgs">One of this unit in the cgs unit of the same dimension.</param>
/// <param name="Length">Power of length.</param>
/// <param name="Mass">Power of mass.</param>
/// <param name="Time">Power of time.</param>
/// <param name="Temperature">Power of temperature.</param>
public sealed record PhysicalUnit(string Name, double InCgs, int Length, int Mass, int Time, int Temperature)
{
    /// <summary>The dimensionless unit "1".</summary>
    public static PhysicalUnit One { get; } = new("1", 1, 0, 0, 0, 0);

    // Declared after One: static initialisers run in textual order and the table uses One.
    private static readonly Dictionary<string, PhysicalUnit> Base = BuildBase();

    /// <summary>Base unit names accepted by <see cref="Parse"/>.</summary>
    public static IReadOnlyCollection<string> BaseNames => Base.Keys;

    /// <summary>True for a unit without dimension.</summary>
    public bool IsDimensionless => Length == 0 && Mass == 0 && Time == 0 && Temperature == 0;

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

    /// <summary>The unit length^l mass^m time^t K^k expressed in <paramref name="units"/>, named so that <see cref="Parse"/> reads it back.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public static PhysicalUnit ForSystem(UnitSystem units, int length, int mass, int time, int temperature = 0)
    {
        ArgumentNullException.ThrowIfNull(units);
        bool dimensionless = units.Name == "dimensionless";
        double f = dimensionless ? 1 : Math.Pow(units.LengthInCm, length) * Math.Pow(units.MassInGrams, mass) * Math.Pow(units.TimeInSeconds, time);
        var parts = new List<string>();
        void Add(string n, int p) { if (p == 1) parts.Add(n); else if (p != 0) parts.Add(string.Create(CultureInfo.InvariantCulture, $"{n}^{p}")); }
        if (!dimensionless)
        {
            Add(units.MassUnitName, mass);
            Add(units.LengthUnitName, length);
            Add(units.TimeUnitName, time);
        }
        Add("K", temperature);
        string name = parts.Count == 0 ? "1" : string.Join("*", parts);
        // In dimensionless (code) units only the temperature dimension survives; the others are carried as "1".
        return dimensionless ? new PhysicalUnit(name, 1, 0, 0, 0, temperature) : new PhysicalUnit(name, f, length, mass, time, temperature);
    }

    /// <summary>Parses a unit expression (case-sensitive, spaces ignored).</summary>
    /// <param name="text">E.g. <c>cm</c>, <c>M_sun</c>, <c>g/cm^3</c>, <c>dyn/cm^2</c>, <c>K</c>, <c>1</c>.</param>
    /// <param name="unit">The unit when the expression is valid.</param>
    /// <returns>False when the expression is malformed or names an unknown base unit.</returns>
    public static bool TryParse(string? text, out PhysicalUnit unit)
    {
        unit = One;
        if (string.IsNullOrWhiteSpace(text)) return false;
        string s = text.Replace(" ", "", StringComparison.Ordinal);
        double f = 1;
        int l = 0, m = 0, t = 0, k = 0;
        int pos = 0, sign = 1;
        while (pos < s.Length)
        {
            int end = pos;
            while (end < s.Length && s[end] != '*' && s[end] != '/') end++;
            string factor = s[pos..end];
            int power = 1;
            int caret = factor.IndexOf('^', StringComparison.Ordinal);
            string name = caret < 0 ? factor : factor[..caret];
            if (caret >= 0 && !int.TryParse(factor[(caret + 1)..], NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out power)) return false;
            if (!Base.TryGetValue(name, out var b)) return false;
            power *= sign;
            f *= Math.Pow(b.InCgs, power);
            l += b.Length * power; m += b.Mass * power; t += b.Time * power; k += b.Temperature * power;
            if (end == s.Length) break;
            sign = s[end] == '/' ? -1 : 1;
            pos = end + 1;
            if (pos == s.Length) return false;
        }
        unit = new PhysicalUnit(text.Trim(), f, l, m, t, k);
        return true;
    }

    /// <summary>Parses a unit expression.</summary>
    /// <exception cref="ArgumentException">The expression is malformed or names an unknown base unit.</exception>
    public static PhysicalUnit Parse(string text)
    {
        if (TryParse(text, out var u)) return u;
        throw new ArgumentException($"Unknown unit '{text}'; units are products of {string.Join(", ", Base.Keys)} with integer powers, e.g. g/cm^3.", nameof(text));
    }

    private static Dictionary<string, PhysicalUnit> BuildBase()
    {
        const double rs = UnitSystem.SolarRadiusCm, ms = UnitSystem.SolarMassGrams, au = 1.495978707e13;
        double pc = 648000 / Math.PI * au;
        var list = new[]
        {
            new PhysicalUnit("cm", 1, 1, 0, 0, 0), new PhysicalUnit("m", 100, 1, 0, 0, 0), new PhysicalUnit("km", 1e5, 1, 0, 0, 0),
            new PhysicalUnit("R_sun", rs, 1, 0, 0, 0), new PhysicalUnit("au", au, 1, 0, 0, 0),
            new PhysicalUnit("pc", pc, 1, 0, 0, 0), new PhysicalUnit("kpc", 1e3 * pc, 1, 0, 0, 0),
            new PhysicalUnit("g", 1, 0, 1, 0, 0), new PhysicalUnit("kg", 1000, 0, 1, 0, 0), new PhysicalUnit("M_sun", ms, 0, 1, 0, 0),
            new PhysicalUnit("s", 1, 0, 0, 1, 0), new PhysicalUnit("yr", 365.25 * 86400, 0, 0, 1, 0),
            new PhysicalUnit("t_dyn_sun", UnitSystem.Solar.TimeInSeconds, 0, 0, 1, 0),
            new PhysicalUnit("K", 1, 0, 0, 0, 1),
            new PhysicalUnit("dyn", 1, 1, 1, -2, 0), new PhysicalUnit("erg", 1, 2, 1, -2, 0),
            new PhysicalUnit("Pa", 10, -1, 1, -2, 0), new PhysicalUnit("J", 1e7, 2, 1, -2, 0),
            One,
        };
        var d = new Dictionary<string, PhysicalUnit>(StringComparer.Ordinal);
        foreach (var u in list) d[u.Name] = u;
        d["dimensionless"] = One;
        d["-"] = One;
        return d;
    }
}
