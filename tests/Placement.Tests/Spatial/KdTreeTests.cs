using Placement.Random;
using Placement.Spatial;

namespace Placement.Tests.Spatial;

public class KdTreeTests
{
    /// <summary>Points whose number density spans ~12 decades: radius r = u^8 in a unit ball (a steep central concentration).</summary>
    private static (double[] X, double[] Y, double[] Z) Concentrated(int n, ulong seed)
    {
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var rng = new KeyedRandom(seed, 0);
        for (int i = 0; i < n; i++)
        {
            double r = Math.Pow(rng.NextDouble(), 8);
            double mu = 2 * rng.NextDouble() - 1, phi = 2 * Math.PI * rng.NextDouble(), s = Math.Sqrt(1 - mu * mu);
            x[i] = r * s * Math.Cos(phi); y[i] = r * s * Math.Sin(phi); z[i] = r * mu;
        }
        return (x, y, z);
    }

    private static (double[] X, double[] Y, double[] Z) Lattice(int side)
    {
        int n = side * side * side;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        for (int i = 0, p = 0; i < side; i++)
            for (int j = 0; j < side; j++)
                for (int k = 0; k < side; k++, p++) { x[p] = i; y[p] = j; z[p] = k; }
        return (x, y, z);
    }

    public static TheoryData<string> Sets => new() { "concentrated", "lattice" };

    [Theory]
    [MemberData(nameof(Sets))]
    public void NearestFirst_MatchesBruteForce_InOrderAndDistance(string set)
    {
        var (x, y, z) = set == "lattice" ? Lattice(9) : Concentrated(3000, 4);
        var tree = new KdTree(x, y, z, leafSize: 4);
        tree.CheckValidity();
        var search = tree.CreateSearch();
        const int k = 30;
        var brute = new double[x.Length];
        for (int q = 0; q < x.Length; q += 37)
        {
            for (int i = 0; i < x.Length; i++)
            {
                double dx = x[i] - x[q], dy = y[i] - y[q], dz = z[i] - z[q];
                brute[i] = i == q ? double.MaxValue : dx * dx + dy * dy + dz * dz;
            }
            var expected = brute.Order().Take(k).ToArray();
            search.Start(x[q], y[q], z[q], q);
            double last = 0;
            for (int j = 0; j < k; j++)
            {
                Assert.True(search.Next(double.MaxValue, out var hit));
                int original = tree.SortedIndex[hit.Slot];
                Assert.NotEqual(q, original);
                // Exact: the j-th distance equals the brute-force j-th distance bit for bit (ties may swap points).
                Assert.Equal(expected[j], hit.DistanceSquared);
                Assert.Equal(brute[original], hit.DistanceSquared);
                Assert.True(hit.DistanceSquared >= last);
                last = hit.DistanceSquared;
            }
        }
    }

    [Fact]
    public void Limit_StopsTheSearch_AndEveryPointIsFoundOnce()
    {
        var (x, y, z) = Concentrated(500, 9);
        var tree = new KdTree(x, y, z);
        var search = tree.CreateSearch();
        search.Start(0, 0, 0, -1);
        var found = new HashSet<int>();
        while (search.Next(double.MaxValue, out var hit)) Assert.True(found.Add(tree.SortedIndex[hit.Slot]));
        Assert.Equal(500, found.Count);

        search.Start(0, 0, 0, -1);
        int inside = 0;
        while (search.Next(0.01, out var hit)) { Assert.True(hit.DistanceSquared < 0.01); inside++; }
        int expected = 0;
        for (int i = 0; i < 500; i++) if (x[i] * x[i] + y[i] * y[i] + z[i] * z[i] < 0.01) expected++;
        Assert.Equal(expected, inside);
    }

    [Fact]
    public void BadInput_IsRejectedWithTheOffendingPoint()
    {
        var ex = Assert.Throws<ArgumentException>(() => new KdTree([0.0, double.NaN], [0.0, 0.0], [0.0, 0.0]));
        Assert.Contains("Point 1", ex.Message);
        Assert.Throws<ArgumentException>(() => new KdTree([0.0], [0.0, 1.0], [0.0]));
        var empty = new KdTree([], [], []);
        var search = empty.CreateSearch();
        search.Start(0, 0, 0, -1);
        Assert.False(search.Next(double.MaxValue, out _));
    }

    [Theory]
    [MemberData(nameof(Sets))]
    public void KNearest_MatchesBruteForceDistances(string set)
    {
        var (x, y, z) = set == "lattice" ? Lattice(8) : Concentrated(2000, 6);
        var tree = new KdTree(x, y, z);
        var search = tree.CreateSearch();
        const int k = 40;
        Span<int> slots = stackalloc int[k];
        Span<double> d2 = stackalloc double[k];
        for (int q = 0; q < x.Length; q += 29)
        {
            var brute = new double[x.Length];
            for (int i = 0; i < x.Length; i++)
            {
                double dx = x[i] - x[q], dy = y[i] - y[q], dz = z[i] - z[q];
                brute[i] = i == q ? double.MaxValue : dx * dx + dy * dy + dz * dz;
            }
            var expected = brute.Order().Take(k).ToArray();
            Assert.Equal(k, search.Nearest(x[q], y[q], z[q], q, slots, d2));
            for (int j = 0; j < k; j++)
            {
                Assert.Equal(expected[j], d2[j]);
                Assert.Equal(brute[tree.SortedIndex[slots[j]]], d2[j]);
            }
        }
        // Fewer points than k: all of them are returned.
        var small = new KdTree([0.0, 1, 2], [0.0, 0, 0], [0.0, 0, 0]);
        Assert.Equal(2, small.CreateSearch().Nearest(0, 0, 0, 0, slots, d2));
    }
}
