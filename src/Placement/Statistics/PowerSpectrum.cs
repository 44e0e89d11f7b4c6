using System.Numerics;
using Placement.Parallelism;

namespace Placement.Statistics;

/// <summary>
/// Power spectrum (structure factor) of a point set in a periodic cube, by direct Fourier sums at the box's
/// integer wave vectors.
/// </summary>
/// <remarks>
/// For N points x_j in a periodic cube of side L and wave vector k = 2π n / L (n an integer vector ≠ 0),
/// S(k) = |Σ_j exp(−i k·x_j)|² / N. A Poisson set has ⟨S⟩ = 1 at every k; superhomogeneous sets (lattices,
/// glasses) have S → 0 as k → 0 (Gabrielli, Joyce &amp; Sylos Labini 2002, PRD 65, 083523). Modes are
/// averaged in shells of integer |n| (bin b holds b − ½ ≤ |n| &lt; b + ½). Cost O(N · modes): each point's
/// phase factors exp(2πi n x/L) for n = 0…n_max are built by recurrence, then multiplied per mode; points are
/// processed in fixed chunks whose partial sums are added in chunk order, so the result does not depend on the
/// thread count.
/// </remarks>
public static class PowerSpectrum
{
    /// <summary>Measures S(k) in bins of |n| = 1 … <paramref name="maxWaveNumber"/>.</summary>
    /// <param name="x">x coordinates in [0, L).</param>
    /// <param name="y">y coordinates in [0, L).</param>
    /// <param name="z">z coordinates in [0, L).</param>
    /// <param name="boxSize">Side L of the periodic cube, same length unit as the coordinates.</param>
    /// <param name="maxWaveNumber">Largest integer |n| to measure (1 … 64).</param>
    /// <param name="settings">Parallelism; results are identical for any setting.</param>
    /// <exception cref="ArgumentException">Arrays differ in length or are empty.</exception>
    /// <exception cref="ArgumentOutOfRangeException">Box size not positive or wave number outside 1…64.</exception>
    public static PowerSpectrumResult Measure(
        ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z,
        double boxSize, int maxWaveNumber, ParallelSettings? settings = null)
    {
        if (x.Length != y.Length || x.Length != z.Length) throw new ArgumentException("x, y and z must have the same length.", nameof(x));
        if (x.Length == 0) throw new ArgumentException("At least one point is needed.", nameof(x));
        if (!(boxSize > 0) || !double.IsFinite(boxSize)) throw new ArgumentOutOfRangeException(nameof(boxSize), boxSize, "Box size must be finite and > 0.");
        if (maxWaveNumber is < 1 or > 64) throw new ArgumentOutOfRangeException(nameof(maxWaveNumber), maxWaveNumber, "Maximum wave number must lie in 1…64.");

        // Half the modes suffice (S(−k) = S(k)): nz > 0, or nz = 0 and ny > 0, or nz = ny = 0 and nx > 0.
        int nmax = maxWaveNumber;
        var modes = new List<(int X, int Y, int Z)>();
        for (int nz = 0; nz <= nmax; nz++)
            for (int ny = -nmax; ny <= nmax; ny++)
                for (int nx = -nmax; nx <= nmax; nx++)
                {
                    if (nz == 0 && (ny < 0 || (ny == 0 && nx <= 0))) continue;
                    int n2 = nx * nx + ny * ny + nz * nz;
                    if (n2 > (nmax + 0.5) * (nmax + 0.5)) continue;
                    modes.Add((nx, ny, nz));
                }
        int m = modes.Count;
        var mx = new int[m];
        var my = new int[m];
        var mz = new int[m];
        for (int i = 0; i < m; i++) (mx[i], my[i], mz[i]) = modes[i];

        int count = x.Length;
        double[] xs = x.ToArray(), ys = y.ToArray(), zs = z.ToArray();
        int chunk = ParallelLoop.ChunkSize(count, 2048);
        int chunks = (count + chunk - 1) / chunk;
        var partial = new Complex[chunks][];
        double twoPiOverL = 2.0 * Math.PI / boxSize;
        ParallelLoop.For(chunks, (settings ?? ParallelSettings.Default) with { MinimumChunk = 1 }, (c0, c1) =>
        {
            int width = 2 * nmax + 1;
            var ex = new Complex[width];
            var ey = new Complex[width];
            var ez = new Complex[nmax + 1];
            for (int c = c0; c < c1; c++)
            {
                var sums = new Complex[m];
                int end = Math.Min(count, (c + 1) * chunk);
                for (int j = c * chunk; j < end; j++)
                {
                    Phases(xs[j] * twoPiOverL, nmax, ex);
                    Phases(ys[j] * twoPiOverL, nmax, ey);
                    Complex step = Complex.FromPolarCoordinates(1.0, -zs[j] * twoPiOverL);
                    ez[0] = Complex.One;
                    for (int k = 1; k <= nmax; k++) ez[k] = ez[k - 1] * step;
                    for (int i = 0; i < m; i++)
                        sums[i] += ex[mx[i] + nmax] * ey[my[i] + nmax] * ez[mz[i]];
                }
                partial[c] = sums;
            }
        });

        var modeSum = new Complex[m];
        for (int c = 0; c < chunks; c++)
            for (int i = 0; i < m; i++) modeSum[i] += partial[c][i];

        var power = new double[nmax + 1];
        var modesPerBin = new int[nmax + 1];
        for (int i = 0; i < m; i++)
        {
            double n = Math.Sqrt((double)mx[i] * mx[i] + (double)my[i] * my[i] + (double)mz[i] * mz[i]);
            int bin = (int)Math.Round(n, MidpointRounding.AwayFromZero);
            if (bin < 1 || bin > nmax) continue;
            double s = modeSum[i].Real * modeSum[i].Real + modeSum[i].Imaginary * modeSum[i].Imaginary;
            power[bin] += s / count;
            modesPerBin[bin]++;
        }
        var k = new double[nmax];
        var p = new double[nmax];
        var counts = new int[nmax];
        for (int b = 1; b <= nmax; b++)
        {
            k[b - 1] = b * twoPiOverL;
            counts[b - 1] = modesPerBin[b];
            p[b - 1] = modesPerBin[b] > 0 ? power[b] / modesPerBin[b] : double.NaN;
        }
        return new PowerSpectrumResult(k, p, counts, count, boxSize);
    }

    /// <summary>exp(−i n θ) for n = −nmax … nmax into <paramref name="e"/>[n + nmax], by recurrence.</summary>
    private static void Phases(double theta, int nmax, Complex[] e)
    {
        Complex step = Complex.FromPolarCoordinates(1.0, -theta);
        Complex back = Complex.Conjugate(step);
        e[nmax] = Complex.One;
        Complex f = Complex.One, b = Complex.One;
        for (int n = 1; n <= nmax; n++)
        {
            f *= step;
            b *= back;
            e[nmax + n] = f;
            e[nmax - n] = b;
        }
    }
}
