using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Reads required attributes of one HDF5 object with type checks and file-naming error messages.</summary>
internal sealed class AttributeReader(string path, IH5Object owner, string ownerName)
{
    public string String(string name) => Read<string>(name, H5DataTypeClass.String, H5DataTypeClass.VariableLength);

    public double Float64(string name) => Read<double>(name, H5DataTypeClass.FloatingPoint);

    public int Int32(string name) => (int)Read<long>(name, H5DataTypeClass.FixedPoint);

    public long Int64(string name) => Read<long>(name, H5DataTypeClass.FixedPoint);

    public ulong UInt64(string name) => Read<ulong>(name, H5DataTypeClass.FixedPoint);

    private T Read<T>(string name, params H5DataTypeClass[] classes)
    {
        if (!owner.AttributeExists(name))
            throw new PointFileFormatException(path, $"missing attribute '{name}' on '{ownerName}'.");
        var attribute = owner.Attribute(name);
        if (Array.IndexOf(classes, attribute.Type.Class) < 0)
            throw new PointFileFormatException(path, $"attribute '{name}' on '{ownerName}' has HDF5 type class {attribute.Type.Class}; expected {string.Join(" or ", classes)}.");
        try
        {
            if (typeof(T) == typeof(long) && attribute.Type.Size == 4)
                return (T)(object)(long)attribute.Read<int>();
            return attribute.Read<T>();
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            throw new PointFileFormatException(path, $"attribute '{name}' on '{ownerName}' could not be read as {typeof(T).Name}: {e.Message}", e);
        }
    }
}
