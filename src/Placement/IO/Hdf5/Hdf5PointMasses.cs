using Placement.Bodies;
using PureHDF;

namespace Placement.IO.Hdf5;

/// <summary>Writes and reads the optional <c>/point_masses</c> group: one row per point mass (core, companion).</summary>
/// <remarks>
/// Datasets (k rows): <c>name</c> (variable-length UTF-8 strings), <c>mass</c> (k) [mass], <c>softening_length</c> (k)
/// [length], <c>position</c> (k, 3) [length], <c>velocity</c> (k, 3) [length/time], each with <c>units</c>,
/// <c>cgs_factor</c> and <c>description</c> like the <c>/points</c> datasets. The group is written only when the table
/// has point masses; a file without it has none (files written before the group existed stay readable).
/// </remarks>
internal static class Hdf5PointMasses
{
    public const string Name = "name";
    public const string Mass = "mass";
    public const string Softening = "softening_length";
    public const string Position = "position";
    public const string Velocity = "velocity";

    /// <summary>The group for the table's point masses, or null when it has none.</summary>
    public static H5Group? Build(PointTable table)
    {
        var list = table.PointMasses;
        int k = list.Count;
        if (k == 0) return null;
        var u = table.Points.Units;
        var names = new string[k];
        var mass = new double[k];
        var soft = new double[k];
        var pos = new double[k * 3];
        var vel = new double[k * 3];
        for (int i = 0; i < k; i++)
        {
            var p = list[i];
            names[i] = p.Name; mass[i] = p.Mass; soft[i] = p.SofteningLength;
            pos[3 * i] = p.X; pos[3 * i + 1] = p.Y; pos[3 * i + 2] = p.Z;
            vel[3 * i] = p.Vx; vel[3 * i + 1] = p.Vy; vel[3 * i + 2] = p.Vz;
        }
        return new H5Group
        {
            [Name] = Hdf5PointWriter.Dataset(names, k, 1, "1", 1.0, "point mass name, e.g. core or companion"),
            [Mass] = Hdf5PointWriter.Dataset(mass, k, 1, u.MassUnitName, u.MassInGrams, "point mass"),
            [Softening] = Hdf5PointWriter.Dataset(soft, k, 1, u.LengthUnitName, u.LengthInCm,
                "softening length: Newtonian gravity beyond it, 0 = unsoftened"),
            [Position] = Hdf5PointWriter.Dataset(pos, k, 3, u.LengthUnitName, u.LengthInCm, "position (x, y, z), same frame as /points/position"),
            [Velocity] = Hdf5PointWriter.Dataset(vel, k, 3, QuantityDimension.Velocity.UnitName(u), QuantityDimension.Velocity.CgsFactor(u),
                "velocity (x, y, z), same frame as the points"),
        };
    }

    /// <summary>Reads the group's rows; the count k comes from the shape of <c>mass</c>.</summary>
    public static List<PointMass> Read(string path, IH5Group group)
    {
        if (!group.LinkExists(Mass) || group.Get(Mass) is not IH5Dataset massSet)
            throw new PointFileFormatException(path, $"missing dataset '/{Hdf5Layout.PointMassesGroup}/{Mass}'.");
        var dims = massSet.Space.Dimensions;
        if (dims.Length != 1 || dims[0] > 1_000_000)
            throw new PointFileFormatException(path, $"dataset '/{Hdf5Layout.PointMassesGroup}/{Mass}' has shape ({string.Join(", ", dims)}); expected (k).");
        int k = (int)dims[0];
        var reader = new DatasetReader(path, group, k, Hdf5Layout.PointMassesGroup);
        var names = reader.Strings(Name);
        var mass = reader.Float64(Mass, 1);
        var soft = reader.Float64(Softening, 1);
        var pos = reader.Float64(Position, 3);
        var vel = reader.Float64(Velocity, 3);
        var result = new List<PointMass>(k);
        for (int i = 0; i < k; i++)
        {
            var p = new PointMass(names[i], mass[i], soft[i], pos[3 * i], pos[3 * i + 1], pos[3 * i + 2], vel[3 * i], vel[3 * i + 1], vel[3 * i + 2]);
            try
            {
                p.CheckValidity();
            }
            catch (InvalidOperationException e)
            {
                throw new PointFileFormatException(path, $"row {i} of '/{Hdf5Layout.PointMassesGroup}' is not a valid point mass: {e.Message}", e);
            }
            result.Add(p);
        }
        return result;
    }
}
