using System.Globalization;
using System.Runtime.InteropServices;
using System.Text.Json;
using System.Xml.Linq;
using Placement.Bodies;
using Placement.IO;
using Placement.IO.Csv;
using Placement.IO.Hdf5;
using Placement.IO.Vtk;

namespace Placement.Tests.IO;

public class PointMassFileTests
{
    private static readonly PointMass Core = new("core", 0.25, 0.03, 1e-3, -2e-3, 0, 0.01, 0.02, -0.03);
    private static readonly PointMass Companion = new("companion", 0.6, 0, -3.5, 0.25, 1e-17, -0.1, -0.45, 1e-300);

    private static PointTable WithPointMasses(int n)
    {
        var table = TestTables.Make(n);
        table.PointMasses.Add(Core);
        table.PointMasses.Add(Companion);
        return table;
    }

    [Fact]
    public void Hdf5_PointMasses_RoundTripBitForBit_AndAFileWithoutTheGroupHasNone()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("pm.h5");
        Hdf5PointWriter.Write(WithPointMasses(50), path);
        var back = Hdf5PointReader.Read(path);
        // Records compare every field exactly: HDF5 float64 keeps the IEEE bits.
        Assert.Equal([Core, Companion], back.PointMasses);

        string plain = dir.File("plain.h5");
        Hdf5PointWriter.Write(TestTables.Make(5), plain);
        Assert.Empty(Hdf5PointReader.Read(plain).PointMasses);
    }

    [H5pyFact]
    public void Hdf5_PointMasses_ReadByH5py_WithShapesAndUnits()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        string path = dir.File("pm-h5py.h5");
        Hdf5PointWriter.Write(WithPointMasses(10), path);
        // Reference reader: h5py (Debian python3-h5py) on the HDF5 C library.
        const string script = """
import h5py, json, sys
f = h5py.File(sys.argv[1], 'r')
g = f['point_masses']
out = {}
for name in g:
    d = g[name]
    data = d[()]
    if name == 'name':
        data = [x.decode() if isinstance(x, bytes) else x for x in data]
    else:
        data = data.tolist()
    out[name] = {'shape': list(d.shape), 'units': d.attrs['units'], 'cgs_factor': float(d.attrs['cgs_factor']),
                 'description': d.attrs['description'], 'data': data}
print(json.dumps(out))
""";
        var (code, stdout, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, path]);
        Assert.True(code == 0, "h5py failed: " + stderr);
        using var json = JsonDocument.Parse(stdout);
        var root = json.RootElement;
        Assert.Equal(["core", "companion"], root.GetProperty("name").GetProperty("data").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal([0.25, 0.6], root.GetProperty("mass").GetProperty("data").EnumerateArray().Select(e => e.GetDouble()));
        Assert.Equal("M_sun", root.GetProperty("mass").GetProperty("units").GetString());
        Assert.Equal("R_sun", root.GetProperty("softening_length").GetProperty("units").GetString());
        Assert.Equal([2, 3], root.GetProperty("position").GetProperty("shape").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal([2, 3], root.GetProperty("velocity").GetProperty("shape").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal("R_sun/t_dyn_sun", root.GetProperty("velocity").GetProperty("units").GetString());
        var position = root.GetProperty("position").GetProperty("data").EnumerateArray().Select(r => r.EnumerateArray().Select(e => e.GetDouble()).ToArray()).ToArray();
        Assert.Equal([Companion.X, Companion.Y, Companion.Z], position[1]);
        var velocity = root.GetProperty("velocity").GetProperty("data").EnumerateArray().Select(r => r.EnumerateArray().Select(e => e.GetDouble()).ToArray()).ToArray();
        Assert.Equal([Core.Vx, Core.Vy, Core.Vz], velocity[0]);
        Assert.All(root.EnumerateObject(), d => Assert.False(string.IsNullOrEmpty(d.Value.GetProperty("description").GetString())));
    }

    [H5pyFact]
    public void Hdf5_PointMassesWrittenByH5py_AreReadBack_AndABadRowIsLocated()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        string good = dir.File("good.h5"), bad = dir.File("bad.h5");
        Hdf5PointWriter.Write(TestTables.Make(3), good);
        File.Copy(good, bad);
        // Another writer (h5py) adding the group as docs/file-formats.md describes; the second file has a negative mass.
        const string script = """
import h5py, numpy as np, sys
for path, m in ((sys.argv[1], 2.0), (sys.argv[2], -2.0)):
    with h5py.File(path, 'a') as f:
        g = f.create_group('point_masses')
        def ds(name, data, units):
            d = g.create_dataset(name, data=data); d.attrs['units'] = units
        ds('name', np.array(['bh'], dtype=h5py.string_dtype()), '1')
        ds('mass', np.array([m]), 'M_sun')
        ds('softening_length', np.array([0.1]), 'R_sun')
        ds('position', np.array([[1.0, 2.0, 3.0]]), 'R_sun')
        ds('velocity', np.array([[0.0, 0.5, 0.0]]), 'R_sun/t_dyn_sun')
""";
        var (code, _, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, good, bad]);
        Assert.True(code == 0, "h5py failed: " + stderr);
        Assert.Equal([new PointMass("bh", 2.0, 0.1, 1, 2, 3, 0, 0.5, 0)], Hdf5PointReader.Read(good).PointMasses);
        var ex = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(bad));
        Assert.Contains("bad.h5", ex.Message, StringComparison.Ordinal);
        Assert.Contains("point_masses", ex.Message, StringComparison.Ordinal);
        Assert.Contains("-2", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Csv_PointMasses_AreCommentRowsThatParseBackExactly()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("pm.csv");
        CsvPointWriter.Write(WithPointMasses(4), path);
        var lines = File.ReadAllLines(path);
        Assert.Contains("# point_mass_columns: name,mass [M_sun],softening_length [R_sun],x [R_sun],y [R_sun],z [R_sun],vx [R_sun/t_dyn_sun],vy [R_sun/t_dyn_sun],vz [R_sun/t_dyn_sun]", lines);
        var rows = lines.Where(l => l.StartsWith("# point_mass: ", StringComparison.Ordinal)).Select(l => l["# point_mass: ".Length..].Split(',')).ToArray();
        Assert.Equal(2, rows.Length);
        var parsed = rows.Select(r => new PointMass(r[0], D(r[1]), D(r[2]), D(r[3]), D(r[4]), D(r[5]), D(r[6]), D(r[7]), D(r[8]))).ToArray();
        Assert.Equal([Core, Companion], parsed);
        // The data block is unchanged: header line then one row per point.
        Assert.Equal(4 + 1, lines.Count(l => !l.StartsWith('#')));
    }

    [Fact]
    public void Vtu_PointMasses_AreFieldDataWithOneTuplePerPointMass()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("pm.vtu");
        VtkPointWriter.Write(WithPointMasses(6), path);
        var doc = XDocument.Load(path);
        var comment = doc.Nodes().OfType<XComment>().Single().Value;
        Assert.Contains("point_mass: core,", comment, StringComparison.Ordinal);
        Assert.Contains("point_mass_velocity [R_sun/t_dyn_sun]", comment, StringComparison.Ordinal);
        var field = doc.Root!.Element("UnstructuredGrid")!.Element("FieldData")!.Elements("DataArray").ToDictionary(e => (string)e.Attribute("Name")!);
        Assert.Equal(["point_mass_mass", "point_mass_softening_length", "point_mass_position", "point_mass_velocity"], field.Keys);
        Assert.All(field.Values, e => Assert.Equal("2", (string?)e.Attribute("NumberOfTuples")));
        Assert.Equal([0.25, 0.6], Decode(field["point_mass_mass"]));
        Assert.Equal([Core.X, Core.Y, Core.Z, Companion.X, Companion.Y, Companion.Z], Decode(field["point_mass_position"]));
        // A table without point masses writes no FieldData element.
        string plain = dir.File("plain.vtu");
        VtkPointWriter.Write(TestTables.Make(3), plain);
        Assert.Null(XDocument.Load(plain).Root!.Element("UnstructuredGrid")!.Element("FieldData"));
    }

    private static double D(string s) => double.Parse(s, CultureInfo.InvariantCulture);

    /// <summary>Base64 of [UInt64 byte count][raw little-endian doubles] (VTK XML inline binary).</summary>
    private static double[] Decode(XElement array)
    {
        byte[] bytes = Convert.FromBase64String(array.Value.Trim());
        Assert.Equal((ulong)(bytes.Length - 8), BitConverter.ToUInt64(bytes, 0));
        return MemoryMarshal.Cast<byte, double>(bytes.AsSpan(8)).ToArray();
    }
}
