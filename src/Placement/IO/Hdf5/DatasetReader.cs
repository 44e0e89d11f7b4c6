using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Reads the datasets of one group (<c>/points</c> by default), checking type and shape against its row count N.</summary>
internal sealed class DatasetReader(string path, IH5Group group, int n, string groupName = Hdf5Layout.PointsGroup)
{
    public double[] Float64(string name, int components) =>
        Read<double>(Open(name, H5DataTypeClass.FloatingPoint, 8, components), name);

    public int[] Int32(string name) => Read<int>(Open(name, H5DataTypeClass.FixedPoint, 4, 1), name);

    public long[] Int64(string name) => Read<long>(Open(name, H5DataTypeClass.FixedPoint, 8, 1), name);

    /// <summary>Reads a one-dimensional dataset of N variable-length strings.</summary>
    public string[] Strings(string name)
    {
        if (!group.LinkExists(name))
            throw new PointFileFormatException(path, $"missing dataset '{Where(name)}'.");
        if (group.Get(name) is not IH5Dataset dataset)
            throw new PointFileFormatException(path, $"'{Where(name)}' is not a dataset.");
        if (dataset.Type.Class is not (H5DataTypeClass.String or H5DataTypeClass.VariableLength))
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' has type {dataset.Type.Class}; expected strings.");
        var dims = dataset.Space.Dimensions;
        if (dims.Length != 1 || dims[0] != (ulong)n)
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' has shape ({string.Join(", ", dims)}); expected ({n}).");
        if (n == 0) return [];
        try
        {
            return dataset.Read<string[]>();
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' could not be read: {e.Message}", e);
        }
    }

    /// <summary>Reads an extra column: float64 of shape (N) or (N, k), with its unit attributes.</summary>
    public PointColumn Column(string name)
    {
        var dataset = group.Dataset(name);
        var dims = dataset.Space.Dimensions;
        int k = dims.Length == 2 ? (int)Math.Min(dims[1], int.MaxValue) : 1;
        var flat = Read<double>(Open(name, H5DataTypeClass.FloatingPoint, 8, k), name);
        var components = new double[k][];
        for (int c = 0; c < k; c++)
        {
            var values = components[c] = new double[n];
            for (int i = 0, j = c; i < n; i++, j += k) values[i] = flat[j];
        }
        var attributes = new AttributeReader(path, dataset, Where(name));
        string description = dataset.AttributeExists(Hdf5Layout.DescriptionAttribute) ? attributes.String(Hdf5Layout.DescriptionAttribute) : "";
        double factor = dataset.AttributeExists(Hdf5Layout.CgsFactorAttribute) ? attributes.Float64(Hdf5Layout.CgsFactorAttribute) : double.NaN;
        try
        {
            return new PointColumn(name, components, attributes.String(Hdf5Layout.UnitsAttribute), factor, description);
        }
        catch (ArgumentException e)
        {
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' is not a valid column: {e.Message}", e);
        }
    }

    private IH5Dataset Open(string name, H5DataTypeClass typeClass, int size, int components)
    {
        if (!group.LinkExists(name))
            throw new PointFileFormatException(path, $"missing dataset '{Where(name)}'.");
        if (group.Get(name) is not IH5Dataset dataset)
            throw new PointFileFormatException(path, $"'{Where(name)}' is not a dataset.");
        if (dataset.Type.Class != typeClass || dataset.Type.Size != size)
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' has type {dataset.Type.Class} of {dataset.Type.Size} bytes; expected {typeClass} of {size} bytes.");
        var dims = dataset.Space.Dimensions;
        bool shapeOk = components == 1
            ? dims.Length == 1 && dims[0] == (ulong)n
            : dims.Length == 2 && dims[0] == (ulong)n && dims[1] == (ulong)components;
        if (!shapeOk)
        {
            string expected = components == 1 ? $"({n})" : $"({n}, {components})";
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' has shape ({string.Join(", ", dims)}); expected {expected} to match point_count = {n}.");
        }
        return dataset;
    }

    private T[] Read<T>(IH5Dataset dataset, string name) where T : unmanaged
    {
        if (n == 0) return [];
        try
        {
            return dataset.Read<T[]>();
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            throw new PointFileFormatException(path, $"dataset '{Where(name)}' could not be read: {e.Message}", e);
        }
    }

    private string Where(string name) => "/" + groupName + "/" + name;
}
