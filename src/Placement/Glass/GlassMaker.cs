using Placement.Parallelism;
using Placement.Random;

namespace Placement.Glass;

/// <summary>Makes periodic glass tiles by damped repulsive relaxation of a random start.</summary>
/// <remarks>
/// Method: start from N uniform random points in the periodic unit cube and move them down the gradient of a
/// short-range repulsive pair potential U(r) = (1 − r/h)³ for r &lt; h (h = <see cref="GlassSettings.RangeInSpacings"/> × a,
/// a = N^(−1/3)) with heavy damping (each step moves a point by s·F plus a fraction μ = <see cref="GlassSettings.Momentum"/> of its previous step), until the rms step falls below
/// the tolerance. This follows the idea of evolving a random set under a repulsive force with strong damping
/// until forces vanish (White 1994, from memory); the short-range potential and its neighbour grid are our own
/// choice. Forces are computed per point from a cell grid in a fixed order, so the result depends only on N,
/// the seed and the settings, not on the thread count.
/// </remarks>
public static class GlassMaker
{
    /// <summary>Makes a glass tile of <paramref name="count"/> points.</summary>
    /// <param name="count">Number of points, ≥ 1.</param>
    /// <param name="seed">Seed of the random start.</param>
    /// <param name="settings">Relaxation settings; defaults when null.</param>
    /// <param name="parallel">Parallelism; results identical for any setting.</param>
    /// <param name="progress">Receives the fraction of the iteration limit done.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> &lt; 1 or settings out of range.</exception>
    public static GlassTile Make(int count, ulong seed, GlassSettings? settings = null, ParallelSettings? parallel = null, IProgress<double>? progress = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        settings ??= new GlassSettings();
        if (!(settings.RangeInSpacings > 0.5)) throw new ArgumentOutOfRangeException(nameof(settings), settings.RangeInSpacings, "Range must exceed half a mean spacing.");
        ArgumentOutOfRangeException.ThrowIfNegative(settings.MaxIterations);

        var x = new double[count];
        var y = new double[count];
        var z = new double[count];
        var rng = new KeyedRandom(seed, 0x61A55);
        for (int i = 0; i < count; i++) { x[i] = rng.NextDouble(); y[i] = rng.NextDouble(); z[i] = rng.NextDouble(); }

        double a = Math.Cbrt(1.0 / count);
        double h = Math.Min(settings.RangeInSpacings * a, 0.5);
        var grid = new PeriodicCellGrid(count, h);
        var dx = new double[count];
        var dy = new double[count];
        var dz = new double[count];
        var vx = new double[count];
        var vy = new double[count];
        var vz = new double[count];
        double friction = settings.Momentum;
        // Step s·F: near equilibrium the stiffness per pair is U'' = 6(1 − r/h)/h² ~ 1/a², summed over ~a dozen
        // neighbours; s = 0.05 a² h keeps plain gradient descent stable (derived: s·k_max < 2).
        double s = 0.05 * a * a * h;
        double maxStep = settings.MaxStepInSpacings * a;
        double rmsStep = double.PositiveInfinity;
        int iteration = 0;
        var chunkSums = new double[256];
        while (iteration < settings.MaxIterations)
        {
            grid.Build(x, y, z);
            int chunk = ParallelLoop.ChunkSize(count, 1024);
            int chunks = (count + chunk - 1) / chunk;
            if (chunkSums.Length < chunks) chunkSums = new double[chunks];
            ParallelLoop.For(chunks, (parallel ?? ParallelSettings.Default) with { MinimumChunk = 1 }, (c0, c1) =>
            {
                for (int c = c0; c < c1; c++)
                {
                    double sum = 0;
                    int end = Math.Min(count, (c + 1) * chunk);
                    for (int i = c * chunk; i < end; i++)
                    {
                        var (fx, fy, fz) = Force(i, x, y, z, grid, h);
                        // Damped dynamics (heavy-ball): velocity keeps a fraction of the last step, so long-wavelength
                        // modes, which plain gradient descent relaxes slowly, settle in far fewer steps.
                        double sx = friction * vx[i] + s * fx, sy = friction * vy[i] + s * fy, sz = friction * vz[i] + s * fz;
                        double len = Math.Sqrt(sx * sx + sy * sy + sz * sz);
                        if (len > maxStep) { double f = maxStep / len; sx *= f; sy *= f; sz *= f; len = maxStep; }
                        dx[i] = sx; dy[i] = sy; dz[i] = sz;
                        vx[i] = sx; vy[i] = sy; vz[i] = sz;
                        sum += len * len;
                    }
                    chunkSums[c] = sum;
                }
            });
            double total = 0;
            for (int c = 0; c < chunks; c++) total += chunkSums[c];
            for (int i = 0; i < count; i++)
            {
                x[i] = Wrap(x[i] + dx[i]);
                y[i] = Wrap(y[i] + dy[i]);
                z[i] = Wrap(z[i] + dz[i]);
            }
            iteration++;
            rmsStep = Math.Sqrt(total / count) / a;
            progress?.Report((double)iteration / Math.Max(1, settings.MaxIterations));
            if (rmsStep < settings.Tolerance) break;
        }
        return new GlassTile(x, y, z, seed, iteration, rmsStep);
    }

    private static (double Fx, double Fy, double Fz) Force(int i, double[] x, double[] y, double[] z, PeriodicCellGrid grid, double h)
    {
        int g = grid.CellsPerSide;
        double xi = x[i], yi = y[i], zi = z[i];
        double fx = 0, fy = 0, fz = 0, h2 = h * h, invH = 1.0 / h;
        int home = grid.CellOf[i];
        int cx = home % g, cy = home / g % g, cz = home / (g * g);
        int reach = g == 1 ? 0 : 1;
        for (int oz = -reach; oz <= reach; oz++)
        {
            int kz = (cz + oz + g) % g;
            for (int oy = -reach; oy <= reach; oy++)
            {
                int ky = (cy + oy + g) % g;
                for (int ox = -reach; ox <= reach; ox++)
                {
                    int kx = (cx + ox + g) % g;
                    int c = (kz * g + ky) * g + kx;
                    for (int p = grid.CellStart[c]; p < grid.CellStart[c + 1]; p++)
                    {
                        int j = grid.Order[p];
                        if (j == i) continue;
                        double rx = MinImage(xi - x[j]), ry = MinImage(yi - y[j]), rz = MinImage(zi - z[j]);
                        double r2 = rx * rx + ry * ry + rz * rz;
                        if (r2 >= h2 || r2 == 0) continue;
                        double r = Math.Sqrt(r2);
                        double u = 1.0 - r * invH;
                        double mag = 3.0 * u * u * invH / r;
                        fx += mag * rx; fy += mag * ry; fz += mag * rz;
                    }
                }
            }
        }
        return (fx, fy, fz);
    }

    private static double MinImage(double d) => d - Math.Round(d);

    private static double Wrap(double v)
    {
        v -= Math.Floor(v);
        return v >= 1.0 ? 0.0 : v;
    }
}
