using System.Globalization;
using System.Runtime.InteropServices;
using System.Xml.Linq;
using Placement.IO;
using Placement.IO.Vtk;

namespace Placement.Tests.IO;

public class VtkPointFileTests
{
    [Theory]
    [InlineData(VtkEncoding.Base64Binary, 1000)]
    [InlineData(VtkEncoding.Ascii, 1000)]
    [InlineData(VtkEncoding.Base64Binary, 4097)]
    [InlineData(VtkEncoding.Base64Binary, 0)]
    public void Vtu_IsWellFormedXml_WithRightCountsAndExactArrays(VtkEncoding encoding, int n)
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(n);
        string path = dir.File("points.vtu");
        VtkPointWriter.Write(table, path, encoding: encoding);

        // XDocument.Load throws on any XML well-formedness error (System.Xml, XML 1.0).
        var doc = XDocument.Load(path);
        var file = doc.Root!;
        Assert.Equal("VTKFile", file.Name.LocalName);
        Assert.Equal("UnstructuredGrid", (string?)file.Attribute("type"));
        Assert.Equal("UInt64", (string?)file.Attribute("header_type"));
        var comment = doc.Nodes().OfType<XComment>().Single().Value;
        Assert.Contains("unit_system: solar", comment, StringComparison.Ordinal);
        Assert.Contains("cell_volume [R_sun^3]", comment, StringComparison.Ordinal);

        var piece = file.Element("UnstructuredGrid")!.Element("Piece")!;
        Assert.Equal(n, (int)piece.Attribute("NumberOfPoints")!);
        Assert.Equal(n, (int)piece.Attribute("NumberOfCells")!);

        var p = table.Points;
        var pointData = piece.Element("PointData")!.Elements("DataArray").ToDictionary(e => (string)e.Attribute("Name")!);
        Assert.Equal(["id", "mass", "target_density", "layer", "cell_volume", "velocity"], pointData.Keys);
        Assert.Equal(p.Mass, Decode<double>(pointData["mass"], encoding, n));
        Assert.Equal(p.TargetDensity, Decode<double>(pointData["target_density"], encoding, n));
        Assert.Equal(p.Layer, Decode<int>(pointData["layer"], encoding, n));
        Assert.Equal(Enumerable.Range(0, n).Select(i => (long)i), Decode<long>(pointData["id"], encoding, n));
        Assert.Equal(table.Find("cell_volume")!.Components[0], Decode<double>(pointData["cell_volume"], encoding, n));
        Assert.Equal("3", (string?)pointData["velocity"].Attribute("NumberOfComponents"));
        var velocity = Decode<double>(pointData["velocity"], encoding, 3 * n);
        var v = table.Find("velocity")!.Components;
        for (int i = 0; i < n; i++) Assert.Equal([v[0][i], v[1][i], v[2][i]], velocity[(3 * i)..(3 * i + 3)]);

        var points = piece.Element("Points")!.Element("DataArray")!;
        Assert.Equal("Float64", (string?)points.Attribute("type"));
        Assert.Equal("3", (string?)points.Attribute("NumberOfComponents"));
        var xyz = Decode<double>(points, encoding, 3 * n);
        for (int i = 0; i < n; i++) Assert.Equal([p.X[i], p.Y[i], p.Z[i]], xyz[(3 * i)..(3 * i + 3)]);

        var cells = piece.Element("Cells")!.Elements("DataArray").ToDictionary(e => (string)e.Attribute("Name")!);
        Assert.Equal(Enumerable.Range(0, n).Select(i => (long)i), Decode<long>(cells["connectivity"], encoding, n));
        Assert.Equal(Enumerable.Range(1, n).Select(i => (long)i), Decode<long>(cells["offsets"], encoding, n));
        // VTK_VERTEX = 1 (VTK file-format documentation, cell types).
        Assert.All(Decode<byte>(cells["types"], encoding, n), t => Assert.Equal(1, t));
    }

    [Fact]
    public void Vtu_CommentNeverContainsDoubleHyphen_EvenWhenProvenanceDoes()
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(3);
        table.Points.Provenance = table.Points.Provenance with { Sampler = "a--b--->c" };
        string path = dir.File("hyphen.vtu");
        VtkPointWriter.Write(table, path);
        var doc = XDocument.Load(path);
        Assert.Contains("a- -b- - ->c", doc.Nodes().OfType<XComment>().Single().Value, StringComparison.Ordinal);
    }

    /// <summary>Decodes a DataArray: base64 of [UInt64 byte count][raw bytes] (VTK XML inline binary), or ASCII text.</summary>
    private static T[] Decode<T>(XElement array, VtkEncoding encoding, int expectedCount) where T : unmanaged, IParsable<T>
    {
        string text = array.Value.Trim();
        if (encoding == VtkEncoding.Ascii)
        {
            Assert.Equal("ascii", (string?)array.Attribute("format"));
            var values = text.Length == 0 ? [] : text.Split((char[])[' ', '\n'], StringSplitOptions.RemoveEmptyEntries)
                .Select(s => T.Parse(s, CultureInfo.InvariantCulture)).ToArray();
            Assert.Equal(expectedCount, values.Length);
            return values;
        }
        Assert.Equal("binary", (string?)array.Attribute("format"));
        byte[] bytes = Convert.FromBase64String(text);
        ulong declared = BitConverter.ToUInt64(bytes, 0);
        int size = Marshal.SizeOf<T>();
        Assert.Equal((ulong)(expectedCount * size), declared);
        Assert.Equal(8 + expectedCount * size, bytes.Length);
        return MemoryMarshal.Cast<byte, T>(bytes.AsSpan(8)).ToArray();
    }
}
