using Placement.Parallelism;
using Placement.Profiles;
using Placement.Random;
using Placement.Samplers;
using Placement.Samplers.Glass;
using Placement.Units;

namespace Placement.Tests.Samplers;

public class GlassSamplerTests
{
    private static readonly PlummerSphere Plummer = new(1.0, 0.3, 3.0, UnitSystem.Solar);

    private static SamplingRequest Request(int n, int threads = 1, string cache = "") => new(Plummer, n)
    {
        Seed = 5,
        Parameters = new GlassSampler().Describe().Parse(new Dictionary<string, string>
        {
            ["tile-points"] = "512",
            ["tile-iterations"] = "60",
            ["tile-file"] = cache,
        }),
        Parallel = new ParallelSettings { MaxDegreeOfParallelism = threads },
    };

    /// <summary>Largest |N M(r_k)/M − (k + ½)| over the points sorted by radius, in units of one point's mass.</summary>
    private static double WorstEnclosedMassError(IRadialProfile profile, double[] x, double[] y, double[] z)
    {
        var r = new double[x.Length];
        for (int i = 0; i < r.Length; i++) r[i] = Math.Sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
        Array.Sort(r);
        double worst = 0;
        for (int k = 0; k < r.Length; k++)
            worst = Math.Max(worst, Math.Abs(r.Length * profile.EnclosedMass(r[k]) / profile.TotalMass - (k + 0.5)));
        return worst;
    }

    [Fact]
    public void RankStretch_PutsEveryPointAtItsMassFraction()
    {
        const int n = 20_000;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var rng = new KeyedRandom(8, 8);
        for (int i = 0; i < n; i++) { x[i] = rng.NextGaussian(); y[i] = rng.NextGaussian(); z[i] = rng.NextGaussian(); }
        RadialRankStretch.Apply(Plummer, x, y, z);
        // By construction the k-th point encloses (k + 1/2)/N of the mass: only r(M) round-off remains.
        Assert.True(WorstEnclosedMassError(Plummer, x, y, z) < 1e-6);
    }

    [Fact]
    public void Glass_PlacesExactlyN_WithExactMassAndEnclosedMassWithinHalfAPoint()
    {
        var result = PointSampling.Place(new GlassSampler(), Request(6000));
        var p = result.Points;
        p.CheckValidity();
        Assert.Equal(6000, p.Count);
        Assert.Equal(Plummer.TotalMass, p.TotalMass(), 1e-12);
        Assert.True(WorstEnclosedMassError(Plummer, p.X, p.Y, p.Z) < 0.5 + 1e-6);
        Assert.Equal("glass", p.Provenance.Sampler);
    }

    [Fact]
    public void Glass_IsIdenticalOnOneAndTwoThreads_AndReusesItsCache()
    {
        string dir = Directory.CreateTempSubdirectory("glass-cache").FullName;
        try
        {
            string cache = Path.Combine(dir, "tile.glass");
            var one = PointSampling.Place(new GlassSampler(), Request(3000, 1, cache)).Points;
            Assert.True(File.Exists(cache));
            var two = PointSampling.Place(new GlassSampler(), Request(3000, 2, cache)).Points;
            Assert.Equal(one.X, two.X);
            Assert.Equal(one.Z, two.Z);

            var wrongSize = new GlassSampler().Describe().Parse(new Dictionary<string, string> { ["tile-points"] = "256", ["tile-file"] = cache });
            var ex = Assert.Throws<ArgumentException>(() => PointSampling.Place(new GlassSampler(), new SamplingRequest(Plummer, 100) { Parameters = wrongSize }));
            Assert.Contains("512", ex.Message);
        }
        finally
        {
            Directory.Delete(dir, true);
        }
    }
}
