using System.Globalization;
using Placement.IO;
using Placement.IO.Csv;
using Placement.Parallelism;

namespace Placement.Tests.IO;

public class CsvPointFileTests
{
    [Fact]
    public void Csv_HasProvenanceComments_HeaderWithUnits_AndRowsThatParseBackExactly()
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(500);
        string path = dir.File("points.csv");
        CsvPointWriter.Write(table, path);

        string[] lines = File.ReadAllLines(path);
        var comments = lines.TakeWhile(l => l.StartsWith('#')).ToArray();
        Assert.Contains("# format: placement-points-csv", comments);
        Assert.Contains("# unit_system: solar", comments);
        Assert.Contains("# sampler: test-sampler", comments);
        Assert.Contains("# seed: 18364758544493064720", comments);
        Assert.Contains("# profile_fingerprint: sha256:0123abcd", comments);
        Assert.Contains(comments, c => c.StartsWith("# parameters: {", StringComparison.Ordinal) && c.Contains("\"nside\":\"8\"", StringComparison.Ordinal));
        Assert.Contains(comments, c => c.StartsWith("# length_unit: R_sun = 69570000000 cm", StringComparison.Ordinal));

        string header = lines[comments.Length];
        Assert.Equal(
            "id [1],x [R_sun],y [R_sun],z [R_sun],mass [M_sun],target_density [M_sun/R_sun^3],layer [1],cell_volume [R_sun^3],velocity_x [R_sun/t_dyn_sun],velocity_y [R_sun/t_dyn_sun],velocity_z [R_sun/t_dyn_sun]",
            header);
        var rows = lines.Skip(comments.Length + 1).ToArray();
        Assert.Equal(500, rows.Length);
        var p = table.Points;
        var volume = table.Find("cell_volume")!.Components[0];
        var velocity = table.Find("velocity")!.Components;
        for (int i = 0; i < rows.Length; i++)
        {
            string[] cells = rows[i].Split(',');
            Assert.Equal(11, cells.Length);
            double D(int k) => double.Parse(cells[k], CultureInfo.InvariantCulture);
            Assert.Equal(i, long.Parse(cells[0], CultureInfo.InvariantCulture));
            // Shortest round-trip formatting: parsing gives back the same double exactly.
            Assert.Equal(p.X[i], D(1));
            Assert.Equal(p.Y[i], D(2));
            Assert.Equal(p.Z[i], D(3));
            Assert.Equal(p.Mass[i], D(4));
            Assert.Equal(p.TargetDensity[i], D(5));
            Assert.Equal(p.Layer[i], int.Parse(cells[6], CultureInfo.InvariantCulture));
            Assert.Equal(volume[i], D(7));
            Assert.Equal(velocity[0][i], D(8));
            Assert.Equal(velocity[2][i], D(10));
        }
    }

    [Fact]
    public void Csv_BytesAreIdenticalOnOneAndTwoThreads_AcrossWindowAndChunkBoundaries()
    {
        var table = TestTables.Make(20_011);
        byte[] Run(int threads, int window, int chunk)
        {
            using var memory = new MemoryStream();
            CsvPointWriter.WriteTo(table, memory, new ParallelSettings { MaxDegreeOfParallelism = threads, MinimumChunk = chunk }, window);
            return memory.ToArray();
        }
        byte[] reference = Run(1, 1 << 18, 8192);
        // Windows of 5000 rows and chunks of 700 rows split the rows differently; the bytes must not change.
        Assert.Equal(reference, Run(2, 5000, 700));
        Assert.Equal(reference, Run(2, 1 << 18, 8192));
        Assert.Equal(20_011 + 14, System.Text.Encoding.UTF8.GetString(reference).Count(c => c == '\n'));
    }

    [Fact]
    public void Csv_IsIndependentOfTheCurrentCulture()
    {
        using var dir = TestTables.TempDir();
        var previous = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = new CultureInfo("de-DE");
            CsvPointWriter.Write(TestTables.Make(5), dir.File("de.csv"));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
        var row = File.ReadAllLines(dir.File("de.csv")).First(l => !l.StartsWith('#') && !l.StartsWith("id", StringComparison.Ordinal));
        Assert.Equal(11, row.Split(',').Length);
    }
}
