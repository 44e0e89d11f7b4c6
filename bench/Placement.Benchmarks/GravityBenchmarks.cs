using BenchmarkDotNet.Attributes;
using Placement.Bodies;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Benchmarks;

/// <summary>
/// Gravitational energy of placed points: the Barnes–Hut octree (quadrupole nodes, θ = 0.5, two threads) at 1e5 and 1e6
/// Poisson points of a Plummer sphere, against the exact pairwise sum at 2e4 points (the reference; the pairwise cost
/// grows as N², so it is timed only where it is affordable). Measured (short job, medians, on a shared machine with a load
/// average near 19 on 2 cores, so absolute times are inflated): pairwise 2e4 1.79 s; octree 1e5 4.43 s (2.5× the 2e4
/// pairwise sum, about 10× faster than the 45 s a 1e5 pairwise sum extrapolates to), octree 1e6 62.5 s (the pairwise
/// sum would take ~4500 s).
/// </summary>
public class GravityBenchmarks
{
    private PointSet _tree = null!;
    private PointSet _pairs = null!;

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000);

    /// <summary>Size of the pairwise reference (smaller in smoke mode).</summary>
    private static int PairwiseCount => Program.Sizes(2_000, 20_000).Max();

    [GlobalSetup]
    public void Setup()
    {
        var body = new PlummerSphere(1, 0.2, 3, UnitSystem.Solar);
        _tree = PointSampling.Place(new PoissonSampler(), new SamplingRequest(body, N) { Seed = 21 }).Points;
        _pairs = PointSampling.Place(new PoissonSampler(), new SamplingRequest(body, PairwiseCount) { Seed = 21 }).Points;
    }

    [Benchmark(Baseline = true)]
    public double PairwiseSmallN() => GravitationalEnergy.OfPoints(_pairs);

    [Benchmark]
    public double OctreeThetaHalf() => GravitationalEnergy.OfPointsByTree(_tree, 0.5);
}
