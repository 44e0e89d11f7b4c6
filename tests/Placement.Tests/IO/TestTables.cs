using Placement.IO;
using Placement.Points;
using Placement.Random;
using Placement.Units;

namespace Placement.Tests.IO;

/// <summary>Seeded point tables for the I/O tests (random values; nothing physical is implied).</summary>
internal static class TestTables
{
    public static PointTable Make(int n, UnitSystem? units = null, ulong seed = 7)
    {
        units ??= UnitSystem.Solar;
        var points = new PointSet(n, units)
        {
            Provenance = new Provenance
            {
                Sampler = "test-sampler",
                Parameters = new Dictionary<string, string> { ["nside"] = "8", ["shells"] = "12", ["note"] = "a \"quoted\", comma" },
                Seed = 0xFEDCBA9876543210UL,
                ProfileFingerprint = "sha256:0123abcd",
            },
        };
        var rng = new KeyedRandom(seed, 1);
        var volume = new double[n];
        var vx = new double[n];
        var vy = new double[n];
        var vz = new double[n];
        for (int i = 0; i < n; i++)
        {
            points.X[i] = rng.NextDouble() * 2 - 1;
            points.Y[i] = rng.NextDouble() * 2 - 1;
            points.Z[i] = (rng.NextDouble() * 2 - 1) * 1e-7;
            points.Mass[i] = 1e-6 * (1 + rng.NextDouble());
            points.TargetDensity[i] = Math.Exp(-20 * rng.NextDouble());
            points.Layer[i] = i % 17 - 1;
            volume[i] = rng.NextDouble() * 1e-5;
            vx[i] = rng.NextDouble() - 0.5;
            vy[i] = -rng.NextDouble();
            vz[i] = rng.NextDouble() * 1e300;
        }
        var table = new PointTable(points);
        table.Add(PointColumnNames.CellVolume, volume, QuantityDimension.Volume, "Voronoi cell volume");
        table.Add(PointColumn.Vector(PointColumnNames.Velocity, vx, vy, vz, QuantityDimension.Velocity, units, "velocity"));
        return table;
    }

    /// <summary>A fresh empty directory under the system temp folder, deleted by the caller's using.</summary>
    public static TempDirectory TempDir() => new();
}

internal sealed class TempDirectory : IDisposable
{
    public TempDirectory()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "placement-io-tests-" + Guid.NewGuid().ToString("N")[..10]);
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public string[] Entries() => Directory.GetFileSystemEntries(Path).Select(System.IO.Path.GetFileName).Order().ToArray()!;

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); } catch (IOException) { }
    }
}
