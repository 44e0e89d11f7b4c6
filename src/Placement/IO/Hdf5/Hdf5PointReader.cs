using System.Text.Json;
using Placement.Points;
using Placement.Units;
using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Reads a Placement HDF5 point file (<see cref="Hdf5Layout"/>) back into a <see cref="PointTable"/>.</summary>
/// <remarks>
/// Checks, in order: the file is HDF5; the root attribute <c>format</c> is <see cref="Hdf5Layout.FormatName"/>;
/// the version is supported; the unit-system and provenance attributes are present; every core dataset exists
/// with the right type and shape (N or (N, 3)) where N = <c>point_count</c>; every extra dataset in
/// <c>/points</c> is float64 of shape (N) or (N, k) with a <c>units</c> attribute; the optional <c>/point_masses</c>
/// group (absent: no point masses) has consistent datasets and valid entries. Any failure raises a
/// <see cref="PointFileFormatException"/> naming the file and the object.
/// </remarks>
public static class Hdf5PointReader
{
    /// <summary>Reads <paramref name="path"/>.</summary>
    /// <param name="path">A file written by <see cref="Hdf5PointWriter"/>.</param>
    /// <returns>The point set (with units and provenance), ids and extra columns.</returns>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="PointFileFormatException">The file is not HDF5, not a Placement point file, of a newer
    /// version, or misses or has inconsistent datasets or attributes.</exception>
    public static PointTable Read(string path)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        if (!File.Exists(path)) throw new FileNotFoundException($"Point file '{path}' does not exist.", path);

