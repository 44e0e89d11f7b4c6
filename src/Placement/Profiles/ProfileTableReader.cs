using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>Reads radial profiles from plain text tables of our own generic format.</summary>
/// <remarks>
/// <para>Format: lines starting with <c>#</c> (and anything after a <c>#</c> on a line) are comments; blank lines are
/// skipped; the first other line is the header naming the columns, each optionally with its unit as
/// <c>name[unit]</c>; every further line is one row. Cells are separated by commas if the header contains a comma,
/// otherwise by whitespace. Rows go outward (increasing radius or mass coordinate); a radius repeated on two
/// consecutive rows marks a density step. Numbers use the invariant culture (<c>1.5e-3</c>).</para>
/// <para>Every problem raises one <see cref="ProfileFormatException"/> naming file, line, column and value:
/// non-numeric cells, NaN or infinite values, negative density, zero density except at the last row (and only if
/// allowed), decreasing or duplicated radii, fewer than two rows, unknown column names, missing or unknown units, a
/// unit of the wrong dimension, rows with the wrong number of cells.</para>
/// </remarks>
public static class ProfileTableReader
{
    /// <summary>Reads the table in the file at <paramref name="path"/>.</summary>
    /// <param name="path">File to read.</param>
    /// <param name="options">Column map, target units and build options; defaults when null.</param>
    /// <exception cref="ArgumentNullException"><paramref name="path"/> is null.</exception>
    /// <exception cref="ProfileFormatException">The table breaks a rule.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static TabulatedProfile Read(string path, ProfileTableOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        using var reader = new StreamReader(path);
        return Read(reader, Path.GetFileName(path), options);
    }

    /// <summary>Reads a table from <paramref name="reader"/>; <paramref name="sourceName"/> is used in error messages.</summary>
    /// <param name="reader">The text.</param>
    /// <param name="sourceName">Name of the input for messages (e.g. the file name).</param>
    /// <param name="options">Column map, target units and build options; defaults when null.</param>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ProfileFormatException">The table breaks a rule.</exception>
    public static TabulatedProfile Read(TextReader reader, string sourceName, ProfileTableOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(reader);
        ArgumentNullException.ThrowIfNull(sourceName);
        options ??= ProfileTableOptions.Default;
        var map = options.Columns ?? ProfileColumnMap.Default;
        var src = sourceName;

        // Header.
        string? line;
        int lineNo = 0;
        string[]? header = null;
        bool comma = false;
        int headerLine = 0;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            string content = StripComment(line);
            if (content.Length == 0) continue;
            comma = content.Contains(',', StringComparison.Ordinal);
            header = SplitCells(content, comma);
            headerLine = lineNo;
            break;
        }
        if (header is null) throw new ProfileFormatException(src, lineNo, "", "", "the table has no header row naming the columns");
        var names = new string[header.Length];
        var headerUnits = new string?[header.Length];
        for (int c = 0; c < header.Length; c++)
        {
            string h = header[c];
            int open = h.IndexOf('[', StringComparison.Ordinal);
            if (open >= 0 && h.EndsWith(']'))
            {
                names[c] = h[..open];
                headerUnits[c] = h[(open + 1)..^1];
            }
            else names[c] = h;
            if (names[c].Length == 0) throw new ProfileFormatException(src, headerLine, $"#{c + 1}", h, "empty column name in the header");
            for (int j = 0; j < c; j++)
                if (names[j] == names[c]) throw new ProfileFormatException(src, headerLine, names[c], h, "column name appears twice in the header");
        }

        // Which columns are used, with which unit.
        if ((map.Radius is null) == (map.MassCoordinate is null))
            throw new ProfileFormatException(src, headerLine, "", "", "the column map must name exactly one of a radius column and a mass-coordinate column");
        var target = options.TargetUnits ?? UnitSystem.Cgs;
        var lengthUnit = PhysicalUnit.ForSystem(target, 1, 0, 0);
        var massUnit = PhysicalUnit.ForSystem(target, 0, 1, 0);
        var densityUnit = PhysicalUnit.ForSystem(target, -3, 1, 0);
        bool massCoordinate = map.MassCoordinate is not null;
        var coord = Resolve(map.Radius ?? map.MassCoordinate!, massCoordinate ? massUnit : lengthUnit, massCoordinate ? "mass" : "length");
        var dens = Resolve(map.Density, densityUnit, "density");
        (int Index, double Factor, PhysicalUnit Unit)? encl = map.EnclosedMass is null ? null : Resolve(map.EnclosedMass, massUnit, "mass");
        if (encl is not null && massCoordinate)
            throw new ProfileFormatException(src, headerLine, names[encl.Value.Index], map.EnclosedMass!, "an enclosed-mass column is redundant in a mass-coordinate table");
        var used = new HashSet<int> { coord.Index, dens.Index };
        if (encl is not null) used.Add(encl.Value.Index);
        var extras = new List<(int Index, double Factor, PhysicalUnit Unit)>();
        if (map.Quantities is null)
        {
            for (int c = 0; c < names.Length; c++) if (!used.Contains(c)) extras.Add(Resolve(names[c], null, null));
        }
        else
        {
            foreach (string q in map.Quantities) extras.Add(Resolve(q, null, null));
        }

        // Rows.
        var lines = new List<int>();
        var columns = new List<double>[names.Length];
        var needed = new List<int>(used);
        foreach (var e in extras) needed.Add(e.Index);
        foreach (int c in needed) columns[c] = [];
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            string content = StripComment(line);
            if (content.Length == 0) continue;
            string[] cells = SplitCells(content, comma);
            if (cells.Length != names.Length)
                throw new ProfileFormatException(src, lineNo, $"#{Math.Min(cells.Length, names.Length) + 1}", content,
                    $"row has {cells.Length} cells, the header names {names.Length} columns");
            foreach (int c in needed)
            {
                if (!double.TryParse(cells[c], NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
                    throw new ProfileFormatException(src, lineNo, names[c], cells[c], "not a number");
                if (!double.IsFinite(v))
                    throw new ProfileFormatException(src, lineNo, names[c], cells[c], "not a finite number (NaN and infinities are not allowed)");
                columns[c].Add(v);
            }
            lines.Add(lineNo);
        }
        if (lines.Count < 2)
            throw new ProfileFormatException(src, lines.Count > 0 ? lines[^1] : headerLine, names[coord.Index], lines.Count.ToString(CultureInfo.InvariantCulture),
                $"a profile needs at least two rows, found {lines.Count}");

        double[] Convert((int Index, double Factor, PhysicalUnit Unit) col)
        {
            var v = columns[col.Index];
            var o = new double[v.Count];
            for (int i = 0; i < o.Length; i++) o[i] = v[i] * col.Factor;
            return o;
        }
        double[] x = Convert(coord), rho = Convert(dens);
        var profileOptions = (options.Profile ?? TabulatedProfileOptions.Default) with { Description = src };
        string coordRole = massCoordinate ? "mass" : "radius";
        if (ProfileTableChecks.Check(x, rho, profileOptions.AllowZeroOuterDensity, profileOptions.AllowDensitySteps, coordRole) is { } bad)
            throw Problem(bad, bad.Column == "density" ? dens.Index : coord.Index, columns);
        double[]? m = null;
        if (encl is { } ec)
        {
            m = Convert(ec);
            if (ProfileTableChecks.CheckMasses(x, m) is { } badM) throw Problem(badM, ec.Index, columns);
        }
        var quantities = new List<TabulatedQuantity>(extras.Count);
        foreach (var e in extras) quantities.Add(new TabulatedQuantity(new ProfileQuantity(names[e.Index], e.Unit), Convert(e)));
        return massCoordinate
            ? TabulatedProfile.FromMassCoordinate(x, rho, target, profileOptions, quantities)
            : new TabulatedProfile(x, rho, target, profileOptions, m, quantities);

        ProfileFormatException Problem(TableProblem p, int column, List<double>[] cols) =>
            new(src, lines[p.Row], names[column], cols[column][p.Row].ToString("R", CultureInfo.InvariantCulture), p.Message);

        // Finds a column and its unit; with an expected unit, checks the dimension and returns the factor into it.
        // Without one (carried quantities), converts mechanical units into the target system and keeps K and "1".
        (int Index, double Factor, PhysicalUnit Unit) Resolve(string entry, PhysicalUnit? expected, string? dimensionName)
        {
            (string name, string? unitText) = ProfileColumnMap.Split(entry);
            int index = Array.IndexOf(names, name);
            if (index < 0)
                throw new ProfileFormatException(src, headerLine, name, entry, $"no such column; the header has: {string.Join(", ", names)}");
            unitText ??= headerUnits[index];
            if (string.IsNullOrWhiteSpace(unitText))
                throw new ProfileFormatException(src, headerLine, name, entry, "missing unit: give it in the column map as 'name:unit' or in the header as 'name[unit]'");
            if (!PhysicalUnit.TryParse(unitText, out var unit))
                throw new ProfileFormatException(src, headerLine, name, unitText, $"unknown unit; units are products of {string.Join(", ", PhysicalUnit.BaseNames)} with integer powers");
            var want = expected ?? (unit.IsDimensionless || (unit.Length == 0 && unit.Mass == 0 && unit.Time == 0) ? unit : unit.In(target));
            if (target.Name == "dimensionless" && unit.IsDimensionless) return (index, 1, want);
            if (!unit.SameDimension(want))
                throw new ProfileFormatException(src, headerLine, name, unitText, $"unit has the wrong dimension: expected a {dimensionName} unit such as {want.Name}");
            return (index, unit.FactorTo(want), want);
        }
    }

    private static string StripComment(string line)
    {
        int hash = line.IndexOf('#', StringComparison.Ordinal);
        return (hash >= 0 ? line[..hash] : line).Trim();
    }

    private static string[] SplitCells(string content, bool comma) =>
        comma
            ? content.Split(',', StringSplitOptions.TrimEntries)
            : content.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
}
