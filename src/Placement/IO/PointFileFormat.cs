namespace Placement.IO;

/// <summary>The point-file formats Placement writes.</summary>
public enum PointFileFormat
{
    /// <summary>HDF5 in Placement's own layout (<c>.h5</c>, <c>.hdf5</c>); the only format read back.</summary>
    Hdf5,

    /// <summary>CSV with comment header (<c>.csv</c>).</summary>
    Csv,

    /// <summary>VTK XML unstructured grid for ParaView (<c>.vtu</c>).</summary>
    Vtu,
}
