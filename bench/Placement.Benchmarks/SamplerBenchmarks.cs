using BenchmarkDotNet.Attributes;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;

namespace Placement.Benchmarks;

/// <summary>
/// Points per second of every built-in sampler (plan + fill into a preallocated point set, uniform sphere so the
/// profile's r(M) costs little), against the floor: writing the same number of x, y, z coordinates into
/// preallocated arrays. Points/s = N / mean time; ratio to the floor from the same run.
/// </summary>
[MemoryDiagnoser]
[MedianColumn]
public class SamplerBenchmarks
{
    private readonly IRadialProfile _profile = new UniformSphere(1.0, 1.0);
    private readonly Dictionary<string, (IPointSampler Sampler, SamplingRequest Request, PointSet Points)> _runs = [];
    private double[] _x = [], _y = [], _z = [];

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    [Params(1, 2)]
    public int Threads { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000, 10_000_000);

    [GlobalSetup]
    public void Setup()
    {
        _x = new double[N];
        _y = new double[N];
        _z = new double[N];
        Array.Fill(_x, 1.0);
        Array.Fill(_y, 1.0);
        Array.Fill(_z, 1.0);
        var catalog = SamplerCatalog.CreateDefault();
        // Only the samplers measured here: glass and relaxed do their work in Plan (tile relaxation, point relaxation)
        // and have their own benchmarks.
        foreach (string name in (string[])["healpix-shells", "random-shells", "stratified-shells", "stretched-lattice", "poisson"])
        {
            var sampler = catalog.Create(name);
            var request = new SamplingRequest(_profile, N)
            {
                Seed = 1,
                Parallel = new ParallelSettings { MaxDegreeOfParallelism = Threads },
            };
            var plan = sampler.Plan(request);
            var points = new PointSet(plan.Count, _profile.Units);
            PointSampling.Fill(sampler, request, plan, points); // touch the memory once
            _runs[name] = (sampler, request, points);
        }
    }

    /// <summary>The floor: 3N coordinate writes into preallocated, already-touched arrays (split like the samplers' work).</summary>
    [Benchmark(Baseline = true)]
    public void WriteCoordinatesFloor()
    {
        int n = N;
        ParallelLoop.For(n, new ParallelSettings { MaxDegreeOfParallelism = Threads, MinimumChunk = 65_536 }, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                _x[i] = i;
                _y[i] = -i;
                _z[i] = 0.5 * i;
            }
        });
    }

    [Benchmark]
    public void HealpixShells() => Run("healpix-shells");

    [Benchmark]
    public void RandomShells() => Run("random-shells");

    [Benchmark]
    public void StratifiedShells() => Run("stratified-shells");

    [Benchmark]
    public void StretchedLattice() => Run("stretched-lattice");

    [Benchmark]
    public void Poisson() => Run("poisson");

    private void Run(string name)
    {
        var (sampler, request, points) = _runs[name];
        var plan = sampler.Plan(request);
        if (plan.Count != points.Count) throw new InvalidOperationException("Plan changed between runs.");
        PointSampling.Fill(sampler, request, plan, points);
    }
}
