using BenchmarkDotNet.Attributes;
using Placement.Points;
using Placement.Profiles;
using Placement.Relaxation;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Benchmarks;

/// <summary>
/// Kernel relaxation of a HEALPix-shell start of an n = 3/2 polytrope, 30 iterations (issue 6 target: relaxing 1e5
/// points in at most 60 s on this 2-core machine). The reference is placing the same start (the sampler alone).
/// </summary>
public class RelaxationBenchmarks
{
    private readonly Polytrope _body = new(1.5, 1.0, 1.0, UnitSystem.Solar);
    private PointSet _start = null!;
    private PointSet _work = null!;

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(2_000, 100_000);

    [GlobalSetup]
    public void Setup()
    {
        _start = Place();
        _work = Place();
    }

    private PointSet Place() =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(_body, N) { Seed = 1 }).Points;

    [IterationSetup(Target = nameof(Relax30))]
    public void Reset()
    {
        _start.X.CopyTo(_work.X, 0);
        _start.Y.CopyTo(_work.Y, 0);
        _start.Z.CopyTo(_work.Z, 0);
    }

    [Benchmark(Baseline = true)]
    public int PlaceStart() => Place().Count;

    [Benchmark]
    public int Relax30() => KernelRelaxation.Relax(_work, _body, new RelaxationSettings { MaxIterations = 30, Tolerance = 0 }).Iterations;
}
