using System.Text.Json;
using Placement.Bodies.Background;
using Placement.IO;
using Placement.IO.Csv;
using Placement.IO.Hdf5;

namespace Placement.Tests.IO;

public class BackgroundFileTests
{
    private static readonly BackgroundBox Box = new(-5, -4.5, -4, 5, 5.5, 6, true, 1e-6, 2.5e-9);

    [H5pyFact]
    public void Hdf5_BackgroundGroup_IsReadByH5py_AndReadBackExactly()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(20);
        table.Background = Box;
        string path = dir.File("bg.h5");
        Hdf5PointWriter.Write(table, path);
        Assert.Equal(Box, Hdf5PointReader.Read(path).Background);

        // Reference reader: h5py (Debian python3-h5py).
        const string script = """
import h5py, json, sys
a = h5py.File(sys.argv[1], 'r')['background'].attrs
print(json.dumps({'box_min': a['box_min'].tolist(), 'box_max': a['box_max'].tolist(), 'periodic': int(a['periodic']),
                  'density': float(a['density']), 'pressure': float(a['pressure']), 'layer': int(a['layer']),
                  'density_units': a['density_units'], 'pressure_units': a['pressure_units']}))
""";
        var (code, stdout, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, path]);
        Assert.True(code == 0, "h5py failed: " + stderr);
        using var json = JsonDocument.Parse(stdout);
        var root = json.RootElement;
        Assert.Equal([-5.0, -4.5, -4], root.GetProperty("box_min").EnumerateArray().Select(e => e.GetDouble()));
        Assert.Equal([5.0, 5.5, 6], root.GetProperty("box_max").EnumerateArray().Select(e => e.GetDouble()));
        Assert.Equal(1, root.GetProperty("periodic").GetInt32());
        Assert.Equal(-2, root.GetProperty("layer").GetInt32());
        Assert.Equal(2.5e-9, root.GetProperty("pressure").GetDouble());
        Assert.Equal("M_sun/R_sun^3", root.GetProperty("density_units").GetString());
        Assert.Equal("M_sun/(R_sun t_dyn_sun^2)", root.GetProperty("pressure_units").GetString());
    }

    [Fact]
    public void Csv_Background_IsOneHeaderCommentLine()
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(3);
        table.Background = Box;
        string path = dir.File("bg.csv");
        CsvPointWriter.Write(table, path);
        var line = Assert.Single(File.ReadLines(path), l => l.StartsWith("# background: ", StringComparison.Ordinal));
        Assert.Contains("box [-5, 5] x [-4.5, 5.5] x [-4, 6] R_sun, periodic yes, density 1E-06", line, StringComparison.Ordinal);
        Assert.Contains("layer -2", line, StringComparison.Ordinal);
    }
}
