using Placement.Random;

namespace Placement.Tests.Tessellation;

/// <summary>Point sets for tessellation tests: uniform random sets (keyed by point index) and lattices.</summary>
internal static class TestPoints
{
    /// <summary>N uniform random points in [lo, hi)³, point i drawn from stream (seed, i).</summary>
    public static (double[] X, double[] Y, double[] Z) Uniform(int n, ulong seed, double lo = 0, double hi = 1)
    {
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        for (int i = 0; i < n; i++)
        {
            var rng = new KeyedRandom(seed, (ulong)i);
            x[i] = lo + (hi - lo) * rng.NextDouble();
            y[i] = lo + (hi - lo) * rng.NextDouble();
            z[i] = lo + (hi - lo) * rng.NextDouble();
        }
        return (x, y, z);
    }

    /// <summary>N uniform random points strictly inside the ball of radius r at the origin (rejection sampling).</summary>
    public static (double[] X, double[] Y, double[] Z) UniformBall(int n, ulong seed, double r)
    {
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        for (int i = 0; i < n; i++)
        {
            var rng = new KeyedRandom(seed, (ulong)i);
            double a, b, c;
            do
            {
                a = 2 * rng.NextDouble() - 1; b = 2 * rng.NextDouble() - 1; c = 2 * rng.NextDouble() - 1;
            } while (a * a + b * b + c * c >= 1);
            x[i] = r * a; y[i] = r * b; z[i] = r * c;
        }
        return (x, y, z);
    }

    /// <summary>
    /// A cubic lattice with the given basis (fractions of the cubic cell of edge a = 1) repeated m times per axis,
    /// shifted by <paramref name="shift"/>, optionally with uniform noise of half-width <paramref name="noise"/>.
    /// </summary>
    public static (double[] X, double[] Y, double[] Z) Lattice(int m, double[][] basis, double shift, double noise = 0, ulong seed = 1)
    {
        int n = m * m * m * basis.Length;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        int k = 0;
        for (int i = 0; i < m; i++)
            for (int j = 0; j < m; j++)
                for (int l = 0; l < m; l++)
                    foreach (var b in basis)
                    {
                        var rng = new KeyedRandom(seed, (ulong)k);
                        x[k] = i + b[0] + shift + noise * (2 * rng.NextDouble() - 1);
                        y[k] = j + b[1] + shift + noise * (2 * rng.NextDouble() - 1);
                        z[k] = l + b[2] + shift + noise * (2 * rng.NextDouble() - 1);
                        k++;
                    }
        return (x, y, z);
    }

    public static readonly double[][] Sc = [[0, 0, 0]];
    public static readonly double[][] Bcc = [[0, 0, 0], [0.5, 0.5, 0.5]];
    public static readonly double[][] Fcc = [[0, 0, 0], [0.5, 0.5, 0], [0.5, 0, 0.5], [0, 0.5, 0.5]];
}
