using System.Text.Json;
using Placement.Commands;

namespace Placement.Commands.Tests;

/// <summary>Velocity fields, companions and the background medium through <c>placement place</c>.</summary>
public sealed class BodyCliTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("placement-body-cli").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private string PathOf(string name) => Path.Combine(_dir, name);

    [Fact]
    public void RotationTable_GivesEveryPointOmegaOfItsRadiusTimesItsDistanceFromTheAxis()
    {
        // Invented linear law Omega = 0.4 − 0.2 r, tabulated in R_sun and 1/t_dyn_sun; PCHIP reproduces linear data exactly
        // (its slopes are the common secant), so the velocities can be checked to rounding.
        string omega = PathOf("omega.txt");
        File.WriteAllText(omega, "# invented rotation law\nradius [R_sun] omega [1/t_dyn_sun]\n0 0.4\n0.25 0.35\n0.5 0.3\n1 0.2\n");
        string h5 = PathOf("diff.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "3000", "--rotation", "table=" + omega, "-o", h5, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = Placement.IO.PointFiles.Read(h5);
        var v = table.Find("velocity")!;
        Assert.Contains("omega.txt", v.Description, StringComparison.Ordinal);
        var p = table.Points;
        for (int i = 0; i < p.Count; i += 7)
        {
            double w = 0.4 - 0.2 * p.Radius(i);
            Assert.Equal(w * -p.Y[i], v.Components[0][i], 1e-13);
            Assert.Equal(w * p.X[i], v.Components[1][i], 1e-13);
            Assert.Equal(0.0, v.Components[2][i]);
        }

        string bad = PathOf("bad-omega.txt");
        File.WriteAllText(bad, "radius [R_sun] omega [1/t_dyn_sun]\n0 0.4\n0.5 fast\n");
        (code, _, error) = CliRunner.Run("place", "-p", "demo", "-n", "100", "--rotation", "table=" + bad, "-o", PathOf("bad.h5"));
        Assert.Equal(ExitCodes.BadInput, code);
        Assert.Contains("bad-omega.txt:3", error, StringComparison.Ordinal);
        Assert.Contains("fast", error, StringComparison.Ordinal);
        Assert.False(File.Exists(PathOf("bad.h5")));
    }

    [Fact]
    public void CompanionAndBackground_AreWrittenReadBack_AndEverythingIsInTheCentreOfMassFrame()
    {
        string h5 = PathOf("binary.h5");
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "3000", "--rotation", "breakup=0.1",
            "--companion", "mass=0.5,separation=3,eccentricity=0.3,softening=0.05",
            "--background", "box=10,density=1e-5,pressure=1e-7,periodic", "-o", h5, "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using (var doc = JsonDocument.Parse(output))
        {
            var body = doc.RootElement.GetProperty("system");
            Assert.Equal("companion", body.GetProperty("pointMasses")[0].GetProperty("name").GetString());
            Assert.True(body.GetProperty("background").GetProperty("points").GetInt32() > 1000);
            Assert.True(body.GetProperty("residualOffset").GetDouble() < 1e-13);
        }
        var table = Placement.IO.PointFiles.Read(h5);
        var p = table.Points;
        var companion = Assert.Single(table.PointMasses);
        Assert.Equal(0.5, companion.Mass);
        Assert.Equal(0.05, companion.SofteningLength);
        Assert.NotNull(table.Background);
        Assert.True(table.Background!.Periodic);
        Assert.Equal(10.0, table.Background.MaxX - table.Background.MinX, 1e-12);

        // Σ m x and Σ m v over gas, background and companion vanish (read back from the file; rounding of positions up to
        // the box half-side 5 and of momenta ~ m v ~ 0.3: 1e-13 leaves a wide margin).
        var v = table.Find("velocity")!.Components;
        double m = 0, mx = 0, my = 0, px = 0, py = 0;
        int background = 0;
        for (int i = 0; i < p.Count; i++)
        {
            m += p.Mass[i]; mx += p.Mass[i] * p.X[i]; my += p.Mass[i] * p.Y[i];
            px += p.Mass[i] * v[0][i]; py += p.Mass[i] * v[1][i];
            if (p.Layer[i] == -2) background++;
        }
        m += companion.Mass; mx += companion.Mass * companion.X; my += companion.Mass * companion.Y;
        px += companion.Mass * companion.Vx; py += companion.Mass * companion.Vy;
        Assert.True(Math.Abs(mx / m) < 1e-13 && Math.Abs(my / m) < 1e-13, $"COM ({mx / m}, {my / m})");
        Assert.True(Math.Abs(px / m) < 1e-13 && Math.Abs(py / m) < 1e-13, $"momentum ({px / m}, {py / m})");
        Assert.Equal(p.Count - 3000, background);

        // Body centre: mass-weighted mean of the gas points (layer >= 0). It sits a(1+e) = 3.9 from the companion
        // (apastron, the default phase) and no background point lies within the body radius 1 of it.
        double bm = 0, bx = 0, by = 0, bz = 0;
        for (int i = 0; i < p.Count; i++)
            if (p.Layer[i] >= 0) { bm += p.Mass[i]; bx += p.Mass[i] * p.X[i]; by += p.Mass[i] * p.Y[i]; bz += p.Mass[i] * p.Z[i]; }
        bx /= bm; by /= bm; bz /= bm;
        Assert.Equal(3.9, Math.Sqrt((companion.X - bx) * (companion.X - bx) + (companion.Y - by) * (companion.Y - by)), 1e-3);
        for (int i = 0; i < p.Count; i++)
            if (p.Layer[i] == -2)
                Assert.True(Math.Sqrt((p.X[i] - bx) * (p.X[i] - bx) + (p.Y[i] - by) * (p.Y[i] - by) + (p.Z[i] - bz) * (p.Z[i] - bz)) > 1.0);
        Assert.Equal(1e-7, table.Find("pressure")!.Components[0][p.Count - 1]);
    }

    [Fact]
    public void MeshModeWithBackground_GivesEveryCellItsMass_AddingUpToBodyPlusMedium()
    {
        string h5 = PathOf("mesh-bg.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "2000", "--mode", "mesh",
            "--background", "box=4,density=0.01", "-o", h5, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        var table = Placement.IO.PointFiles.Read(h5);
        // M + ρ_bg (L³ − 4π/3 R³) (definition); cell quadrature leaves ~1e-6 relative (CellMasses documentation).
        double expected = 1 + 0.01 * (64 - 4.0 / 3.0 * Math.PI);
        Assert.Equal(expected, table.Points.TotalMass(), 1e-5 * expected);
        Assert.Equal(64.0, table.Find("cell_volume")!.Components[0].Sum(), 1e-9);
    }

    [Fact]
    public void CompanionInCsv_IsACommentRow()
    {
        string csv = PathOf("binary.csv");
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "500", "--companion", "mass=0.3,separation=4,name=bh", "-o", csv, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        Assert.Contains(File.ReadLines(csv), l => l.StartsWith("# point_mass: bh,0.3,0,", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("--companion", "mass=abc,separation=3", "mass=abc")]
    [InlineData("--companion", "mass=1,separation=3,eccentricity=1.2", "eccentricity=1.2")]
    [InlineData("--companion", "mass=1,separation=3,spin=2", "spin=2")]
    [InlineData("--companion", "mass=1", "separation")]
    [InlineData("--background", "box=10,density=-1", "density")]
    [InlineData("--background", "box=1.5,density=1e-3", "does not hold the body")]
    [InlineData("--background", "box=10,density=1e-3,walls", "walls")]
    public void BadBodyOptions_GiveUsageExitCode_NamingTheToken(string option, string value, string mentioned)
    {
        var (code, _, error) = CliRunner.Run("place", "-p", "uniform:mass=1,radius=1", "-n", "300", "-o", PathOf("no.h5"), option, value);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains(mentioned, error, StringComparison.Ordinal);
        Assert.False(File.Exists(PathOf("no.h5")));
    }

    [Fact]
    public void EveryBodyFeatureTogether_CoreCompanionMediumAndThermodynamics_LandInOneConsistentFile()
    {
        // Core replacement + thermodynamic columns + energy budget + companion + background medium in one run: the file
        // must hold the core and the companion, the body values, and background rows for every per-point column.
        string h5 = PathOf("system.h5");
        double rhoBg = 1e-5, pBg = 1e-7, gamma = 5.0 / 3.0;
        var (code, output, error) = CliRunner.Run("place", "-p", "polytrope:n=3", "-n", "4000", "--replace-core", "radius=0.2,index=1.5",
            "--gamma", "1.6666666666666667", "--energy", "--companion", "mass=0.3,separation=4",
            "--background", FormattableString.Invariant($"box=12,density={rhoBg},pressure={pBg}"), "-o", h5, "--json", "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        using (var doc = JsonDocument.Parse(output))
        {
            Assert.True(doc.RootElement.GetProperty("body").GetProperty("energy").GetProperty("points").GetProperty("corePotential").GetDouble() < 0);
            Assert.Equal(2, doc.RootElement.GetProperty("system").GetProperty("pointMasses").GetArrayLength());
        }
        var table = Placement.IO.PointFiles.Read(h5);
        Assert.Equal(["core", "companion"], table.PointMasses.Select(pm => pm.Name).ToArray());
        Assert.Contains(table.BodyScalars, s => s.Name == "gamma" && s.Value == 1.6666666666666667);
        Assert.Contains(table.BodyScalars, s => s.Name == "points_core_potential_energy" && s.Value < 0);
        var p = table.Points;
        var u = table.Find("internal_energy")!.Components[0];
        var sph = table.Find("sph_density")!.Components[0];
        var support = table.Find("smoothing_length")!.Components[0];
        int medium = 0;
        for (int i = 0; i < p.Count; i++)
        {
            Assert.True(double.IsFinite(u[i]) && u[i] > 0 && double.IsFinite(support[i]) && support[i] > 0, $"row {i}");
            if (p.Layer[i] != -2) continue;
            medium++;
            // Ideal gas at the medium's own state: u = P/((γ − 1) ρ).
            Assert.Equal(pBg / ((gamma - 1) * rhoBg), u[i], 1e-12 * u[i]);
            Assert.Equal(rhoBg, sph[i]);
        }
        Assert.True(medium > 1000, $"{medium} medium points");
    }

    [Fact]
    public void Check_OfAnEmbeddedBody_MeasuresTheBodyAloneAboutItsOwnCentre()
    {
        // The same seed placed alone and inside a binary with a medium: `check` must leave out the medium and undo the
        // centre-of-mass shift, so both files give the same quality figures, up to the rounding of the shift (~1e-16 R), which
        // can change which tangent planes bound a surface cell of the ball domain (within δ): measured 9e-8 relative; allow 1e-6.
        string alone = PathOf("alone.h5"), embedded = PathOf("embedded.h5");
        var (code, _, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "3000", "--seed", "5", "-o", alone, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        (code, _, error) = CliRunner.Run("place", "-p", "polytrope:n=1.5", "-n", "3000", "--seed", "5", "--companion", "mass=0.5,separation=3",
            "--background", "box=10,density=1e-5,pressure=1e-7", "-o", embedded, "--quiet");
        Assert.True(code == ExitCodes.Ok, error);
        double[] Figures(string file)
        {
            var (c, output, e) = CliRunner.Run("check", "--points", file, "-p", "polytrope:n=1.5", "--no-baseline", "--json", "--quiet");
            Assert.True(c == ExitCodes.Ok, e);
            using var doc = JsonDocument.Parse(output);
            var root = doc.RootElement;
            return [root.GetProperty("pointCount").GetInt32(), root.GetProperty("logRatio").GetProperty("standardDeviation").GetDouble(),
                root.GetProperty("enclosedMass").GetProperty("maxRelativeError").GetDouble()];
        }
        var a = Figures(alone);
        var b = Figures(embedded);
        Assert.Equal(3000, b[0]);
        Assert.Equal(a[1], b[1], 1e-6 * a[1]);
        Assert.True(b[2] < 1e-9, $"enclosed mass error {b[2]}");
    }
}
