using System.Globalization;
using System.Text.RegularExpressions;
using Placement.Numerics;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Bodies;

/// <summary>
/// A user angular-velocity profile Ω(r): a table of radius and Ω read from a small text file, interpolated by a monotone
/// cubic (PCHIP) and held constant beyond the first and last rows.
/// </summary>
/// <remarks>
/// <para>File format (UTF-8 text): lines starting with <c>#</c> and blank lines are ignored; the first other line is the
/// header <c>radius [UNIT] omega [UNIT]</c> (names case-insensitive, <c>r</c> also accepted for radius; units in
/// <see cref="PhysicalUnit"/> syntax, e.g. <c>R_sun</c>, <c>km</c>, <c>1/s</c>, <c>1/t_dyn_sun</c>, <c>1/yr</c>); then one row
/// per radius with two numbers separated by whitespace or a comma. Radii must be finite, ≥ 0 and strictly increasing,
/// Ω finite (a negative Ω rotates the other way); at least two rows. Values are converted to the body's unit system.
/// Errors raise <see cref="ProfileFormatException"/> naming file, line, column and value.</para>
/// <para>Interpolation: PCHIP in (r, Ω) (<see cref="MonotoneCubic"/>: never overshoots the data, monotone where the data
/// are). Outside the table Ω is the value of the nearest end row (constant extension), so a table that stops short of
/// the surface spins the outer layers at its last value; <see cref="Covers"/> tells a caller whether that happens.</para>
/// </remarks>
public sealed partial class AngularVelocityTable
{
    private readonly double[] _r;
    private readonly double[] _omega;
    private readonly double[] _slope;

    /// <summary>Creates the table from radii (length units) and angular velocities (1/time units).</summary>
    /// <exception cref="ArgumentException">Fewer than two rows, lengths differ, radii not finite, negative or not strictly increasing, or Ω not finite.</exception>
    public AngularVelocityTable(IReadOnlyList<double> radius, IReadOnlyList<double> omega)
    {
        ArgumentNullException.ThrowIfNull(radius);
        ArgumentNullException.ThrowIfNull(omega);
        if (radius.Count < 2 || radius.Count != omega.Count)
            throw new ArgumentException($"An angular-velocity table needs at least two rows of (radius, omega); got {radius.Count} radii and {omega.Count} values.", nameof(radius));
        for (int i = 0; i < radius.Count; i++)
        {
            if (!double.IsFinite(radius[i]) || radius[i] < 0 || (i > 0 && !(radius[i] > radius[i - 1])))
                throw new ArgumentException($"Row {i}: radius {radius[i]} must be finite, >= 0 and larger than the previous radius.", nameof(radius));
            if (!double.IsFinite(omega[i]))
                throw new ArgumentException($"Row {i}: omega {omega[i]} must be finite.", nameof(omega));
        }
        _r = [.. radius];
        _omega = [.. omega];
        _slope = new double[_r.Length];
        MonotoneCubic.Slopes(_r, _omega, _slope);
    }

    /// <summary>Table radii, length units.</summary>
    public IReadOnlyList<double> Radius => _r;

    /// <summary>Table angular velocities, 1/time units.</summary>
    public IReadOnlyList<double> Omega => _omega;

    /// <summary>True when the table spans [0, <paramref name="outerRadius"/>] (no constant extension needed inside the body).</summary>
    public bool Covers(double outerRadius) => _r[0] <= 0 && _r[^1] >= outerRadius;

    /// <summary>Ω(r) in 1/time units: PCHIP inside the table, the end values outside.</summary>
    public double Evaluate(double r)
    {
        if (!(r > _r[0])) return _omega[0];
        if (r >= _r[^1]) return _omega[^1];
        int k = Array.BinarySearch(_r, r);
        if (k >= 0) return _omega[k];
        k = ~k - 1;
        double h = _r[k + 1] - _r[k];
        return MonotoneCubic.Hermite((r - _r[k]) / h, h, _omega[k], _omega[k + 1], _slope[k], _slope[k + 1]);
    }

