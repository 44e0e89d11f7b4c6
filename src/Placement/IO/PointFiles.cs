using Placement.IO.Csv;
using Placement.IO.Hdf5;
using Placement.IO.Vtk;

namespace Placement.IO;

/// <summary>Entry points for writing and reading point files; the format follows from the file extension.</summary>
/// <remarks>
/// <c>.h5</c>/<c>.hdf5</c> → <see cref="Hdf5PointWriter"/>, <c>.csv</c> → <see cref="CsvPointWriter"/>,
/// <c>.vtu</c> → <see cref="VtkPointWriter"/> (base64 binary). All writes are atomic and refuse to replace an
/// existing file unless <c>overwrite</c> is true. Layouts: docs/file-formats.md.
/// </remarks>
public static class PointFiles
{
    /// <summary>The format implied by <paramref name="path"/>'s extension (case-insensitive).</summary>
    /// <param name="path">File path.</param>
    /// <exception cref="ArgumentException">The extension is not one of .h5, .hdf5, .csv, .vtu.</exception>
    public static PointFileFormat FormatOf(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        return Path.GetExtension(path).ToLowerInvariant() switch
        {
            ".h5" or ".hdf5" => PointFileFormat.Hdf5,
            ".csv" => PointFileFormat.Csv,
            ".vtu" => PointFileFormat.Vtu,
            var other => throw new ArgumentException($"Cannot tell the format of '{path}' from its extension '{other}'; expected .h5, .hdf5, .csv or .vtu.", nameof(path)),
        };
    }

    /// <summary>Writes <paramref name="table"/> to <paramref name="path"/> in the format of its extension.</summary>
    /// <param name="table">Points and extra columns.</param>
    /// <param name="path">Output path.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="ArgumentException">Unknown extension.</exception>
    /// <exception cref="InvalidOperationException">The table breaks an invariant.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Write(PointTable table, string path, bool overwrite = false) =>
        Write(table, path, FormatOf(path), overwrite);

    /// <summary>Writes <paramref name="table"/> to <paramref name="path"/> in an explicit format.</summary>
    /// <param name="table">Points and extra columns.</param>
    /// <param name="path">Output path.</param>
    /// <param name="format">Format to write.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="ArgumentOutOfRangeException">Unknown format value.</exception>
    /// <exception cref="InvalidOperationException">The table breaks an invariant.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Write(PointTable table, string path, PointFileFormat format, bool overwrite = false)
    {
        switch (format)
        {
            case PointFileFormat.Hdf5: Hdf5PointWriter.Write(table, path, overwrite); break;
            case PointFileFormat.Csv: CsvPointWriter.Write(table, path, overwrite); break;
            case PointFileFormat.Vtu: VtkPointWriter.Write(table, path, overwrite); break;
            default: throw new ArgumentOutOfRangeException(nameof(format), format, "Unknown point file format.");
        }
    }

    /// <summary>Reads a Placement HDF5 point file (see <see cref="Hdf5PointReader.Read"/>).</summary>
    /// <param name="path">File path.</param>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="PointFileFormatException">Not a (valid) Placement HDF5 point file.</exception>
    public static PointTable Read(string path) => Hdf5PointReader.Read(path);
}
