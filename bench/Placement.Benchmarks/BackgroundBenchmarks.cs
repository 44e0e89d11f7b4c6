using BenchmarkDotNet.Attributes;
using Placement.Bodies.Background;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Tessellation;
using Placement.Units;

namespace Placement.Benchmarks;

/// <summary>
/// A background medium (box of side 8 R, spacing growth 0.1) around N HEALPix-shell points of an n = 1.5 polytrope:
/// shell placement plus the joint tessellation with cell masses. Reference in the same run: the mass tessellation of the
/// body alone in its ball, which mesh mode pays anyway.
/// </summary>
[MemoryDiagnoser]
public class BackgroundBenchmarks
{
    private readonly Polytrope _profile = new(1.5, 1.0, 1.0, UnitSystem.Solar);
    private PointSet _body = new(0, UnitSystem.Solar);
    private readonly BackgroundSettings _settings = new() { BoxSide = 8, Density = 1e-6 };

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(20_000, 100_000);

    [GlobalSetup]
    public void Setup() =>
        _body = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(_profile, N) { Seed = 1 }).Points;

    [Benchmark(Baseline = true)]
    public double BodyCellMassesInBall() =>
        CellMasses.Integrate(_body, TessellationDomain.Sphere(0, 0, 0, 1 + 1e-9), _profile).Mass![0];

    [Benchmark]
    public double BackgroundPlaceAndMasses() =>
        BackgroundMedium.Place(_settings, _body, _profile, (0, 0, 0), 1, parallel: ParallelSettings.Default).Points.Mass[0];
}
