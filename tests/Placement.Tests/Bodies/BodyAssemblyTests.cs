using Placement.Bodies;
using Placement.Bodies.Background;
using Placement.IO;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;
using Xunit.Abstractions;

namespace Placement.Tests.Bodies;

public class BodyAssemblyTests(ITestOutputHelper output)
{
    [Fact]
    public void Assembly_WithCoreCompanionAndBackground_IsInTheCentreOfMassFrame_AndRoundTripsThroughHdf5()
    {
        var profile = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(profile, 4000) { Seed = 2 }).Points;
        var body = new PointTable(points);
        body.PointMasses.Add(new PointMass("core", 0.2, 0.05));
        var request = new BodyAssemblyRequest
        {
            Companions = [new CompanionOrbit("companion", 0.5, 3.0, 0.3)],
            Background = new BackgroundSettings { BoxSide = 12, Density = 1e-5, Pressure = 2e-7 },
            Seed = 4,
        };
        var (table, summary) = BodyAssembly.Assemble(body, profile, request);
        table.CheckValidity();
        Assert.NotSame(points, table.Points);
        int nb = points.Count, n = table.Count;
        Assert.Equal(summary.Background!.Points, n - nb);
        Assert.All(table.Points.Layer.AsSpan(nb).ToArray(), l => Assert.Equal(PointLayers.Background, l));

        // Centre-of-mass frame of everything: Σ m x and Σ m v vanish to rounding (a few ulps of the box size and of the
        // companion's speed, measured 1e-17 – 1e-16).
        var v = table.Find(PointColumnNames.Velocity)!.Components;
        var cm = CentreOfMassFrame.Measure(table.Points, v[0], v[1], v[2], table.PointMasses);
        output.WriteLine($"shift {summary.Shift}; residual offset {cm.Offset:E2}, velocity {cm.Momentum / cm.Mass:E2}; background {summary.Background}");
        Assert.True(cm.Offset < 1e-14 * 6, $"COM offset {cm.Offset}");
        Assert.True(cm.Momentum / cm.Mass < 1e-14, $"COM velocity {cm.Momentum / cm.Mass}");
        Assert.Equal(summary.ResidualOffset, cm.Offset);

        // The companion sits a(1+e) = 3.9 from the body's centre at apastron (default phase), and the body moved the
        // other way by m₂/(M) of it (two-body reduction, Murray & Dermott 1999 §2.2; the background's own centre of
        // mass adds a small offset of its hole, so compare relative positions).
        var core = table.PointMasses.Single(p => p.Name == "core");
        var companion = table.PointMasses.Single(p => p.Name == "companion");
        Assert.Equal(3.9, Math.Sqrt(Math.Pow(companion.X - core.X, 2) + Math.Pow(companion.Y - core.Y, 2)), 1e-12);
        // Background points at rest in the frame where the bound system has zero momentum: the final shift of velocity is
        // rounding of momenta of order m v ~ 0.3 (measured 1.4e-14).
        Assert.True(Math.Abs(v[1][n - 1]) < 1e-13, $"background velocity {v[1][n - 1]}");
        // Pressure column: the profile's at body points, the background's outside.
        var pressure = table.Find(BodyAssembly.PressureColumn)!.Components[0];
        Assert.Equal(2e-7, pressure[n - 1]);
        Assert.True(pressure[0] > 1e-3);

        using var dir = Placement.Tests.IO.TestTables.TempDir();
        string path = dir.File("system.h5");
        PointFiles.Write(table, path);
        var back = PointFiles.Read(path);
        Assert.Equal(table.Background, back.Background);
        Assert.Equal(table.PointMasses, back.PointMasses);
        Assert.Equal(table.Points.Layer, back.Points.Layer);
    }

    [Fact]
    public void Assembly_RefusesAnUnknownColumnForTheBackground_AndDuplicateNames()
    {
        var profile = new UniformSphere(1.0, 1.0, UnitSystem.Solar);
        var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(profile, 500) { Seed = 2 }).Points;
        var body = new PointTable(points).Add("temperature", new double[500], QuantityDimension.Dimensionless, "invented");
        var ex = Assert.Throws<ArgumentException>(() => BodyAssembly.Assemble(body, profile,
            new BodyAssemblyRequest { Background = new BackgroundSettings { BoxSide = 4, Density = 1e-3 } }));
        Assert.Contains("temperature", ex.Message, StringComparison.Ordinal);
        // A known column with a given background value, and an unknown one supplied through the callback.
        var energy = new double[500];
        Array.Fill(energy, 0.7);
        body.Add(PointColumnNames.InternalEnergy, energy, QuantityDimension.SpecificEnergy, "invented");
        var (table, summary) = BodyAssembly.Assemble(body, profile, new BodyAssemblyRequest
        {
            Background = new BackgroundSettings { BoxSide = 4, Density = 1e-3, Pressure = 2e-4 },
            BackgroundInternalEnergy = 0.3, // P/((γ − 1) ρ) for γ = 5/3 (ideal gas, common practice)
            BackgroundColumn = (column, bg) => column.Name == "temperature" ? [Enumerable.Repeat(10.0, bg.Points.Count).ToArray()] : null,
        });
        int n = table.Count;
        Assert.Equal(0.7, table.Find(PointColumnNames.InternalEnergy)!.Components[0][0]);
        Assert.Equal(0.3, table.Find(PointColumnNames.InternalEnergy)!.Components[0][n - 1]);
        Assert.Equal(10.0, table.Find("temperature")!.Components[0][n - 1]);
        Assert.Equal(500 + summary.Background!.Points, n);
        ex = Assert.Throws<ArgumentException>(() => BodyAssembly.Assemble(new PointTable(points), profile,
            new BodyAssemblyRequest { Companions = [new CompanionOrbit("b", 0.1, 3), new CompanionOrbit("b", 0.1, 5)] }));
        Assert.Contains("'b'", ex.Message, StringComparison.Ordinal);
    }
}