    /// <summary>Reads a table file (format in the remarks) into <paramref name="units"/>.</summary>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="ProfileFormatException">The file is malformed; the message names file, line, column and value.</exception>
    public static AngularVelocityTable Read(string path, UnitSystem units)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        if (!File.Exists(path)) throw new FileNotFoundException($"Angular-velocity table '{path}' does not exist.", path);
        using var reader = new StreamReader(path);
        return Parse(reader, path, units);
    }

    /// <summary>Parses table text (format in the remarks) from <paramref name="reader"/>; <paramref name="source"/> names it in errors.</summary>
    /// <exception cref="ProfileFormatException">The text is malformed; the message names source, line, column and value.</exception>
    public static AngularVelocityTable Parse(TextReader reader, string source, UnitSystem units)
    {
        ArgumentNullException.ThrowIfNull(reader);
        ArgumentNullException.ThrowIfNull(units);
        var radius = new List<double>();
        var omega = new List<double>();
        double toLength = 0, toRate = 0;
        bool header = false;
        int line = 0;
        for (string? text = reader.ReadLine(); text is not null; text = reader.ReadLine())
        {
            line++;
            string trimmed = text.Trim();
            if (trimmed.Length == 0 || trimmed[0] == '#') continue;
            if (!header)
            {
                (toLength, toRate) = ParseHeader(trimmed, source, line, units);
                header = true;
                continue;
            }
            var cells = trimmed.Split([' ', '\t', ','], StringSplitOptions.RemoveEmptyEntries);
            if (cells.Length > 2)
                throw new ProfileFormatException(source, line, "#3", cells[2], $"expected two values (radius, omega), found {cells.Length}.");
            if (cells.Length < 2)
                throw new ProfileFormatException(source, line, "omega", trimmed, "expected two values (radius, omega), found one.");
            double r = Number(cells[0], source, line, "radius") * toLength;
            double w = Number(cells[1], source, line, "omega") * toRate;
            if (r < 0) throw new ProfileFormatException(source, line, "radius", cells[0], "radius must be >= 0.");
            if (radius.Count > 0 && !(r > radius[^1]))
                throw new ProfileFormatException(source, line, "radius", cells[0], "radii must increase strictly from row to row.");
            radius.Add(r);
            omega.Add(w);
        }
        if (!header) throw new ProfileFormatException(source, line, "radius", "", "no header line 'radius [unit] omega [unit]' found.");
        if (radius.Count < 2) throw new ProfileFormatException(source, line, "radius", radius.Count.ToString(CultureInfo.InvariantCulture), "at least two rows are needed.");
        return new AngularVelocityTable(radius, omega);
    }

    private static (double ToLength, double ToRate) ParseHeader(string text, string source, int line, UnitSystem units)
    {
        var m = HeaderPattern().Match(text);
        if (!m.Success)
            throw new ProfileFormatException(source, line, "header", text, "expected the header 'radius [unit] omega [unit]', e.g. 'radius [R_sun] omega [1/t_dyn_sun]'.");
        string rName = m.Groups[1].Value, wName = m.Groups[3].Value;
        if (!rName.Equals("radius", StringComparison.OrdinalIgnoreCase) && !rName.Equals("r", StringComparison.OrdinalIgnoreCase))
            throw new ProfileFormatException(source, line, "header", rName, "the first column must be 'radius'.");
        if (!wName.Equals("omega", StringComparison.OrdinalIgnoreCase))
            throw new ProfileFormatException(source, line, "header", wName, "the second column must be 'omega'.");
        return (Factor(m.Groups[2].Value, PhysicalUnit.ForSystem(units, 1, 0, 0), source, line, "radius"),
                Factor(m.Groups[4].Value, PhysicalUnit.ForSystem(units, 0, 0, -1), source, line, "omega"));
    }

    private static double Factor(string unitText, PhysicalUnit target, string source, int line, string column)
    {
        if (!PhysicalUnit.TryParse(unitText, out var unit))
            throw new ProfileFormatException(source, line, column, unitText, "unknown unit; use e.g. R_sun, km, cm for radius and 1/s, 1/yr, 1/t_dyn_sun for omega.");
        if (!unit.SameDimension(target))
            throw new ProfileFormatException(source, line, column, unitText, $"the unit has the wrong dimension; expected one like '{target.Name}'.");
        return unit.FactorTo(target);
    }

    private static double Number(string cell, string source, int line, string column)
    {
        if (!double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double value) || !double.IsFinite(value))
            throw new ProfileFormatException(source, line, column, cell, "not a finite number.");
        return value;
    }

    [GeneratedRegex(@"^([A-Za-z_]+)\s*\[([^\]]+)\]\s*[,\s]\s*([A-Za-z_]+)\s*\[([^\]]+)\]$", RegexOptions.CultureInvariant)]
    private static partial Regex HeaderPattern();
}
