using System.Text.Json;
using Placement.IO;
using Placement.IO.Hdf5;
using Placement.Points;
using Placement.Units;
using PureHDF;

namespace Placement.Tests.IO;

public class Hdf5PointFileTests
{
    [Fact]
    public void Hdf5_WriteThenRead_ReproducesEveryFieldColumnUnitAndProvenanceBitForBit()
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(1000);
        table.Ids = Enumerable.Range(0, 1000).Select(i => 5_000_000_000L + 3 * i).ToArray();
        string path = dir.File("points.h5");

        Hdf5PointWriter.Write(table, path);
        var back = Hdf5PointReader.Read(path);

        // Exact equality: HDF5 float64 stores the IEEE bits unchanged.
        var p = table.Points;
        var q = back.Points;
        Assert.Equal(p.Count, q.Count);
        Assert.Equal(p.X, q.X);
        Assert.Equal(p.Y, q.Y);
        Assert.Equal(p.Z, q.Z);
        Assert.Equal(p.Mass, q.Mass);
        Assert.Equal(p.TargetDensity, q.TargetDensity);
        Assert.Equal(p.Layer, q.Layer);
        Assert.Equal(table.Ids, back.Ids);
        Assert.Same(UnitSystem.Solar, q.Units);
        Assert.Equal(p.Provenance.Sampler, q.Provenance.Sampler);
        Assert.Equal(p.Provenance.Seed, q.Provenance.Seed);
        Assert.Equal(p.Provenance.ProfileFingerprint, q.Provenance.ProfileFingerprint);
        Assert.Equal(p.Provenance.LibraryVersion, q.Provenance.LibraryVersion);
        Assert.Equal(p.Provenance.Parameters.OrderBy(k => k.Key), q.Provenance.Parameters.OrderBy(k => k.Key));

