using BenchmarkDotNet.Attributes;
using Placement.Profiles;
using Placement.Random;

namespace Placement.Benchmarks;

/// <summary>
/// Radial profile costs samplers depend on: batch r(M) on a tabulated profile (the invented two-zone demo star, 400
/// rows, a density step and 11 decades of envelope) against the closed-form uniform sphere as the floor, batch M(r),
/// and one Lane–Emden solve with verified dense output.
/// </summary>
[MemoryDiagnoser]
public class ProfileBenchmarks
{
    private TabulatedProfile _table = null!;
    private UniformSphere _uniform = null!;
    private double[] _masses = [], _radii = [], _out = [];

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000);

    [GlobalSetup]
    public void Setup()
    {
        _table = DemoBodies.TwoZoneStar();
        _uniform = new UniformSphere(1.0, 1.0);
        _masses = new double[N];
        _radii = new double[N];
        _out = new double[N];
        var rng = new KeyedRandom(5, 0);
        for (int i = 0; i < N; i++)
        {
            _masses[i] = rng.NextDouble() * _table.TotalMass;
            _radii[i] = rng.NextDouble() * _table.OuterRadius;
        }
    }

    [Benchmark(Baseline = true)]
    public void RadiusOfMass_UniformClosedForm() => ((IRadialProfile)_uniform).RadiusOfEnclosedMass(_masses, _out);

    [Benchmark]
    public void RadiusOfMass_TabulatedDemoStar() => _table.RadiusOfEnclosedMass(_masses, _out);

    [Benchmark]
    public double EnclosedMass_TabulatedDemoStar()
    {
        double s = 0;
        foreach (double r in _radii) s += _table.EnclosedMass(r);
        return s;
    }

    [Benchmark]
    public double LaneEmdenSolve_Index3() => LaneEmden.Solve(3).FirstZero;
}
