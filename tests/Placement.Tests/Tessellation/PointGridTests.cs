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
}
