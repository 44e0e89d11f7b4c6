using System.Text.Json;
using Placement.Points;
using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Writes a <see cref="PointTable"/> to an HDF5 file in Placement's own layout (<see cref="Hdf5Layout"/>).</summary>
/// <remarks>
/// Each field is written as one contiguous dataset in a single call (PureHDF), so the cost is one pass of
/// memory copies: positions are interleaved into an (N, 3) array, 3-vector columns into (N, 3), scalars are
/// written from the point set's own arrays. The file is written atomically through <see cref="AtomicFile"/>.
/// Readable by the HDF5 C library (h5dump) and h5py; see docs/file-formats.md.
/// </remarks>
public static class Hdf5PointWriter
{
    /// <summary>Writes <paramref name="table"/> to <paramref name="path"/>.</summary>
    /// <param name="table">Points and extra columns; validated with <see cref="PointTable.CheckValidity"/> first.</param>
    /// <param name="path">Output file (conventionally <c>.h5</c>).</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="InvalidOperationException">The table breaks an invariant (non-finite position, negative mass …).</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Write(PointTable table, string path, bool overwrite = false)
    {
        ArgumentNullException.ThrowIfNull(table);
        table.CheckValidity();
        AtomicFile.Write(path, overwrite, stream => WriteTo(table, stream));
    }

    /// <summary>Writes the file content to a seekable stream (no atomicity: callers go through <see cref="Write"/>).</summary>
    internal static void WriteTo(PointTable table, Stream stream)
    {
        var file = Build(table);
        file.Write(stream);
    }

    private static H5File Build(PointTable table)
    {
        PointSet points = table.Points;
        var units = points.Units;
        int n = points.Count;
        var group = new H5Group
        {
            [PointColumnNames.Position] = Dataset(Interleave([points.X, points.Y, points.Z]), n, 3,
                units.LengthUnitName, units.LengthInCm, "position (x, y, z) relative to the body's centre"),
            [PointColumnNames.Mass] = Dataset(points.Mass, n, 1, units.MassUnitName, units.MassInGrams, "point mass"),
            [PointColumnNames.TargetDensity] = Dataset(points.TargetDensity, n, 1, units.DensityUnitName, units.DensityInGramsPerCm3,
                "target density of the radial profile at the point's radius"),
            [PointColumnNames.Layer] = Dataset(points.Layer, n, 1, "1", 1.0, "shell or layer index from the sampler, -1 where none"),
            [PointColumnNames.Id] = Dataset(Ids(table), n, 1, "1", 1.0, "point identifier"),
        };
        foreach (var column in table.Columns)
        {
            double[] data = column.ComponentCount == 1 ? column.Components[0] : Interleave(column.Components);
            group[column.Name] = Dataset(data, n, column.ComponentCount, column.Unit, column.CgsFactor, column.Description);
        }

        var provenance = points.Provenance;
        var file = new H5File { [Hdf5Layout.PointsGroup] = group };
        if (table.BodyScalars.Count > 0 || table.BodyLabels.Count > 0) file[BodyNames.Group] = BodyGroup(table);
        var a = file.Attributes;
        a[Hdf5Layout.FormatAttribute] = Hdf5Layout.FormatName;
        a[Hdf5Layout.FormatVersionAttribute] = Hdf5Layout.FormatVersion;
        a[Hdf5Layout.PointCountAttribute] = (long)n;
        a[Hdf5Layout.UnitSystemAttribute] = units.Name;
        a[Hdf5Layout.LengthUnitAttribute] = units.LengthUnitName;
        a[Hdf5Layout.MassUnitAttribute] = units.MassUnitName;
        a[Hdf5Layout.TimeUnitAttribute] = units.TimeUnitName;
        a[Hdf5Layout.LengthInCmAttribute] = units.LengthInCm;
        a[Hdf5Layout.MassInGramsAttribute] = units.MassInGrams;
        a[Hdf5Layout.TimeInSecondsAttribute] = units.TimeInSeconds;
        a[Hdf5Layout.GravitationalConstantAttribute] = units.GravitationalConstant;
        a[Hdf5Layout.SamplerAttribute] = provenance.Sampler;
        a[Hdf5Layout.ParametersAttribute] = ParametersJson(provenance);
        a[Hdf5Layout.SeedAttribute] = provenance.Seed;
        a[Hdf5Layout.ProfileFingerprintAttribute] = provenance.ProfileFingerprint;
        a[Hdf5Layout.LibraryVersionAttribute] = provenance.LibraryVersion;
        a[Hdf5Layout.WriterAttribute] = "Placement " + LibraryInfo.Version;
        if (Hdf5PointMasses.Build(table) is { } pointMasses) file[Hdf5Layout.PointMassesGroup] = pointMasses;
        if (Hdf5Background.Build(table) is { } background) file[Hdf5Layout.BackgroundGroup] = background;
        return file;
    }

    /// <summary>Sampler parameters as a JSON object with keys in ordinal order (stable bytes for equal provenance).</summary>
    internal static string ParametersJson(Provenance provenance) =>
        JsonSerializer.Serialize(new SortedDictionary<string, string>(
            provenance.Parameters.ToDictionary(p => p.Key, p => p.Value), StringComparer.Ordinal));

    internal static H5Dataset Dataset(Array data, int n, int components, string unit, double cgsFactor, string description)
    {
        ulong[] dims = components == 1 ? [(ulong)n] : [(ulong)n, (ulong)components];
        return new H5Dataset(data, fileDims: dims)
        {
            Attributes = new()
            {
                [Hdf5Layout.UnitsAttribute] = unit,
                [Hdf5Layout.CgsFactorAttribute] = cgsFactor,
                [Hdf5Layout.DescriptionAttribute] = description,
            },
        };
    }

    /// <summary>The <c>/body</c> group: one scalar dataset per body scalar (with units), one string attribute per label.</summary>
    private static H5Group BodyGroup(PointTable table)
    {
        var body = new H5Group();
        foreach (var scalar in table.BodyScalars)
        {
            body[scalar.Name] = new H5Dataset(scalar.Value)
            {
                Attributes = new()
                {
                    [Hdf5Layout.UnitsAttribute] = scalar.Unit,
                    [Hdf5Layout.CgsFactorAttribute] = scalar.CgsFactor,
                    [Hdf5Layout.DescriptionAttribute] = scalar.Description,
                },
            };
        }
        foreach (var (name, value) in table.BodyLabels) body.Attributes[name] = value;
        return body;
    }

    private static long[] Ids(PointTable table)
    {
        if (table.Ids is not null) return table.Ids;
        var ids = new long[table.Count];
        for (int i = 0; i < ids.Length; i++) ids[i] = i;
        return ids;
    }

    /// <summary>Interleaves k component arrays of length N into one row-major (N, k) array.</summary>
    internal static double[] Interleave(IReadOnlyList<double[]> components)
    {
        int k = components.Count, n = components[0].Length;
        var result = new double[(long)n * k];
        for (int c = 0; c < k; c++)
        {
            var source = components[c];
            for (int i = 0, j = c; i < n; i++, j += k) result[j] = source[i];
        }
        return result;
    }
}
