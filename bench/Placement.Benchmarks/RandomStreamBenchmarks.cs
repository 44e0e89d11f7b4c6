using BenchmarkDotNet.Attributes;
using Placement.Random;

namespace Placement.Benchmarks;

/// <summary>Cost of the keyed random streams every sampler draws from, against filling memory (the floor).</summary>
[MemoryDiagnoser]
public class RandomStreamBenchmarks
{
    private double[] _buffer = [];

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000);

    [GlobalSetup]
    public void Setup() => _buffer = new double[N];

    [Benchmark(Baseline = true)]
    public void FillFloor() => Array.Fill(_buffer, 0.5);

    [Benchmark]
    public void KeyedUniforms()
    {
        var rng = new KeyedRandom(1, 2);
        for (int i = 0; i < _buffer.Length; i++) _buffer[i] = rng.NextDouble();
    }
}