        IDisposable file;
        IH5Group root;
        try
        {
            var native = H5File.OpenRead(path);
            file = native;
            root = native;
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            throw new PointFileFormatException(path, "not an HDF5 file (the HDF5 library could not open it).", e);
        }
        using (file)
        {
            try
            {
                return ReadContent(path, root);
            }
            catch (PointFileFormatException)
            {
                throw;
            }
            catch (Exception e) when (e is not OutOfMemoryException)
            {
                throw new PointFileFormatException(path, "could not be read as a Placement point file: " + e.Message, e);
            }
        }
    }

    private static PointTable ReadContent(string path, IH5Group root)
    {
        var a = new AttributeReader(path, root, "/");
        if (!root.AttributeExists(Hdf5Layout.FormatAttribute))
            throw new PointFileFormatException(path, $"not a Placement point file: the root has no '{Hdf5Layout.FormatAttribute}' attribute.");
        string format = a.String(Hdf5Layout.FormatAttribute);
        if (format != Hdf5Layout.FormatName)
            throw new PointFileFormatException(path, $"not a Placement point file: root attribute '{Hdf5Layout.FormatAttribute}' is '{format}', expected '{Hdf5Layout.FormatName}'.");
        int version = a.Int32(Hdf5Layout.FormatVersionAttribute);
        if (version < 1 || version > Hdf5Layout.FormatVersion)
            throw new PointFileFormatException(path, $"format version {version} is not supported; this library reads versions 1 to {Hdf5Layout.FormatVersion}.");
        long count = a.Int64(Hdf5Layout.PointCountAttribute);
        if (count < 0 || count > Array.MaxLength / 3)
            throw new PointFileFormatException(path, $"point_count {count} is out of range.");
        int n = (int)count;

        var units = ReadUnits(a);
        var provenance = ReadProvenance(path, a);

        if (!root.LinkExists(Hdf5Layout.PointsGroup))
            throw new PointFileFormatException(path, $"missing group '/{Hdf5Layout.PointsGroup}'.");
        var group = root.Group(Hdf5Layout.PointsGroup);
        var datasets = new DatasetReader(path, group, n);

        // Positions first: their shape check guards point_count before the point set is allocated.
        var position = datasets.Float64(PointColumnNames.Position, 3);
        var points = new PointSet(n, units) { Provenance = provenance };
        for (int i = 0, j = 0; i < n; i++, j += 3)
        {
            for (int c = 0; c < 3; c++)
                if (!double.IsFinite(position[j + c]))
                    throw new PointFileFormatException(path, $"'/{Hdf5Layout.PointsGroup}/{PointColumnNames.Position}' row {i}, column {"xyz"[c]}: {position[j + c]} is not a finite coordinate.");
            points.X[i] = position[j];
            points.Y[i] = position[j + 1];
            points.Z[i] = position[j + 2];
        }
        datasets.Float64(PointColumnNames.Mass, 1).CopyTo(points.Mass, 0);
        for (int i = 0; i < n; i++)
            if (!double.IsFinite(points.Mass[i]) || points.Mass[i] < 0)
                throw new PointFileFormatException(path, $"'/{Hdf5Layout.PointsGroup}/{PointColumnNames.Mass}' row {i}: {points.Mass[i]} is not a finite mass ≥ 0.");
        datasets.Float64(PointColumnNames.TargetDensity, 1).CopyTo(points.TargetDensity, 0);
        datasets.Int32(PointColumnNames.Layer).CopyTo(points.Layer, 0);
        var table = new PointTable(points) { Ids = datasets.Int64(PointColumnNames.Id) };
        if (root.LinkExists(Hdf5Layout.PointMassesGroup))
            table.PointMasses.AddRange(Hdf5PointMasses.Read(path, root.Group(Hdf5Layout.PointMassesGroup)));
        if (root.LinkExists(Hdf5Layout.BackgroundGroup))
            table.Background = Hdf5Background.Read(path, root.Group(Hdf5Layout.BackgroundGroup));

        foreach (var child in group.Children())
        {
            if (PointColumnNames.Reserved.Contains(child.Name)) continue;
            if (child is not IH5Dataset)
                throw new PointFileFormatException(path, $"'/{Hdf5Layout.PointsGroup}/{child.Name}' is not a dataset; only per-point datasets may live in '/{Hdf5Layout.PointsGroup}'.");
            table.Add(datasets.Column(child.Name));
        }
        if (root.LinkExists(BodyNames.Group)) ReadBody(path, root.Group(BodyNames.Group), table);
        return table;
    }

    /// <summary>Reads <c>/body</c>: scalar float64 datasets with units, and string attributes as labels.</summary>
    private static void ReadBody(string path, IH5Group body, PointTable table)
    {
        foreach (var child in body.Children())
        {
            string where = $"/{BodyNames.Group}/{child.Name}";
            if (child is not IH5Dataset dataset || dataset.Type.Class != H5DataTypeClass.FloatingPoint || dataset.Space.Dimensions.Length > 1
                || (dataset.Space.Dimensions.Length == 1 && dataset.Space.Dimensions[0] != 1))
                throw new PointFileFormatException(path, $"'{where}' is not a scalar float64 dataset; '/{BodyNames.Group}' holds body-level numbers only.");
            var a = new AttributeReader(path, dataset, where);
            double factor = dataset.AttributeExists(Hdf5Layout.CgsFactorAttribute) ? a.Float64(Hdf5Layout.CgsFactorAttribute) : double.NaN;
            string description = dataset.AttributeExists(Hdf5Layout.DescriptionAttribute) ? a.String(Hdf5Layout.DescriptionAttribute) : "";
            double value = dataset.Space.Dimensions.Length == 0 ? dataset.Read<double>() : dataset.Read<double[]>()[0];
            table.BodyScalars.Add(new BodyScalar(child.Name, value, a.String(Hdf5Layout.UnitsAttribute), factor, description));
        }
        var labels = new AttributeReader(path, body, "/" + BodyNames.Group);
        foreach (var attribute in body.Attributes())
            table.BodyLabels[attribute.Name] = labels.String(attribute.Name);
    }

    private static UnitSystem ReadUnits(AttributeReader a)
    {
        var units = new UnitSystem(
            a.String(Hdf5Layout.UnitSystemAttribute),
            a.String(Hdf5Layout.LengthUnitAttribute),
            a.String(Hdf5Layout.MassUnitAttribute),
            a.String(Hdf5Layout.TimeUnitAttribute),
            a.Float64(Hdf5Layout.LengthInCmAttribute),
            a.Float64(Hdf5Layout.MassInGramsAttribute),
            a.Float64(Hdf5Layout.TimeInSecondsAttribute));
        // Hand back the built-in instance when the file's system is one of them (record equality: names and factors).
        foreach (var builtIn in new[] { UnitSystem.Cgs, UnitSystem.Solar, UnitSystem.Dimensionless })
            if (builtIn == units) return builtIn;
        return units;
    }

    private static Provenance ReadProvenance(string path, AttributeReader a)
    {
        string json = a.String(Hdf5Layout.ParametersAttribute);
        Dictionary<string, string>? parameters;
        try
        {
            parameters = JsonSerializer.Deserialize<Dictionary<string, string>>(json);
        }
        catch (JsonException e)
        {
            throw new PointFileFormatException(path, $"root attribute '{Hdf5Layout.ParametersAttribute}' is not a JSON object of strings: {e.Message}", e);
        }
        return new Provenance
        {
            Sampler = a.String(Hdf5Layout.SamplerAttribute),
            Parameters = parameters ?? [],
            Seed = a.UInt64(Hdf5Layout.SeedAttribute),
            ProfileFingerprint = a.String(Hdf5Layout.ProfileFingerprintAttribute),
            LibraryVersion = a.String(Hdf5Layout.LibraryVersionAttribute),
        };
    }
}
