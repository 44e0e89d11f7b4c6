using Placement.Bodies.Background;
using Placement.Points;
using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Writes and reads the optional <c>/background</c> group: the box, density and pressure of a background medium.</summary>
/// <remarks>
/// Attributes only: <c>box_min</c>, <c>box_max</c> (float64[3], length units), <c>periodic</c> (int32 0/1), <c>density</c>
/// with <c>density_units</c>, <c>density_cgs_factor</c>, <c>pressure</c> with <c>pressure_units</c>,
/// <c>pressure_cgs_factor</c>, and <c>layer</c> (int32, the layer index of the medium's points, −2). Absent: no background.
/// </remarks>
internal static class Hdf5Background
{
    private static readonly QuantityDimension Pressure = new(-1, 1, -2);

    public static H5Group? Build(PointTable table)
    {
        if (table.Background is not { } b) return null;
        var u = table.Points.Units;
        return new H5Group
        {
            Attributes = new()
            {
                ["box_min"] = new[] { b.MinX, b.MinY, b.MinZ },
                ["box_max"] = new[] { b.MaxX, b.MaxY, b.MaxZ },
                ["periodic"] = b.Periodic ? 1 : 0,
                ["density"] = b.Density,
                ["density_units"] = u.DensityUnitName,
                ["density_cgs_factor"] = u.DensityInGramsPerCm3,
                ["pressure"] = b.Pressure,
                ["pressure_units"] = Pressure.UnitName(u),
                ["pressure_cgs_factor"] = Pressure.CgsFactor(u),
                ["layer"] = PointLayers.Background,
                ["description"] = "background medium: box (length units), uniform density and pressure; its points have layer -2",
            },
        };
    }

    public static BackgroundBox Read(string path, IH5Group group)
    {
        string where = "/" + Hdf5Layout.BackgroundGroup;
        var a = new AttributeReader(path, group, where);
        var min = Vector(path, group, "box_min", where);
        var max = Vector(path, group, "box_max", where);
        var box = new BackgroundBox(min[0], min[1], min[2], max[0], max[1], max[2], a.Int32("periodic") != 0, a.Float64("density"), a.Float64("pressure"));
        try
        {
            box.CheckValidity();
        }
        catch (InvalidOperationException e)
        {
            throw new PointFileFormatException(path, $"'{where}' is not a valid background: {e.Message}", e);
        }
        return box;
    }

    private static double[] Vector(string path, IH5Group group, string name, string where)
    {
        if (!group.AttributeExists(name)) throw new PointFileFormatException(path, $"missing attribute '{name}' on '{where}'.");
        double[] values;
        try
        {
            values = group.Attribute(name).Read<double[]>();
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            throw new PointFileFormatException(path, $"attribute '{name}' on '{where}' could not be read as three float64 values: {e.Message}", e);
        }
        if (values.Length != 3) throw new PointFileFormatException(path, $"attribute '{name}' on '{where}' has {values.Length} values; expected 3.");
        return values;
    }
}
