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
}
