using BenchmarkDotNet.Attributes;
using Placement.Parallelism;
using Placement.Random;
using Placement.Tessellation;

namespace Placement.Benchmarks;

/// <summary>
/// Voronoi cells of a strongly concentrated set in a ball: N points of a Hernquist profile (M(&lt;r) ∝ r²/(r + a)²,
/// a = 1, cut at r = 100, drawn by inverse transform), on the uniform grid against the k-d tree the automatic choice
/// takes for such sets. Two threads.
/// </summary>
[MemoryDiagnoser]
public class TessellationCuspBenchmarks
{
    private double[] _x = [], _y = [], _z = [];

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    [Params(NeighbourIndexKind.UniformGrid, NeighbourIndexKind.KdTree)]
    public NeighbourIndexKind Index { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(10_000, 100_000);

    [GlobalSetup]
    public void Setup()
    {
        _x = new double[N]; _y = new double[N]; _z = new double[N];
        const double rMax = 100;
        double top = rMax * rMax / ((rMax + 1) * (rMax + 1));
        for (int i = 0; i < N; i++)
        {
            var rng = new KeyedRandom(2026, (ulong)i);
            double s = Math.Sqrt(top * rng.NextDouble());
            double r = Math.Min(s / (1 - s), rMax * (1 - 1e-9));
            double c = 2 * rng.NextDouble() - 1, phi = 2 * Math.PI * rng.NextDouble(), w = Math.Sqrt(1 - c * c);
            _x[i] = r * w * Math.Cos(phi); _y[i] = r * w * Math.Sin(phi); _z[i] = r * c;
        }
    }

    [Benchmark]
    public double CuspInBall()
    {
        var options = new TessellationOptions { NeighbourIndex = Index, Parallel = new ParallelSettings { MaxDegreeOfParallelism = 2 } };
        var cells = VoronoiTessellation.Compute(_x, _y, _z, TessellationDomain.Sphere(0, 0, 0, 100), options);
        return cells.Volume[0] + cells.FaceCount[0];
    }
}
