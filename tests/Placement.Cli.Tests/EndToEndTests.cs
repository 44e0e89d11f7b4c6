using System.Text.Json;
using Placement.Commands;

namespace Placement.Commands.Tests;

/// <summary>The whole job through the command line, in a temporary directory per test.</summary>
public sealed class EndToEndTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("placement-cli").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string PathOf(string name) => Path.Combine(_dir, name);

    [Fact]
    public void Place_TableStartingFarOffCentre_WarnsThatMostMassIsExtrapolated_AndStillPlaces()
    {
        // Invented envelope-only table, ρ ∝ r^-3 from 1e13 cm: its first slope is clamped to −2.5 and continued inward,
        // which puts about 46 % of the mass inside the first row. The user is told so; the run itself goes on.
        string table = Path.Combine(_dir, "invented-envelope-only.txt");
        var rows = Enumerable.Range(0, 91).Select(i => 1 + i / 10.0)
            .Select(x => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{x * 1e13:G17} {1e-10 * Math.Pow(x, -3):G17}"));
        File.WriteAllText(table, "# invented envelope-only table\nr[cm] rho[g/cm^3]\n" + string.Join("\n", rows) + "\n");
        string h5 = Path.Combine(_dir, "envelope-only.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", table, "--units", "cgs", "-n", "500", "-o", h5);
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("of the mass lies inside the table's first row (r = 1E+13 cm)", error);
        Assert.True(File.Exists(h5));
        var (quietCode, _, quietError) = CliRunner.Run("place", "-p", table, "--units", "cgs", "-n", "500", "-o", h5, "--overwrite", "-q");
        Assert.Equal(ExitCodes.Ok, quietCode);
        Assert.DoesNotContain("first row", quietError);
    }

    [Fact]
    public void Place_ThenCheck_RoundTripsThroughHdf5_AndWritesReportAndFigures()
    {
        string h5 = PathOf("p.h5"), report = PathOf("r.json"), figures = PathOf("figs");
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "4000", "-o", h5, "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using (var doc = JsonDocument.Parse(output))
        {
            Assert.Equal(4000, doc.RootElement.GetProperty("points").GetInt32());
            Assert.Equal("healpix-shells", doc.RootElement.GetProperty("sampler").GetString());
            Assert.Equal(1.0, doc.RootElement.GetProperty("totalMass").GetDouble(), 12);
        }
        (code, output, error) = CliRunner.Run("check", "--points", h5, "-p", "polytrope:n=1.5", "--report", report, "--plots", figures, "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using (var doc = JsonDocument.Parse(output))
        {
            Assert.Equal(4000, doc.RootElement.GetProperty("pointCount").GetInt32());
            double std = doc.RootElement.GetProperty("logRatio").GetProperty("standardDeviation").GetDouble();
            double baseline = doc.RootElement.GetProperty("baseline").GetProperty("logRatio").GetProperty("standardDeviation").GetDouble();
            // HEALPix shells must be quieter than the Poisson baseline (std ≈ 0.42 for Poisson-Voronoi cells, reference §9).
            Assert.True(std < baseline, $"healpix {std} vs poisson {baseline}");
        }
        Assert.True(File.Exists(report));
        foreach (string name in new[] { "density-profile", "enclosed-mass-error", "cell-volume-histogram", "slice" })
        {
            Assert.True(new FileInfo(Path.Combine(figures, name + ".png")).Length > 1000);
            Assert.Contains("<svg", File.ReadAllText(Path.Combine(figures, name + ".svg")));
        }
    }

    [Fact]
    public void Place_RefusesAnExistingOutput_AndLeavesItUntouched()
    {
        string h5 = PathOf("keep.h5");
        File.WriteAllText(h5, "precious");
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "100", "-o", h5);
        Assert.Equal(ExitCodes.OutputRefused, code);
        Assert.Contains("keep.h5", error);
        Assert.Equal("precious", File.ReadAllText(h5));
        Assert.Single(Directory.GetFiles(_dir));

        (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "100", "-o", h5, "--overwrite", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.NotEqual("precious", File.ReadAllText(h5));
    }

    [Fact]
    public void Place_WithPlotsPointingAtAFile_RefusesUpFront_AndWritesNothing()
    {
        // Found late, this once left the point file written and said only that "the file already exists".
        string blocker = PathOf("figures");
        File.WriteAllText(blocker, "a file, not a directory");
        string h5 = PathOf("points.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "100", "-o", h5, "--plots", blocker, "--overwrite");
        Assert.Equal(ExitCodes.OutputRefused, code);
        Assert.Contains("--plots", error);
        Assert.Contains("is a file", error);
        Assert.False(File.Exists(h5));
    }

    [Fact]
    public void UnknownOutputExtension_IsAUsageError_WithoutTheLibrarysParameterName()
    {
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "100", "-o", PathOf("points.foo"));
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("'.foo'", error);
        Assert.DoesNotContain("(Parameter", error);
    }

    [Fact]
    public void BadProfileTable_GivesBadInputExitCode_WithFileLineAndValue()
    {
        string table = PathOf("bad.txt");
        File.WriteAllText(table, "# invented table with a non-numeric cell\nr[cm] rho[g/cm^3]\n0 1\n1 abc\n2 0.1\n");
        var (code, _, error) = CliRunner.Run("place", "-p", table, "--units", "cgs", "-n", "10", "-o", PathOf("x.h5"));
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("bad.txt", error);
        Assert.Contains("abc", error);
        Assert.Contains("4", error); // line 4
        Assert.False(File.Exists(PathOf("x.h5")));
    }

    [Theory]
    [InlineData("--sampler", "no-such-sampler", "healpix-shells")]
    [InlineData("--param", "aspect=abc", "aspect")]
    [InlineData("--mode", "fluid", "fluid")]
    public void BadSamplerArguments_GiveUsageExitCode_NamingTheProblem(string option, string value, string mentioned)
    {
        var (code, _, error) = CliRunner.Run("place", "-p", "demo", "-n", "10", "-o", PathOf("y.h5"), option, value);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(mentioned, error);
        Assert.False(File.Exists(PathOf("y.h5")));
    }

    [Fact]
    public void Check_OnAFileThatIsNotOurs_GivesBadInput()
    {
        string notH5 = PathOf("not.h5");
        File.WriteAllText(notH5, "not an hdf5 file");
        var (code, _, error) = CliRunner.Run("check", "--points", notH5, "-p", "demo");
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("not.h5", error);
    }

    [Fact]
    public void Demo_WritesEveryOutput_AndRefusesToOverwriteThemOnASecondRun()
    {
        string dir = PathOf("demo");
        var (code, output, error) = CliRunner.Run("demo", "-o", dir, "-n", "3000", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("invented", output);
        foreach (string f in new[] { "demo-star.h5", "demo-star.vtu", "demo-star.report.json", "figures/slice.png" })
            Assert.True(File.Exists(Path.Combine(dir, f)), f);
        (code, _, error) = CliRunner.Run("demo", "-o", dir, "-n", "3000", "--quiet");
        Assert.Equal(ExitCodes.OutputRefused, code);
        Assert.Contains("--overwrite", error);

        // A file where the directory should be: a clear refusal (it used to be .NET's "the file already exists").
        string blocker = PathOf("demo-file");
        File.WriteAllText(blocker, "precious");
        (code, _, error) = CliRunner.Run("demo", "-o", blocker, "-n", "3000", "--quiet");
        Assert.Equal(ExitCodes.OutputRefused, code);
        Assert.Contains("is a file", error);
        Assert.Equal("precious", File.ReadAllText(blocker));
    }

    [Fact]
    public void Inspect_Polytrope_ReportsScaleHeightsAndPointsNeeded()
    {
        var (code, output, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--json", "--cells-per-scale-height", "5");
        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        var res = doc.RootElement.GetProperty("resolution");
        Assert.Equal("P", res.GetProperty("pressureQuantity").GetString());
        Assert.True(res.GetProperty("maxPointsNeeded").GetDouble() > 1000);
        // ρ_c/ρ̄ = 54.18 for n = 3 (Poisson & Will 2014, Table 2.1 via reference §8); mean density of a 1 M_sun, 1 R_sun body is 3/(4π).
        double central = doc.RootElement.GetProperty("centralDensity").GetDouble();
        Assert.Equal(54.18248, central / (3 / (4 * Math.PI)), 0.001);
    }

    [Fact]
    public void Compare_TabulatesEverySamplerAsked_AndShellsBeatPoisson()
    {
        var (code, output, error) = CliRunner.Run("compare", "-p", "plummer:mass=1,scale=0.3,radius=2", "-n", "3000",
            "--samplers", "healpix-shells,poisson", "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(2, doc.RootElement.GetArrayLength());
        var healpix = doc.RootElement[0];
        var poisson = doc.RootElement[1];
        Assert.Equal("healpix-shells", healpix.GetProperty("sampler").GetString());
        Assert.True(healpix.GetProperty("logRatioStd").GetDouble() < poisson.GetProperty("logRatioStd").GetDouble());
        Assert.True(healpix.GetProperty("sphRms").GetDouble() < poisson.GetProperty("sphRms").GetDouble());
    }

    [Fact]
    public void MeshMode_GivesEachPointItsCellMass_AndWritesCellVolumes()
    {
        string h5 = PathOf("mesh.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "plummer:mass=2,scale=0.3,radius=1.5", "-n", "3000", "--mode", "mesh", "-o", h5, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = Placement.IO.PointFiles.Read(h5);
        var volume = table.Find("cell_volume");
        Assert.NotNull(volume);
        // Cell masses are the profile mass of each cell: they sum to M inside the ball to ~1e-6 (tessellation notes).
        Assert.Equal(2.0, table.Points.TotalMass(), 1e-6);
        Assert.True(table.Points.Mass.Distinct().Count() > 100, "mesh masses should differ from cell to cell");
    }

    [Fact]
    public void Rotation_WritesAVelocityColumn_AtTheAskedFractionOfBreakUp()
    {
        string h5 = PathOf("spin.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "2000", "--rotation", "breakup=0.5", "-o", h5, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = Placement.IO.PointFiles.Read(h5);
        var v = table.Find("velocity");
        Assert.NotNull(v);
        // Ω = 0.5 √(GM/R³) = 0.5 in solar units (G = 1): |v| = Ω × cylindrical radius.
        var p = table.Points;
        for (int i = 0; i < p.Count; i += 50)
        {
            double speed = Math.Sqrt(v!.Components[0][i] * v.Components[0][i] + v.Components[1][i] * v.Components[1][i] + v.Components[2][i] * v.Components[2][i]);
            Assert.Equal(0.5 * Math.Sqrt(p.X[i] * p.X[i] + p.Y[i] * p.Y[i]), speed, 1e-12);
        }
        (code, _, error) = CliRunner.Run("place", "-p", "demo", "-n", "100", "--rotation", "fast", "-o", PathOf("bad.h5"));
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--rotation", error);
    }
}
