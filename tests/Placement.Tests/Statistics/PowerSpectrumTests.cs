using Placement.Parallelism;
using Placement.Random;
using Placement.Statistics;

namespace Placement.Tests.Statistics;

public class PowerSpectrumTests
{
    private static (double[] X, double[] Y, double[] Z) Lattice(int side, double sigma, ulong seed)
    {
        int n = side * side * side;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var rng = new KeyedRandom(seed, 0);
        int p = 0;
        for (int i = 0; i < side; i++)
            for (int j = 0; j < side; j++)
                for (int k = 0; k < side; k++, p++)
                {
                    x[p] = Wrap((i + 0.5) / side + sigma * rng.NextGaussian());
                    y[p] = Wrap((j + 0.5) / side + sigma * rng.NextGaussian());
                    z[p] = Wrap((k + 0.5) / side + sigma * rng.NextGaussian());
                }
        return (x, y, z);
    }

    private static double Wrap(double v) => v - Math.Floor(v);

    [Fact]
    public void PoissonSet_HasUnitPower_AtEveryScale()
    {
        const int n = 20_000;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var rng = new KeyedRandom(5, 1);
        for (int i = 0; i < n; i++) { x[i] = rng.NextDouble(); y[i] = rng.NextDouble(); z[i] = rng.NextDouble(); }
        var s = PowerSpectrum.Measure(x, y, z, 1.0, 8);
        for (int b = 0; b < 8; b++)
        {
            // For a Poisson set each mode's S is exponentially distributed with mean 1 (common practice:
            // |sum of N unit phasors|^2 / N), so a bin mean of M modes has standard deviation 1/sqrt(M); allow 5 sigma.
            double tol = 5.0 / Math.Sqrt(s.ModeCounts[b]);
            Assert.InRange(s.Power[b], 1 - tol, 1 + tol);
        }
    }

    [Fact]
    public void PerfectLattice_HasNoPower_BelowItsReciprocalVector()
    {
        var (x, y, z) = Lattice(16, 0.0, 1);
        var s = PowerSpectrum.Measure(x, y, z, 1.0, 10);
        // A lattice of spacing 1/16 has Bragg peaks only at |n| multiple of 16 (common practice); below, S = 0 up to rounding.
        foreach (double p in s.Power) Assert.True(p < 1e-20, $"lattice power {p}");
    }

    [Fact]
    public void ShuffledLattice_FollowsOneMinusGaussianCharacteristic()
    {
        const double sigma = 0.01;
        var (x, y, z) = Lattice(20, sigma, 3);
        var s = PowerSpectrum.Measure(x, y, z, 1.0, 12);
        for (int b = 0; b < s.Power.Length; b++)
        {
            // Lattice with independent Gaussian displacements (per-axis sigma): each mode has expectation
            // S(k) = 1 - exp(-k^2 sigma^2) off the reciprocal lattice [derived from the displacement's characteristic
            // function], ~k^2 at small k as Baertschiger et al. 2007 (arXiv:cond-mat/0607396) state for shuffled
            // lattices. The expectation is averaged over exactly the modes of the bin.
            double expected = ExpectedBinMean(b + 1, sigma);
            // Each mode fluctuates like an exponential variable about its mean: 5/sqrt(M) relative is 5 sigma.
            double tol = expected * 5.0 / Math.Sqrt(s.ModeCounts[b]);
            Assert.InRange(s.Power[b], expected - tol, expected + tol);
        }
    }

    private static double ExpectedBinMean(int bin, double sigma)
    {
        double sum = 0;
        int count = 0;
        for (int nz = 0; nz <= bin; nz++)
            for (int ny = -bin; ny <= bin; ny++)
                for (int nx = -bin; nx <= bin; nx++)
                {
                    if (nz == 0 && (ny < 0 || (ny == 0 && nx <= 0))) continue;
                    double n = Math.Sqrt(nx * nx + ny * ny + nz * nz);
                    if (Math.Round(n, MidpointRounding.AwayFromZero) != bin) continue;
                    double k = 2 * Math.PI * n;
                    sum += 1 - Math.Exp(-k * k * sigma * sigma);
                    count++;
                }
        return sum / count;
    }

    [Fact]
    public void Result_IsIdentical_OnOneAndTwoThreads()
    {
        var (x, y, z) = Lattice(14, 0.02, 9);
        var one = PowerSpectrum.Measure(x, y, z, 1.0, 6, new ParallelSettings { MaxDegreeOfParallelism = 1 });
        var two = PowerSpectrum.Measure(x, y, z, 1.0, 6, new ParallelSettings { MaxDegreeOfParallelism = 2 });
        Assert.Equal(one.Power, two.Power);
    }
}
