using BenchmarkDotNet.Attributes;
using Placement.Parallelism;
using Placement.Random;
using Placement.Tessellation;

namespace Placement.Benchmarks;

/// <summary>
/// Voronoi cells (volumes, centroids, face counts) of N uniform random points in the unit cube, on one and two
/// threads. Reference measured in the same session: bench/qhull_reference.py (scipy's Qhull route).
/// Cells per second = N / median; allocated bytes per cell = the MemoryDiagnoser's figure / N.
/// </summary>
[MemoryDiagnoser]
public class TessellationBenchmarks
{
    private double[] _x = [], _y = [], _z = [];
    private TessellationOptions _options = TessellationOptions.Default;

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    [Params(1, 2)]
    public int Threads { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(100_000, 1_000_000);

    [GlobalSetup]
    public void Setup()
    {
        _x = new double[N]; _y = new double[N]; _z = new double[N];
        for (int i = 0; i < N; i++)
        {
            var rng = new KeyedRandom(2026, (ulong)i);
            _x[i] = rng.NextDouble(); _y[i] = rng.NextDouble(); _z[i] = rng.NextDouble();
        }
        _options = new TessellationOptions { Parallel = new ParallelSettings { MaxDegreeOfParallelism = Threads } };
        _reused = null;
    }

    private VoronoiTessellator? _reused;

    /// <summary>One call as a user makes it: the grid, the order and the result arrays are fresh memory.</summary>
    [Benchmark]
    public double VolumesCentroidsFaces()
    {
        var cells = VoronoiTessellation.Compute(_x, _y, _z, TessellationDomain.UnitCube(), _options);
        return cells.Volume[0] + cells.CentroidX[0] + cells.FaceCount[0];
    }

    /// <summary>
    /// The same through one <see cref="VoronoiTessellator"/> kept across calls, as relaxation and moving-mesh loops use it:
    /// grid, order and results reuse their memory. The difference from <see cref="VolumesCentroidsFaces"/> is the cost of
    /// first touches of about 90 B/cell of fresh memory.
    /// </summary>
    [Benchmark]
    public double VolumesCentroidsFacesReused()
    {
        _reused ??= new VoronoiTessellator(TessellationDomain.UnitCube(), _options);
        var cells = _reused.Compute(_x, _y, _z);
        return cells.Volume[0] + cells.CentroidX[0] + cells.FaceCount[0];
    }
}