        Assert.Equal(2, back.Columns.Count);
        foreach (var column in table.Columns)
        {
            var other = back.Find(column.Name);
            Assert.NotNull(other);
            Assert.Equal(column.ComponentCount, other.ComponentCount);
            Assert.Equal(column.Unit, other.Unit);
            Assert.Equal(column.CgsFactor, other.CgsFactor);
            Assert.Equal(column.Description, other.Description);
            for (int c = 0; c < column.ComponentCount; c++) Assert.Equal(column.Components[c], other.Components[c]);
        }
        back.CheckValidity();
    }

    [Fact]
    public void Hdf5_CustomUnitSystem_RoundTripsNamesAndFactors()
    {
        using var dir = TestTables.TempDir();
        var km = new UnitSystem("km-kg", "km", "kg", "s", 1e5, 1e3, 1.0);
        var table = TestTables.Make(10, km);
        string path = dir.File("custom.h5");
        Hdf5PointWriter.Write(table, path);
        var back = Hdf5PointReader.Read(path);
        Assert.Equal(km, back.Points.Units);
        // km/s = 1e5 cm/s (dimensional analysis).
        Assert.Equal("km/s", back.Find("velocity")!.Unit);
        Assert.Equal(1e5, back.Find("velocity")!.CgsFactor);
    }

    [Fact]
    public void Hdf5_EmptyPointSet_RoundTrips()
    {
        using var dir = TestTables.TempDir();
        var table = new PointTable(new PointSet(0, UnitSystem.Cgs));
        string path = dir.File("empty.h5");
        Hdf5PointWriter.Write(table, path);
        var back = Hdf5PointReader.Read(path);
        Assert.Equal(0, back.Count);
        Assert.Same(UnitSystem.Cgs, back.Points.Units);
    }

    [H5pyFact]
    public void Hdf5_ReadByH5py_GivesSameValuesShapesAndAttributes()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(257);
        string path = dir.File("h5py.h5");
        Hdf5PointWriter.Write(table, path);

        // Reference reader: h5py (Debian python3-h5py), on top of the HDF5 C library.
        const string script = """
import h5py, json, sys
f = h5py.File(sys.argv[1], 'r')
g = f['points']
out = {'attrs': {k: (v.decode() if isinstance(v, bytes) else (v.item() if hasattr(v, 'item') else v)) for k, v in f.attrs.items()}}
for name in g:
    d = g[name]
    out[name] = {'shape': list(d.shape), 'dtype': str(d.dtype), 'units': d.attrs['units'],
                 'cgs_factor': float(d.attrs['cgs_factor']), 'data': d[()].tolist()}
print(json.dumps(out))
""";
        var (code, stdout, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, path]);
        Assert.True(code == 0, "h5py failed: " + stderr);
        using var json = JsonDocument.Parse(stdout);
        var root = json.RootElement;
        var attrs = root.GetProperty("attrs");
        Assert.Equal(Hdf5Layout.FormatName, attrs.GetProperty("format").GetString());
        Assert.Equal(Hdf5Layout.FormatVersion, attrs.GetProperty("format_version").GetInt32());
        Assert.Equal(257, attrs.GetProperty("point_count").GetInt64());
        Assert.Equal("solar", attrs.GetProperty("unit_system").GetString());
        Assert.Equal("R_sun", attrs.GetProperty("length_unit").GetString());
        Assert.Equal(UnitSystem.SolarRadiusCm, attrs.GetProperty("length_unit_in_cm").GetDouble());
        Assert.Equal(UnitSystem.SolarMassGrams, attrs.GetProperty("mass_unit_in_g").GetDouble());
        Assert.Equal(UnitSystem.Solar.TimeInSeconds, attrs.GetProperty("time_unit_in_s").GetDouble());
        Assert.Equal(0xFEDCBA9876543210UL, attrs.GetProperty("seed").GetUInt64());
        Assert.Equal("test-sampler", attrs.GetProperty("sampler").GetString());
        Assert.Equal("sha256:0123abcd", attrs.GetProperty("profile_fingerprint").GetString());
        var parameters = JsonSerializer.Deserialize<Dictionary<string, string>>(attrs.GetProperty("parameters").GetString()!)!;
        Assert.Equal("a \"quoted\", comma", parameters["note"]);
        Assert.Equal("8", parameters["nside"]);

        var p = table.Points;
        var position = root.GetProperty("position");
        Assert.Equal([257, 3], position.GetProperty("shape").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal("float64", position.GetProperty("dtype").GetString());
        Assert.Equal("R_sun", position.GetProperty("units").GetString());
        var rows = position.GetProperty("data").EnumerateArray().ToArray();
        for (int i = 0; i < p.Count; i++)
        {
            var row = rows[i].EnumerateArray().Select(e => e.GetDouble()).ToArray();
            Assert.Equal([p.X[i], p.Y[i], p.Z[i]], row);
        }
        Assert.Equal(p.Mass, Doubles(root, "mass"));
        Assert.Equal(p.TargetDensity, Doubles(root, "target_density"));
        Assert.Equal("M_sun/R_sun^3", root.GetProperty("target_density").GetProperty("units").GetString());
        Assert.Equal(UnitSystem.Solar.DensityInGramsPerCm3, root.GetProperty("target_density").GetProperty("cgs_factor").GetDouble());
        Assert.Equal("int32", root.GetProperty("layer").GetProperty("dtype").GetString());
        Assert.Equal(p.Layer, root.GetProperty("layer").GetProperty("data").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal("int64", root.GetProperty("id").GetProperty("dtype").GetString());
        Assert.Equal(Enumerable.Range(0, 257).Select(i => (long)i), root.GetProperty("id").GetProperty("data").EnumerateArray().Select(e => e.GetInt64()));
        Assert.Equal(table.Find("cell_volume")!.Components[0], Doubles(root, "cell_volume"));
        Assert.Equal("R_sun^3", root.GetProperty("cell_volume").GetProperty("units").GetString());
        var velocity = root.GetProperty("velocity");
        Assert.Equal([257, 3], velocity.GetProperty("shape").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal("R_sun/t_dyn_sun", velocity.GetProperty("units").GetString());
        var v = table.Find("velocity")!.Components;
        var vrows = velocity.GetProperty("data").EnumerateArray().ToArray();
        for (int i = 0; i < p.Count; i++)
            Assert.Equal([v[0][i], v[1][i], v[2][i]], vrows[i].EnumerateArray().Select(e => e.GetDouble()));
    }

    [H5pyFact]
    public void Hdf5_FileWrittenByH5pyFollowingTheDocumentedLayout_IsReadBack()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        string path = dir.File("from-h5py.h5");
        // Another writer (h5py, Debian python3-h5py) following docs/file-formats.md: integer attributes come out
        // as int64 and strings as h5py's default variable-length UTF-8.
        const string script = """
import h5py, numpy as np, sys, json
n = 5
with h5py.File(sys.argv[1], 'w') as f:
    a = f.attrs
    a['format'] = 'placement-points'; a['format_version'] = 1; a['point_count'] = n
    a['unit_system'] = 'cgs'; a['length_unit'] = 'cm'; a['mass_unit'] = 'g'; a['time_unit'] = 's'
    a['length_unit_in_cm'] = 1.0; a['mass_unit_in_g'] = 1.0; a['time_unit_in_s'] = 1.0
    a['sampler'] = 'by-hand'; a['parameters'] = json.dumps({'k': 'v'}); a['seed'] = np.uint64(7)
    a['profile_fingerprint'] = 'none'; a['library_version'] = '0.0.0'
    g = f.create_group('points')
    def ds(name, data, units):
        d = g.create_dataset(name, data=data); d.attrs['units'] = units; d.attrs['cgs_factor'] = 1.0
    ds('position', np.arange(3 * n, dtype='f8').reshape(n, 3), 'cm')
    ds('mass', np.full(n, 2.0), 'g')
    ds('target_density', np.linspace(1, 5, n), 'g/cm^3')
    ds('layer', np.arange(n, dtype='i4'), '1')
    ds('id', np.arange(10, 10 + n, dtype='i8'), '1')
    ds('sph_density', np.linspace(0.5, 4.5, n), 'g/cm^3')
""";
        var (code, _, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, path]);
        Assert.True(code == 0, "h5py failed: " + stderr);

        var table = Hdf5PointReader.Read(path);
        Assert.Equal(5, table.Count);
        Assert.Same(UnitSystem.Cgs, table.Points.Units);
        Assert.Equal([0.0, 3, 6, 9, 12], table.Points.X);
        Assert.Equal([2.0, 5, 8, 11, 14], table.Points.Z);
        Assert.Equal([10L, 11, 12, 13, 14], table.Ids!);
        Assert.Equal(7UL, table.Points.Provenance.Seed);
        Assert.Equal("v", table.Points.Provenance.Parameters["k"]);
        var sph = table.Find("sph_density");
        Assert.NotNull(sph);
        Assert.Equal("g/cm^3", sph.Unit);
        Assert.Equal([0.5, 1.5, 2.5, 3.5, 4.5], sph.Components[0]);
    }

    [H5DumpFact]
    public void Hdf5_H5dumpHeader_ShowsTheDocumentedLayout()
    {
        ExternalTools.Require(ExternalTools.HasH5Dump, ExternalTools.H5Dump);
        using var dir = TestTables.TempDir();
        string path = dir.File("dump.h5");
        Hdf5PointWriter.Write(TestTables.Make(33), path);

        // Reference reader: h5dump from the HDF5 C library (Debian hdf5-tools).
        var (code, stdout, stderr) = ExternalTools.Run(ExternalTools.H5Dump, ["-H", path]);
        Assert.True(code == 0, "h5dump failed: " + stderr);
        foreach (string name in new[] { "position", "mass", "target_density", "layer", "id", "cell_volume", "velocity" })
            Assert.Contains($"DATASET \"{name}\"", stdout, StringComparison.Ordinal);
        Assert.Contains("DATASPACE  SIMPLE { ( 33, 3 ) / ( 33, 3 ) }", stdout, StringComparison.Ordinal);
        Assert.Contains("DATASPACE  SIMPLE { ( 33 ) / ( 33 ) }", stdout, StringComparison.Ordinal);
        Assert.Contains("H5T_IEEE_F64LE", stdout, StringComparison.Ordinal);
        Assert.Contains("H5T_STD_I32LE", stdout, StringComparison.Ordinal);
        Assert.Contains("H5T_STD_I64LE", stdout, StringComparison.Ordinal);
        Assert.Contains("H5T_STD_U64LE", stdout, StringComparison.Ordinal);
        foreach (string attribute in new[] { "format", "format_version", "point_count", "unit_system", "length_unit_in_cm", "sampler", "parameters", "seed", "profile_fingerprint", "library_version", "units", "cgs_factor" })
            Assert.Contains($"ATTRIBUTE \"{attribute}\"", stdout, StringComparison.Ordinal);

        // A full dump of one attribute shows the value as the C library decodes it.
        var (code2, value, _) = ExternalTools.Run(ExternalTools.H5Dump, ["-a", "/format", path]);
        Assert.Equal(0, code2);
        Assert.Contains("\"placement-points\"", value, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_RejectsAFileThatIsNotHdf5()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("text.h5");
        File.WriteAllText(path, "x,y,z\n1,2,3\n");
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains("not an HDF5 file", e.Message, StringComparison.Ordinal);
        Assert.Contains(path, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_RejectsAnHdf5FileThatIsNotOurs()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("foreign.h5");
        new H5File { ["data"] = new H5Dataset(new double[] { 1, 2, 3 }) }.Write(path);
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains("not a Placement point file", e.Message, StringComparison.Ordinal);

        var other = new H5File { ["data"] = new H5Dataset(new double[] { 1 }) };
        other.Attributes["format"] = "someone-else";
        string path2 = dir.File("foreign2.h5");
        other.Write(path2);
        e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path2));
        Assert.Contains("'someone-else'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_NamesAMissingDataset()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("missing.h5");
        var file = OurRootWith(4);
        var group = (H5Group)file["points"];
        group.Remove("mass");
        file.Write(path);
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains("missing dataset '/points/mass'", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("position", 7, "'/points/position' row 2, column y: NaN is not a finite coordinate")]
    [InlineData("mass", 2, "'/points/mass' row 2: -1 is not a finite mass ≥ 0")]
    public void Hdf5_Reader_NamesANonFiniteCoordinateOrANegativeMass(string column, int flatIndex, string expected)
    {
        // A NaN coordinate used to surface only as a tessellation error about a sphere of radius NaN.
        using var dir = TestTables.TempDir();
        string path = dir.File("bad-value.h5");
        var file = OurRootWith(4);
        var group = (H5Group)file["points"];
        var old = (H5Dataset)group[column];
        var data = column == "position" ? Enumerable.Range(0, 12).Select(i => 0.1 * i).ToArray() : [1.0, 1.0, 1.0, 1.0];
        data[flatIndex] = column == "position" ? double.NaN : -1.0;
        var copy = new H5Dataset(data, fileDims: column == "position" ? [4UL, 3UL] : [4UL]);
        foreach (var attribute in old.Attributes) copy.Attributes[attribute.Key] = attribute.Value;
        group[column] = copy;
        file.Write(path);
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains(expected, e.Message, StringComparison.Ordinal);
        Assert.Contains(path, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_RejectsADatasetOfTheWrongLength()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("short.h5");
        var file = OurRootWith(4);
        ((H5Group)file["points"])["target_density"] = new H5Dataset(new double[3]);
        file.Write(path);
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains("'/points/target_density' has shape (3); expected (4)", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_RejectsAnExtraColumnWithoutUnitsAndANewerVersion()
    {
        using var dir = TestTables.TempDir();
        var file = OurRootWith(4);
        ((H5Group)file["points"])["sph_density"] = new H5Dataset(new double[4]);
        string path = dir.File("nounits.h5");
        file.Write(path);
        var e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path));
        Assert.Contains("missing attribute 'units' on '/points/sph_density'", e.Message, StringComparison.Ordinal);

        var newer = OurRootWith(4);
        newer.Attributes["format_version"] = Hdf5Layout.FormatVersion + 1;
        string path2 = dir.File("newer.h5");
        newer.Write(path2);
        e = Assert.Throws<PointFileFormatException>(() => Hdf5PointReader.Read(path2));
        Assert.Contains("not supported", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hdf5_Reader_MissingFile_ThrowsFileNotFound()
    {
        using var dir = TestTables.TempDir();
        Assert.Throws<FileNotFoundException>(() => Hdf5PointReader.Read(dir.File("nope.h5")));
    }

    private static double[] Doubles(JsonElement root, string name) =>
        root.GetProperty(name).GetProperty("data").EnumerateArray().Select(e => e.GetDouble()).ToArray();

    /// <summary>An in-memory copy of a valid file's object tree (written by our writer, re-built here so tests can break it).</summary>
    private static H5File OurRootWith(int n)
    {
        var table = TestTables.Make(n);
        using var memory = new MemoryStream();
        Hdf5PointWriter.WriteTo(table, memory);
        memory.Position = 0;
        using var read = H5File.Open(memory, leaveOpen: true);
        var file = new H5File();
        foreach (var attribute in read.Attributes()) file.Attributes[attribute.Name] = ReadAttribute(attribute);
        var group = new H5Group();
        foreach (var child in read.Group("points").Children())
        {
            var dataset = (IH5Dataset)child;
            var dims = dataset.Space.Dimensions;
            object data = dataset.Type.Class == H5DataTypeClass.FloatingPoint ? dataset.Read<double[]>()
                : dataset.Type.Size == 4 ? dataset.Read<int[]>() : dataset.Read<long[]>();
            var copy = new H5Dataset(data, fileDims: dims);
            foreach (var attribute in dataset.Attributes()) copy.Attributes[attribute.Name] = ReadAttribute(attribute);
            group[child.Name] = copy;
        }
        file["points"] = group;
        return file;
    }

    private static object ReadAttribute(IH5Attribute attribute) => attribute.Type.Class switch
    {
        H5DataTypeClass.FloatingPoint => attribute.Read<double>(),
        H5DataTypeClass.FixedPoint when attribute.Type.Size == 4 => attribute.Read<int>(),
        H5DataTypeClass.FixedPoint => attribute.Read<ulong>(),
        _ => attribute.Read<string>(),
    };
}
