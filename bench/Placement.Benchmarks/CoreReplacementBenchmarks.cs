using BenchmarkDotNet.Attributes;
using Placement.Profiles;
using Placement.Random;

namespace Placement.Benchmarks;

/// <summary>
/// Core replacement: the one-off cost of solving the replacement (shooting, dense solution, hydrostatic report) on an
/// n = 3 polytrope with an n = 1.5 gas inside 0.2 R, and the per-point cost samplers pay afterwards, r(M) on the replaced
/// profile against r(M) on the original polytrope (baseline).
/// </summary>
[MemoryDiagnoser]
public class CoreReplacementBenchmarks
{
    private Polytrope _star = null!;
    private CoreReplacedProfile _gas = null!;
    private double[] _masses = [], _out = [];

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000);

    [GlobalSetup]
    public void Setup()
    {
        _star = new Polytrope(3, 1, 1);
        _gas = CoreReplacement.Apply(_star, new CoreReplacementOptions(0.2) { Index = 1.5 });
        _masses = new double[N];
        _out = new double[N];
        var rng = new KeyedRandom(11, 0);
        for (int i = 0; i < N; i++) _masses[i] = rng.NextDouble() * _gas.TotalMass;
    }

    [Benchmark(Baseline = true)]
    public void RadiusOfMass_OriginalPolytrope()
    {
        for (int i = 0; i < _masses.Length; i++) _out[i] = _star.RadiusOfEnclosedMass(_masses[i]);
    }

    [Benchmark]
    public void RadiusOfMass_ReplacedProfile()
    {
        for (int i = 0; i < _masses.Length; i++) _out[i] = _gas.RadiusOfEnclosedMass(_masses[i]);
    }

    [Benchmark]
    public double Solve_Replacement() => CoreReplacement.Apply(_star, new CoreReplacementOptions(0.2) { Index = 1.5 }).CoreMass;
}
