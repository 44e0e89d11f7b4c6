using System.Globalization;
using Placement.IO.Hdf5;

namespace Placement.IO;

/// <summary>The key–value description (format, units, provenance, point masses) written as comment lines in text formats (CSV, VTK).</summary>
/// <remarks>Point masses: one <c>point_mass_columns</c> line naming the fields with their units, then one <c>point_mass</c>
/// line per point mass holding a comma-separated row in that order (shortest round-trip numbers).</remarks>
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
        if (table.PointMasses.Count > 0)
        {
            string length = units.LengthUnitName, speed = QuantityDimension.Velocity.UnitName(units);
            lines.Add(new("point_mass_columns",
                $"name,mass [{units.MassUnitName}],softening_length [{length}],x [{length}],y [{length}],z [{length}],vx [{speed}],vy [{speed}],vz [{speed}]"));
            foreach (var p in table.PointMasses)
                lines.Add(new("point_mass", string.Join(',', p.Name, R(p.Mass), R(p.SofteningLength), R(p.X), R(p.Y), R(p.Z), R(p.Vx), R(p.Vy), R(p.Vz))));
        }
        if (table.Background is { } b)
            lines.Add(new("background", string.Create(inv,
                $"box [{R(b.MinX)}, {R(b.MaxX)}] x [{R(b.MinY)}, {R(b.MaxY)}] x [{R(b.MinZ)}, {R(b.MaxZ)}] {units.LengthUnitName}, periodic {(b.Periodic ? "yes" : "no")}, density {R(b.Density)} {units.DensityUnitName}, pressure {R(b.Pressure)} (mass/(length time^2) units), layer {Points.PointLayers.Background}")));
        for (int i = 0; i < lines.Count; i++)
            lines[i] = new(lines[i].Key, lines[i].Value.ReplaceLineEndings(" "));
        return lines;
    }

    private static string R(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
