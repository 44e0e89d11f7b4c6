using Placement.Glass;
using Placement.Parallelism;
using Placement.Statistics;

namespace Placement.Tests.Glass;

public class GlassTests
{
    private static readonly GlassSettings Quick = new() { MaxIterations = 300 };

    [Fact]
    public void Glass_IsSuperhomogeneous_FarBelowPoissonAtLowK()
    {
        var tile = GlassMaker.Make(1000, 11, Quick);
        var s = PowerSpectrum.Measure(tile.X, tile.Y, tile.Z, 1.0, 6);
        // Superhomogeneous sets have S(k) -> 0 as k -> 0 (Gabrielli, Joyce & Sylos Labini 2002, PRD 65, 083523);
        // a Poisson set has S = 1 at every k. We require the four lowest bins below 1 % of the Poisson level:
        // a Poisson set would fall that low in a bin of >= 9 modes with probability < 1e-15.
        for (int b = 0; b < 4; b++) Assert.True(s.Power[b] < 0.01, $"S(|n|={b + 1}) = {s.Power[b]}");
        // The relaxation has converged: the last step moved points by well under 1 % of the mean spacing.
        Assert.True(tile.FinalRmsStep < 0.01, $"final rms step {tile.FinalRmsStep}");
    }

    [Fact]
    public void Glass_HasNoCloseNeighbours_UnlikePoisson()
    {
        var tile = GlassMaker.Make(1000, 3, Quick);
        double a = Math.Cbrt(1.0 / tile.Count), minSep = double.MaxValue;
        for (int i = 0; i < tile.Count; i++)
            for (int j = i + 1; j < tile.Count; j++)
            {
                double dx = tile.X[i] - tile.X[j], dy = tile.Y[i] - tile.Y[j], dz = tile.Z[i] - tile.Z[j];
                dx -= Math.Round(dx); dy -= Math.Round(dy); dz -= Math.Round(dz);
                minSep = Math.Min(minSep, Math.Sqrt(dx * dx + dy * dy + dz * dz));
            }
        // For 1000 Poisson points the closest pair is typically ~0.1 a apart (common practice: nearest-pair
        // distance ~ N^(-2/3) a); a glass keeps every pair at a sizeable fraction of the mean spacing.
        Assert.True(minSep > 0.5 * a, $"closest pair {minSep / a} a");
    }

    [Fact]
    public void Glass_IsIdentical_OnOneAndTwoThreads()
    {
        var one = GlassMaker.Make(600, 5, new GlassSettings { MaxIterations = 40 }, new ParallelSettings { MaxDegreeOfParallelism = 1 });
        var two = GlassMaker.Make(600, 5, new GlassSettings { MaxIterations = 40 }, new ParallelSettings { MaxDegreeOfParallelism = 2, MinimumChunk = 16 });
        Assert.Equal(one.X, two.X);
        Assert.Equal(one.Y, two.Y);
        Assert.Equal(one.Z, two.Z);
    }

    [Fact]
    public void GlassCache_RoundTrips_AndRefusesOverwriteAndCorruptFiles()
    {
        var tile = GlassMaker.Make(200, 1, new GlassSettings { MaxIterations = 10 });
        string dir = Directory.CreateTempSubdirectory("glass").FullName;
        try
        {
            string path = Path.Combine(dir, "tile.glass");
            tile.Save(path);
            var back = GlassTile.Load(path);
            Assert.Equal(tile.X, back.X);
            Assert.Equal(tile.Z, back.Z);
            Assert.Equal(tile.Seed, back.Seed);
            Assert.Throws<IOException>(() => tile.Save(path));
            tile.Save(path, overwrite: true);
            Assert.Single(Directory.GetFiles(dir));

            File.WriteAllBytes(path, File.ReadAllBytes(path)[..100]);
            var ex = Assert.Throws<InvalidDataException>(() => GlassTile.Load(path));
            Assert.Contains("tile.glass", ex.Message);
            File.WriteAllText(path, "not a glass");
            Assert.Throws<InvalidDataException>(() => GlassTile.Load(path));
        }
        finally
        {
            Directory.Delete(dir, true);
        }
    }

    [Fact]
    public void GlassCache_InAnUnusableDirectory_IsAnErrorNamingTheCache()
    {
        // A regular file where the cache's directory should be: the directory cannot be created. The sampler must say
        // which file it wanted (the command line once said only "input file not found: <directory>"); it now checks the
        // directory before it relaxes the tile.
        string dir = Directory.CreateTempSubdirectory("glass").FullName;
        try
        {
            string blocker = Path.Combine(dir, "blocker");
            File.WriteAllText(blocker, "a file, not a directory");
            string cache = Path.Combine(blocker, "sub", "tile.glass");
            var sampler = new Placement.Samplers.Glass.GlassSampler();
            var request = new Placement.Samplers.SamplingRequest(new Placement.Profiles.Polytrope(1.5, 1, 1), 500)
            {
                Parameters = sampler.Describe().Parse(new Dictionary<string, string> { ["tile-file"] = cache, ["tile-points"] = "512" }),
            };
            var e = Assert.Throws<IOException>(() => Placement.Samplers.PointSampling.Place(sampler, request));
            Assert.Contains($"Glass cache '{cache}' cannot be written", e.Message, StringComparison.Ordinal);
            Assert.False(File.Exists(cache));
        }
        finally
        {
            Directory.Delete(dir, true);
        }
    }
}
