using BenchmarkDotNet.Attributes;
using Placement.Points;
using Placement.Profiles;
using Placement.Relaxation;
using Placement.Samplers;
using Placement.Tessellation;
using Placement.Units;

namespace Placement.Benchmarks;

/// <summary>
/// Voronoi relaxation (Lloyd + Gauss–Newton volume correction) of a HEALPix-shell start of an n = 3 polytrope, three
/// iterations with radii kept. The reference is one tessellation of the same start with face lists (each iteration costs
/// one such tessellation plus the face rebuild and the solve).
/// </summary>
public class VoronoiRelaxationBenchmarks
{
    private readonly Polytrope _body = new(3.0, 1.0, 1.0, UnitSystem.Solar);
    private PointSet _start = null!;
    private PointSet _work = null!;

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(10_000, 100_000);

    [GlobalSetup]
    public void Setup()
    {
        _start = Place();
        _work = Place();
    }

    private PointSet Place() =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(_body, N) { Seed = 1 }).Points;

    [IterationSetup(Target = nameof(Relax3))]
    public void Reset()
    {
        _start.X.CopyTo(_work.X, 0);
        _start.Y.CopyTo(_work.Y, 0);
        _start.Z.CopyTo(_work.Z, 0);
    }

    [Benchmark(Baseline = true)]
    public int TessellateWithFaces() =>
        VoronoiTessellation.Compute(_start, TessellationDomain.Sphere(0, 0, 0, 1.0 + 1e-9), new TessellationOptions { KeepFaces = true }).Count;

    [Benchmark]
    public int Relax3() =>
        VoronoiRelaxation.Relax(_work, _body, new VoronoiRelaxationSettings { MaxIterations = 3, Tolerance = 0 }).Iterations;
}
