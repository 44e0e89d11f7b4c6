using System.Text;

namespace Placement.Plots;

/// <summary>Turns the plain unit names written to files (<c>M_sun/R_sun^3</c>) into axis-label text (<c>M☉/R☉³</c>).</summary>
/// <remarks>
/// <c>^</c> followed by an optional minus and digits becomes Unicode superscripts, <c>_sun</c> becomes the
/// solar symbol ☉ (U+2609); both are covered by the bundled DejaVu Sans. A unit of <c>1</c> gives an empty
/// bracket-free label.
/// </remarks>
public static class UnitLabel
{
    private const string Superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹";

    /// <summary>Pretty form of a unit name.</summary>
    /// <param name="unit">Unit name as written to files.</param>
    public static string Pretty(string unit)
    {
        ArgumentNullException.ThrowIfNull(unit);
        var text = new StringBuilder(unit.Length);
        string source = unit.Replace("_sun", "☉", StringComparison.Ordinal);
        for (int i = 0; i < source.Length; i++)
        {
            if (source[i] == '^' && i + 1 < source.Length && (char.IsAsciiDigit(source[i + 1]) || source[i + 1] == '-'))
            {
                i++;
                for (; i < source.Length && (char.IsAsciiDigit(source[i]) || source[i] == '-'); i++)
                    text.Append(source[i] == '-' ? '⁻' : Superscripts[source[i] - '0']);
                i--;
                continue;
            }
            text.Append(source[i]);
        }
        return text.ToString();
    }

    /// <summary>An axis label <c>quantity [unit]</c>, or just the quantity for pure numbers (unit <c>1</c>).</summary>
    /// <param name="quantity">Quantity name and symbol, e.g. <c>Radius r</c>.</param>
    /// <param name="unit">Unit name as written to files.</param>
    public static string Axis(string quantity, string unit)
    {
        ArgumentNullException.ThrowIfNull(quantity);
        ArgumentNullException.ThrowIfNull(unit);
        return unit == "1" ? quantity : $"{quantity} [{Pretty(unit)}]";
    }

    /// <summary>10 raised to an integer, with a superscript exponent: 10⁻³, 10⁰, 10⁵.</summary>
    internal static string PowerOfTen(int exponent) => "10" + Pretty("^" + exponent.ToString(System.Globalization.CultureInfo.InvariantCulture));
}
