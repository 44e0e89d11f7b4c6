namespace Placement.Quality;

/// <summary>A fixed-range histogram (for plotting).</summary>
/// <param name="Edges">Bin edges, length bins + 1.</param>
/// <param name="Counts">Counts per bin.</param>
/// <param name="Below">Values below the first edge.</param>
/// <param name="Above">Values at or above the last edge.</param>
public sealed record Histogram(double[] Edges, int[] Counts, int Below, int Above)
{
    /// <summary>Counts the values into <paramref name="bins"/> equal bins over [lo, hi).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="bins"/> &lt; 1 or hi ≤ lo.</exception>
    public static Histogram Of(ReadOnlySpan<double> values, double lo, double hi, int bins)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(bins, 1);
        if (!(hi > lo)) throw new ArgumentOutOfRangeException(nameof(hi), hi, "Upper edge must exceed the lower edge.");
        var edges = new double[bins + 1];
        for (int k = 0; k <= bins; k++) edges[k] = lo + (hi - lo) * k / bins;
        var counts = new int[bins];
        int below = 0, above = 0;
        foreach (double v in values)
        {
            if (double.IsNaN(v)) continue;
            if (v < lo) { below++; continue; }
            if (v >= hi) { above++; continue; }
            counts[Math.Min(bins - 1, (int)((v - lo) / (hi - lo) * bins))]++;
        }
        return new Histogram(edges, counts, below, above);
    }
}
