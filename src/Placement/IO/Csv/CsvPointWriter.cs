using System.Buffers;
using System.Globalization;
using System.Text;
using Placement.Parallelism;
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
    /// <param name="table">What to write.</param>
    /// <param name="stream">Destination.</param>
    /// <param name="settings">Parallelism for row formatting; default: all cores, chunks of ≥ 8192 rows.</param>
    /// <param name="windowRows">Rows formatted per window (bounds the buffer memory).</param>
    internal static void WriteTo(PointTable table, Stream stream, ParallelSettings? settings = null, int windowRows = 1 << 18)
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

        writer.Flush();
        WriteRows(table, extra, stream, settings ?? DefaultSettings, windowRows);
    }

    /// <summary>
    /// Formats the rows straight to UTF-8 in windows of <paramref name="windowRows"/> rows; within a window, chunks of
    /// rows are formatted in parallel (<see cref="ParallelLoop"/>) into pooled buffers and then written in order,
    /// so the bytes do not depend on the thread count and memory stays bounded.
    /// </summary>
    private static void WriteRows(PointTable table, List<double[]> extra, Stream stream, ParallelSettings settings, int windowRows)
    {
        PointSet p = table.Points;
        int n = p.Count;
        // At most 32 bytes per number (shortest round-trip doubles, 64-bit integers) plus a separator.
        int rowBytes = (7 + extra.Count) * 33;
        for (int w0 = 0; w0 < n; w0 += windowRows)
        {
            int count = Math.Min(windowRows, n - w0);
            int chunk = ParallelLoop.ChunkSize(count, settings.MinimumChunk);
            var buffers = new byte[(count + chunk - 1) / chunk][];
            var lengths = new int[buffers.Length];
            ParallelLoop.For(count, settings, (start, end) =>
            {
                var buffer = ArrayPool<byte>.Shared.Rent((end - start) * rowBytes);
                int at = 0;
                for (int i = w0 + start; i < w0 + end; i++)
                {
                    Append(buffer, ref at, table.IdOf(i));
                    Append(buffer, ref at, p.X[i]);
                    Append(buffer, ref at, p.Y[i]);
                    Append(buffer, ref at, p.Z[i]);
                    Append(buffer, ref at, p.Mass[i]);
                    Append(buffer, ref at, p.TargetDensity[i]);
                    Append(buffer, ref at, p.Layer[i]);
                    foreach (var values in extra) Append(buffer, ref at, values[i]);
                    buffer[at - 1] = (byte)'\n';
                }
                buffers[start / chunk] = buffer;
                lengths[start / chunk] = at;
            });
            for (int c = 0; c < buffers.Length; c++)
            {
                stream.Write(buffers[c], 0, lengths[c]);
                ArrayPool<byte>.Shared.Return(buffers[c]);
            }
        }
    }

    private static readonly ParallelSettings DefaultSettings = new() { MinimumChunk = 8192 };

    /// <summary>A header cell <c>name [unit]</c>, quoted per RFC 4180 if it holds a comma or quote.</summary>
    private static string Head(string name, string unit)
    {
        string cell = $"{name} [{unit}]";
        return cell.Contains(',', StringComparison.Ordinal) || cell.Contains('"', StringComparison.Ordinal)
            ? "\"" + cell.Replace("\"", "\"\"", StringComparison.Ordinal) + "\""
            : cell;
    }

    private static void Append<T>(byte[] row, ref int at, T value) where T : IUtf8SpanFormattable
    {
        value.TryFormat(row.AsSpan(at), out int written, default, CultureInfo.InvariantCulture);
        at += written;
        row[at++] = (byte)',';
    }
}
