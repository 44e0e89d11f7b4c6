using System.Text.Json;
using Placement.Commands;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Commands.Tests;

/// <summary><c>--replace-core</c> and <c>--write-profile</c> end to end, in a temporary directory per test.</summary>
public sealed class CoreReplacementCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("placement-core").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string PathOf(string name) => Path.Combine(_dir, name);

    [Fact]
    public void Inspect_ReplaceCore_ReportsCoreMassResidualsAndGasMass_InJson()
    {
        var (code, output, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3,mass=1,radius=1", "--replace-core", "radius=0.2,index=1.5", "--json");
        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        var rep = doc.RootElement.GetProperty("coreReplacement");
        double core = rep.GetProperty("coreMass").GetDouble();
        // A stiffer (n = 1.5) gas inside 0.2 R of an n = 3 polytrope needs a core (library tests: m_c ≈ 0.0202).
        Assert.InRange(core, 0.01, 0.03);
        Assert.True(rep.GetProperty("densityMismatch").GetDouble() < 1e-10);
        Assert.True(rep.GetProperty("massMismatch").GetDouble() < 1e-10);
        Assert.True(rep.GetProperty("hydrostaticInside").GetProperty("max").GetDouble() < 1e-6);
        Assert.Equal("core", rep.GetProperty("core").GetProperty("name").GetString());
        // The summary describes the gas: gas + core = the polytrope's mass.
        Assert.Equal(1.0, doc.RootElement.GetProperty("totalMass").GetDouble() + core, 1e-12);
    }

    [Fact]
    public void Inspect_WriteProfile_WritesAReadableTable_AndNeverOverwritesUnasked()
    {
        string table = PathOf("gas.txt");
        var (code, output, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--replace-core", "radius=0.2,softening-ratio=0.5,index=2", "--write-profile", table);
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("core replacement: cut r_c = 0.2", output);
        Assert.Contains("softening h = 0.1", output);
        var gas = ProfileTableReader.Read(table, new ProfileTableOptions { TargetUnits = UnitSystem.Solar });
        var direct = CoreReplacement.Apply(new Polytrope(3, 1, 1, UnitSystem.Solar), new CoreReplacementOptions(0.2) { Index = 2, SofteningRatio = 0.5 });
        // 2000 rows re-interpolated by the reader: the gas mass agrees to ~1e-8 (PCHIP of the written rows; 1e-6 allowed).
        Assert.Equal(direct.TotalMass, gas.TotalMass, 1e-6 * direct.TotalMass);
        Assert.Equal(direct.Density(0.1), gas.Density(0.1), 1e-6 * direct.Density(0.1));
        Assert.Contains("core mass m_c", File.ReadAllText(table));

        string before = File.ReadAllText(table);
        (code, _, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--replace-core", "radius=0.3", "--write-profile", table);
        Assert.Equal(ExitCodes.OutputRefused, code);
        Assert.Contains("gas.txt", error);
        Assert.Equal(before, File.ReadAllText(table));
        (code, _, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--replace-core", "radius=0.3", "--write-profile", table, "--overwrite", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.NotEqual(before, File.ReadAllText(table));
        Assert.Single(Directory.GetFiles(_dir)); // no temporary file left behind
    }

    [Fact]
    public void Place_ReplaceCore_PlacesTheGasOnly_AndReportsTheCore()
    {
        string h5 = PathOf("gas.h5");
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=3", "--replace-core", "radius=0.2,index=1.5", "-n", "3000", "-o", h5, "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        double core = root.GetProperty("coreReplacement").GetProperty("coreMass").GetDouble();
        Assert.Equal(1.0 - core, root.GetProperty("profileMass").GetDouble(), 1e-12);
        Assert.Equal(1.0 - core, root.GetProperty("totalMass").GetDouble(), 1e-10);
        Assert.True(File.Exists(h5));

        // Checking the points against the same replaced profile: HEALPix shells hold exact shell masses, so the enclosed
        // mass at every shell agrees to rounding (1e-10 allowed).
        (code, output, error) = CliRunner.Run("check", "--points", h5, "-p", "polytrope:n=3", "--replace-core", "radius=0.2,index=1.5", "--no-baseline", "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using (var check = JsonDocument.Parse(output))
            Assert.True(check.RootElement.GetProperty("enclosedMass").GetProperty("maxRelativeError").GetDouble() < 1e-10);

        (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=3", "--replace-core", "radius=0.2,index=1.5", "-n", "3000", "-o", PathOf("b.h5"));
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("core mass m_c = 0.0201", output);
        Assert.Contains("hydrostatic residual", output);
    }

    [Theory]
    [InlineData("radius=2", "outside the body")]
    [InlineData("radius=0.2,index=4", "n = 4")]
    [InlineData("radius=0.2,softening=0.3", "0.3")]
    [InlineData("radius=0.2,index=abc", "index=abc")]
    [InlineData("softening=0.1", "radius=<number>")]
    [InlineData("radius=0.2,softening=0.1,softening-ratio=0.5", "not both")]
    public void BadReplaceCore_GivesUsageExitCode_NamingTheProblem(string spec, string mentioned)
    {
        var (code, _, error) = CliRunner.Run("place", "-p", "polytrope:n=3", "--replace-core", spec, "-n", "100", "-o", PathOf("x.h5"));
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(mentioned, error);
        Assert.False(File.Exists(PathOf("x.h5")));
    }

    [Fact]
    public void ReplaceCore_OnATableWithoutPressure_OrCutInsideItsFirstRow_IsRefused()
    {
        // Invented table (not a real star): starts at r = 0.05 with no pressure column, then the same with one.
        string bare = PathOf("bare.txt"), withP = PathOf("withp.txt");
        File.WriteAllText(bare, "# invented\nr[R_sun] rho[M_sun/R_sun^3]\n0.05 10\n0.2 3\n0.6 0.5\n1.0 0\n");
        var (code, _, error) = CliRunner.Run("inspect", "-p", bare, "--replace-core", "radius=0.3");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("no pressure", error);

        File.WriteAllText(withP, "# invented\nr[R_sun] rho[M_sun/R_sun^3] P[M_sun/R_sun/t_dyn_sun^2]\n0.05 10 5\n0.2 3 2\n0.6 0.5 0.1\n1.0 0 0\n");
        (code, _, error) = CliRunner.Run("inspect", "-p", withP, "--replace-core", "radius=0.01");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("innermost", error);
        Assert.Contains("0.05", error);
    }

    [Fact]
    public void Place_ReplaceCore_StartsTheResolutionWindowAtTheSofteningLength_UnlessToldOtherwise()
    {
        // Item 6: points needed outside the softened core — inside h the core's gravity is not Newtonian.
        double Inner(params string[] extra)
        {
            string[] args = ["place", "-p", "polytrope:n=3", "-n", "3000", "--replace-core", "radius=0.2,softening=0.15,index=1.5",
                "--resolution-threshold", "3", "-o", Path.Combine(_dir, $"w{extra.Length}.h5"), "--json", "--quiet", .. extra];
            var (code, output, error) = CliRunner.Run(args);
            Assert.True(code == ExitCodes.Ok, error);
            using var doc = System.Text.Json.JsonDocument.Parse(output);
            return doc.RootElement.GetProperty("body").GetProperty("resolution").GetProperty("innerRadius").GetDouble();
        }
        Assert.Equal(0.15, Inner());
        Assert.Equal(0.05, Inner("--inner-radius", "0.05"));
    }
}
