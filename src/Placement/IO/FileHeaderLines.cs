using System.Globalization;
using Placement.IO.Hdf5;

namespace Placement.IO;

/// <summary>The key–value description (format, units, provenance) written as comment lines in text formats (CSV, VTK).</summary>
internal static class FileHeaderLines
{
    /// <summary>Key–value pairs in a fixed order; values are single-line.</summary>
    public static List<KeyValuePair<string, string>> For(PointTable table, string formatName)
    {
        var units = table.Points.Units;
        var provenance = table.Points.Provenance;
        var inv = CultureInfo.InvariantCulture;
        var lines = new List<KeyValuePair<string, string>>
        {
            new("format", formatName),
            new("format_version", Hdf5Layout.FormatVersion.ToString(inv)),
            new("point_count", table.Count.ToString(inv)),
            new("unit_system", units.Name),
            new("length_unit", $"{units.LengthUnitName} = {units.LengthInCm.ToString("R", inv)} cm"),
            new("mass_unit", $"{units.MassUnitName} = {units.MassInGrams.ToString("R", inv)} g"),
            new("time_unit", $"{units.TimeUnitName} = {units.TimeInSeconds.ToString("R", inv)} s"),
            new("sampler", provenance.Sampler),
            new("parameters", Hdf5PointWriter.ParametersJson(provenance)),
            new("seed", provenance.Seed.ToString(inv)),
            new("profile_fingerprint", provenance.ProfileFingerprint),
            new("library_version", provenance.LibraryVersion),
            new("writer", "Placement " + LibraryInfo.Version),
        };
        for (int i = 0; i < lines.Count; i++)
            lines[i] = new(lines[i].Key, lines[i].Value.ReplaceLineEndings(" "));
        return lines;
    }
}
