using System.Text.Json;
using Placement.Commands;
using Placement.IO;
using Placement.Quality;

namespace Placement.Commands.Tests;

/// <summary>place with thermodynamics, resolution and energy options, end to end, in a temporary directory per test.</summary>
public sealed class BodyOptionsTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("placement-body").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string PathOf(string name) => Path.Combine(_dir, name);

    [Fact]
    public void Place_WithGammaEnergyAndResolution_WritesColumnsWithUnits_AndBodyValues()
    {
        string h5 = PathOf("poly.h5");
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "4000", "-o", h5, "--gamma", "1.6666666666666667",
            "--energy", "--resolution-threshold", "8", "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = PointFiles.Read(h5);
        var u = table.Find(PointColumnNames.InternalEnergy)!;
        var p = table.Find(PointColumnNames.Pressure)!;
        Assert.Equal("R_sun^2/t_dyn_sun^2", u.Unit);
        Assert.Equal("M_sun*R_sun^-1*t_dyn_sun^-2", p.Unit);
        Assert.NotNull(table.Find(PointColumnNames.SphDensity));
        for (int i = 0; i < table.Count; i += 37)
        {
            // density+pressure with an ideal gas: u = P(r) / ((γ − 1) ρ(r)) at the point's radius.
            double expected = p.Components[0][i] / ((2.0 / 3.0) * table.Points.TargetDensity[i]);
            Assert.Equal(expected, u.Components[0][i], 1e-9 * expected);
        }
        var scalars = table.BodyScalars.ToDictionary(s => s.Name);
        Assert.Equal(5.0 / 3.0, scalars[BodyNames.Gamma].Value, 15);
        Assert.Equal("1", scalars[BodyNames.Gamma].Unit);
        Assert.Equal("density+pressure", table.BodyLabels[BodyNames.Match]);
        Assert.Equal("ideal-gas", table.BodyLabels[BodyNames.EnergySource]);
        Assert.Equal("sph", table.BodyLabels[BodyNames.PointDensity]);
        // W = −3GM²/((5 − n)R) = −6/7 for n = 1.5, M = R = G = 1 (Chandrasekhar 1939, standard textbook result); the points
        // leave out their self-energy (0.1–0.2 % here), so allow 1 %.
        var w = scalars[BodyNames.PointsGravitationalEnergy];
        Assert.Equal(-6.0 / 7.0, w.Value, 0.01 * 6 / 7);
        Assert.Equal("M_sun R_sun^2/t_dyn_sun^2", w.Unit);
        Assert.Equal(8, scalars[BodyNames.ResolutionThreshold].Value);
        Assert.True(scalars[BodyNames.PointsNeeded].Value > 4000, "8 cells per H_P need more than 4000 points on an n = 1.5 polytrope");
        using var doc = JsonDocument.Parse(output);
        var body = doc.RootElement.GetProperty("body");
        Assert.Equal(-6.0 / 7.0, body.GetProperty("energy").GetProperty("profile").GetProperty("gravitational").GetDouble(), 1e-4);
        Assert.Equal(1.0, body.GetProperty("energy").GetProperty("profile").GetProperty("virialRatio").GetDouble(), 1e-4);
        Assert.Equal(8, body.GetProperty("resolution").GetProperty("threshold").GetDouble());
    }

    [Fact]
    public void Place_DensityEntropy_AddsABodySectionToTheQualityReport_ThatOldReadersStillRead()
    {
        string h5 = PathOf("entropy.h5"), report = PathOf("report.json");
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=3", "-n", "3000", "-o", h5, "--gamma", "1.4", "--match", "density+entropy",
            "--report", report, "--no-baseline");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("density+entropy", output);
        Assert.Contains("rms deviation", output);
        string json = File.ReadAllText(report);
        var quality = QualityJson.Deserialize(json); // the existing reader ignores the new property
        Assert.Equal(3000, quality.PointCount);
        using var doc = JsonDocument.Parse(json);
        Assert.True(doc.RootElement.TryGetProperty("logRatio", out _));
        var thermo = doc.RootElement.GetProperty("body").GetProperty("thermodynamics");
        Assert.Equal("density+entropy", thermo.GetProperty("match").GetString());
        Assert.True(thermo.GetProperty("entropyDeviation").GetProperty("max").GetDouble() < 1e-12);
        Assert.True(thermo.GetProperty("pressureDeviation").GetProperty("rms").GetDouble() > 1e-4);
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("body").GetProperty("energy").ValueKind);
    }

    [Fact]
    public void Place_MeshModeWithRotation_UsesVoronoiDensities_AndReportsTheKineticEnergy_WithoutAQualityCheck()
    {
        string h5 = PathOf("mesh.h5"), report = PathOf("body.json");
        var (code, _, error) = CliRunner.Run("place", "-p", "polytrope:n=1", "-n", "3000", "--mode", "mesh", "--rotation", "breakup=0.3",
            "--gamma", "2", "--energy", "--opening-angle", "0", "--report", report, "--no-check", "-o", h5, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = PointFiles.Read(h5);
        Assert.Equal("voronoi", table.BodyLabels[BodyNames.PointDensity]);
        Assert.Single(table.Columns, c => c.Name == PointColumnNames.CellVolume);
        Assert.Null(table.Find(PointColumnNames.SphDensity));
        using var doc = JsonDocument.Parse(File.ReadAllText(report));
        Assert.False(doc.RootElement.TryGetProperty("logRatio", out _)); // --no-check: the body section only
        var energy = doc.RootElement.GetProperty("body").GetProperty("energy");
        Assert.Equal(0, energy.GetProperty("openingAngle").GetDouble());
        // Points rotate rigidly at Ω: their ½ Σ m v² against (1/3)∫Ω² r² dm, within the shell discreteness (~1 %).
        Assert.Equal(0.0, energy.GetProperty("kineticDeviation").GetDouble(), 0.02);
        Assert.True(energy.GetProperty("points").GetProperty("kinetic").GetDouble() > 0);
    }

    [Fact]
    public void Place_WithTheTablesOwnInternalEnergy_UsesIt_AndInspectShowsBothThermalEnergies()
    {
        // An INVENTED cgs table: an n = 1 polytrope shape (ρ = ρc sin x / x, P = Kρ²) with u = 1.1 P/(0.4 ρ), i.e. an
        // equation of state 10 % off the γ = 1.4 ideal gas, so the two sources must differ by exactly that factor.
        string table = PathOf("invented.txt");
        var lines = new List<string> { "# invented table, not a real star", "r[cm] rho[g/cm^3] P[dyn/cm^2] eint[erg/g] T[K]" };
        const double radius = 7e10, rhoC = 5, k = 4e14;
        for (int i = 0; i <= 400; i++)
        {
            double r = radius * i / 400, x = Math.PI * i / 400, rho = i == 0 ? rhoC : i == 400 ? 0 : rhoC * Math.Sin(x) / x;
            double p = k * rho * rho, e = rho > 0 ? 1.1 * p / (0.4 * rho) : 0;
            lines.Add(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{r:R} {rho:R} {p:R} {e:R} {1e7 * rho / rhoC + 1e4:R}"));
        }
        File.WriteAllLines(table, lines);
        string h5 = PathOf("table.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", table, "--units", "cgs", "-n", "2000", "-o", h5, "--gamma", "1.4",
            "--energy-source", "profile:eint", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var points = PointFiles.Read(h5);
        Assert.Equal("profile:eint", points.BodyLabels[BodyNames.EnergySource]);
        var u = points.Find(PointColumnNames.InternalEnergy)!;
        var pressure = points.Find(PointColumnNames.Pressure)!;
        var temperature = points.Find(PointColumnNames.Temperature)!;
        Assert.Equal("cm^2/s^2", u.Unit);
        Assert.Equal("K", temperature.Unit);
        Assert.NotNull(points.Find("eint"));
        for (int i = 0; i < points.Count; i += 41)
        {
            double ideal = pressure.Components[0][i] / (0.4 * points.Points.TargetDensity[i]);
            // Both columns are interpolated from the same table rows (monotone cubics): the ratio holds to 1e-3.
            Assert.Equal(1.1, u.Components[0][i] / ideal, 1e-3);
        }
        var (inspectCode, output, inspectError) = CliRunner.Run("inspect", "-p", table, "--units", "cgs", "--gamma", "1.4", "--json");
        Assert.True(inspectCode == ExitCodes.Ok, inspectError);
        using var doc = JsonDocument.Parse(output);
        double idealGas = doc.RootElement.GetProperty("thermalEnergy").GetDouble();
        Assert.Equal("eint", doc.RootElement.GetProperty("internalEnergyQuantity").GetString());
        Assert.Equal(1.1, doc.RootElement.GetProperty("thermalEnergyFromTable").GetDouble() / idealGas, 1e-3);
    }

    [Fact]
    public void Inspect_Polytrope_ShowsTheThermalEnergyOfTheVirialTheorem()
    {
        // 3(γ − 1)U = −W (virial theorem) with W = −3GM²/((5 − n)R) = −1.5 for n = 3 (Chandrasekhar 1939): U = 0.75 at γ = 5/3.
        var (code, output, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--json");
        Assert.True(code == ExitCodes.Ok, error);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(0.75, doc.RootElement.GetProperty("thermalEnergy").GetDouble(), 1e-4);
        (code, output, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains("thermal energy", output);
        (code, _, error) = CliRunner.Run("inspect", "-p", "polytrope:n=3", "--gamma", "0.5");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--gamma", error);
    }

    [Theory]
    [InlineData("polytrope:n=1.5", "--gamma=1", "--gamma")]
    [InlineData("uniform:mass=1,radius=1", "--gamma=1.4", "pressure")]
    [InlineData("polytrope:n=1.5", "--gamma=1.4 --match=density+temperature", "--match")]
    [InlineData("polytrope:n=1.5", "--gamma=1.4 --energy-source=profile", "specific-energy")]
    [InlineData("polytrope:n=1.5", "--match=density+entropy", "--gamma")]
    [InlineData("polytrope:n=1.5", "--energy --opening-angle=2", "--opening-angle")]
    [InlineData("polytrope:n=1.5", "--resolution-threshold=-1", "--resolution-threshold")]
    [InlineData("polytrope:n=1.5", "--resolution --inner-radius=5", "--inner-radius")]
    [InlineData("uniform:mass=1,radius=1", "--resolution", "pressure")]
    [InlineData("polytrope:n=1.5", "--no-check --report=r.json", "--no-check")]
    [InlineData("polytrope:n=1.5", "--gamma=1.4 --point-density=kde", "--point-density")]
    public void BadBodyOptions_GiveUsageExitCode_AndWriteNothing(string profile, string options, string mentioned)
    {
        string h5 = PathOf("bad.h5");
        var args = new List<string> { "place", "-p", profile, "-n", "200", "-o", h5 };
        foreach (string o in options.Split(' ')) args.AddRange(o.Split('=', 2));
        var (code, _, error) = CliRunner.Run([.. args]);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(mentioned, error);
        Assert.Empty(Directory.GetFiles(_dir));
    }
}
