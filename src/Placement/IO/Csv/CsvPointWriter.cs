using System.Globalization;
using System.Text;
using Placement.Points;

namespace Placement.IO.Csv;

/// <summary>Writes a <see cref="PointTable"/> as CSV: <c>#</c> comment lines with format, units and provenance, one header line of <c>name [unit]</c>, one row per point.</summary>
/// <remarks>
/// Columns: <c>id, x, y, z, mass, target_density, layer</c>, then each extra column (3-vectors as
/// <c>name_x, name_y, name_z</c>). Numbers use the invariant culture and the shortest text that round-trips
/// to the same double (so reading the file back is exact). Lines end with <c>\n</c>; UTF-8 without BOM.
/// Written atomically through <see cref="AtomicFile"/>. See docs/file-formats.md.
/// </remarks>
public static class CsvPointWriter
{
    /// <summary>Value of the <c># format:</c> comment line.</summary>
    public const string FormatName = "placement-points-csv";

    /// <summary>Writes <paramref name="table"/> to <paramref name="path"/>.</summary>
    /// <param name="table">Points and extra columns; validated with <see cref="PointTable.CheckValidity"/> first.</param>
    /// <param name="path">Output file (conventionally <c>.csv</c>).</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="InvalidOperationException">The table breaks an invariant.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Write(PointTable table, string path, bool overwrite = false)
    {
        ArgumentNullException.ThrowIfNull(table);
        table.CheckValidity();
        AtomicFile.Write(path, overwrite, stream => WriteTo(table, stream));
    }

    /// <summary>Writes the CSV text to a stream (no atomicity: callers go through <see cref="Write"/>).</summary>
    internal static void WriteTo(PointTable table, Stream stream)
    {
        using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" };
        foreach (var (key, value) in FileHeaderLines.For(table, FormatName))
            writer.Write($"# {key}: {value}\n");

        PointSet p = table.Points;
        var u = p.Units;
        var header = new List<string>
        {
            Head("id", "1"), Head("x", u.LengthUnitName), Head("y", u.LengthUnitName), Head("z", u.LengthUnitName),
            Head("mass", u.MassUnitName), Head("target_density", u.DensityUnitName), Head("layer", "1"),
        };
        var extra = new List<double[]>();
        foreach (var column in table.Columns)
            for (int c = 0; c < column.ComponentCount; c++)
            {
                header.Add(Head(column.ComponentName(c), column.Unit));
                extra.Add(column.Components[c]);
            }
        writer.Write(string.Join(',', header));
        writer.Write('\n');

        // One reusable row buffer: 7 core fields + extras, at most 32 characters each, plus separators.
        Span<char> row = new char[(7 + extra.Count) * 34 + 2];
        for (int i = 0; i < p.Count; i++)
        {
            int at = 0;
            Append(row, ref at, table.IdOf(i));
            Append(row, ref at, p.X[i]);
            Append(row, ref at, p.Y[i]);
            Append(row, ref at, p.Z[i]);
            Append(row, ref at, p.Mass[i]);
            Append(row, ref at, p.TargetDensity[i]);
            Append(row, ref at, p.Layer[i]);
            foreach (var values in extra) Append(row, ref at, values[i]);
            row[at - 1] = '\n';
            writer.Write(row[..at]);
        }
    }

    /// <summary>A header cell <c>name [unit]</c>, quoted per RFC 4180 if it holds a comma or quote.</summary>
    private static string Head(string name, string unit)
    {
        string cell = $"{name} [{unit}]";
        return cell.Contains(',', StringComparison.Ordinal) || cell.Contains('"', StringComparison.Ordinal)
            ? "\"" + cell.Replace("\"", "\"\"", StringComparison.Ordinal) + "\""
            : cell;
    }

    private static void Append<T>(Span<char> row, ref int at, T value) where T : ISpanFormattable
    {
        value.TryFormat(row[at..], out int written, default, CultureInfo.InvariantCulture);
        at += written;
        row[at++] = ',';
    }
}
