using Placement.Spatial;

namespace Placement.Tests.Tessellation;

public class PointGridTests
{
    private static double Periodic(double d) => d - Math.Round(d);

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void FindNearest_MatchesBruteForce(bool periodic)
    {
        var (x, y, z) = TestPoints.Uniform(3000, 61);
        var grid = new PointGrid(x, y, z, (0, 0, 0), (1, 1, 1), periodic);
        Span<int> idx = stackalloc int[12];
        Span<double> d2 = stackalloc double[12];
        for (int q = 0; q < 200; q++)
        {
            int found = grid.FindNearest(x[q], y[q], z[q], idx, d2, exclude: q);
            Assert.Equal(12, found);
            var brute = new double[x.Length];
            for (int j = 0; j < x.Length; j++)
            {
                double dx = x[j] - x[q], dy = y[j] - y[q], dz = z[j] - z[q];
                if (periodic) { dx = Periodic(dx); dy = Periodic(dy); dz = Periodic(dz); }
                brute[j] = j == q ? double.PositiveInfinity : dx * dx + dy * dy + dz * dz;
            }
            Array.Sort(brute);
            for (int k = 0; k < 12; k++)
            {
                Assert.Equal(brute[k], d2[k], 14);
                if (k > 0) Assert.True(d2[k] >= d2[k - 1]);
            }
        }
    }

    [Fact]
    public void FindWithinRadius_AndCollectInShell_MatchBruteForce()
    {
        var (x, y, z) = TestPoints.Uniform(2000, 67, -2, 3);
        var grid = new PointGrid(x, y, z, (-2, -2, -2), (3, 3, 3), false, 3.0);
        var list = new List<int>();
        var buffer = new NeighbourBuffer();
        for (int q = 0; q < 100; q++)
        {
            double r = 0.2 + 0.01 * q;
            list.Clear();
            grid.FindWithinRadius(x[q], y[q], z[q], r, list);
            buffer.Clear();
            grid.CollectInShell(x[q], y[q], z[q], 0.01, r * r, -1, buffer);
            int brute = 0, bruteShell = 0;
            for (int j = 0; j < x.Length; j++)
            {
                double d2 = (x[j] - x[q]) * (x[j] - x[q]) + (y[j] - y[q]) * (y[j] - y[q]) + (z[j] - z[q]) * (z[j] - z[q]);
                if (d2 < r * r) brute++;
                if (d2 < r * r && d2 >= 0.01) bruteShell++;
            }
            Assert.Equal(brute, list.Count);
            Assert.Equal(bruteShell, buffer.Count);
        }
    }

    [Fact]
    public void CollectInShell_EveryVectorWidth_GivesTheBruteForceNeighboursInOneOrder()
    {
        // Every point of a 2000-point set queried (the last grid cells end at the arrays' end, where the vector paths
        // fall back to scalar), shells of growing radii with the query itself excluded: the scalar path must return exactly
        // the brute-force neighbours (offsets and squared distances bit for bit, computed in the same order), and every
        // vector width this machine has (4: AVX2 permutations, 8: AVX-512 compress) the scalar path's order.
        var (x, y, z) = TestPoints.Uniform(2000, 71, -1, 1);
        var grid = new PointGrid(x, y, z, (-1, -1, -1), (1, 1, 1), false);
        var sx = grid.SortedX; var sy = grid.SortedY; var sz = grid.SortedZ;
        var scalar = new NeighbourBuffer();
        var wide = new NeighbourBuffer();
        int was = SimdLanes.Doubles;
        int[] widths = SimdLanes.Best switch { 8 => [4, 8], 4 => [4], _ => [] };
        try
        {
            for (int q = 0; q < x.Length; q++)
            {
                double inner2 = q % 3 == 0 ? 0 : 0.002 * (q % 7), outer2 = inner2 + 0.01 + 0.0001 * (q % 50);
                double qx = sx[q], qy = sy[q], qz = sz[q];
                SimdLanes.Doubles = 1;
                scalar.Clear();
                grid.CollectInShell(qx, qy, qz, inner2, outer2, q, scalar);

                var expected = new Dictionary<int, (double D2, double Dx, double Dy, double Dz)>();
                for (int s = 0; s < x.Length; s++)
                {
                    double dx = sx[s] + -qx, dy = sy[s] + -qy, dz = sz[s] + -qz, d2 = dx * dx + dy * dy + dz * dz;
                    if (s != q && d2 >= inner2 && d2 < outer2) expected[s] = (d2, dx, dy, dz);
                }
                Assert.Equal(expected.Count, scalar.Count);
                for (int k = 0; k < scalar.Count; k++)
                {
                    Assert.True(expected.TryGetValue(scalar.Slot[k], out var e), $"query {q}: slot {scalar.Slot[k]} is not in the shell");
                    Assert.Equal(e, (scalar.DistanceSquared[k], scalar.Dx[k], scalar.Dy[k], scalar.Dz[k]));
                }
                foreach (int width in widths)
                {
                    SimdLanes.Doubles = width;
                    wide.Clear();
                    grid.CollectInShell(qx, qy, qz, inner2, outer2, q, wide);
                    Assert.Equal(scalar.Slot.ToArray(), wide.Slot.ToArray());
                    Assert.Equal(scalar.DistanceSquared.ToArray(), wide.DistanceSquared.ToArray());
                    Assert.Equal(scalar.Dx.ToArray(), wide.Dx.ToArray());
                    Assert.Equal(scalar.Dy.ToArray(), wide.Dy.ToArray());
                    Assert.Equal(scalar.Dz.ToArray(), wide.Dz.ToArray());
                }
            }
        }
        finally
        {
            SimdLanes.Doubles = was;
        }
    }
}
