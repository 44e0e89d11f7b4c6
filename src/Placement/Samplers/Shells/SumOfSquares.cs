namespace Placement.Samplers.Shells;

/// <summary>Finds positive integers near given targets whose squares sum exactly to a given total.</summary>
internal static class SumOfSquares
{
    /// <summary>
    /// Depth-first search for n_i ∈ [max(1, ⌊t_i⌋ − δ), ⌈t_i⌉ + δ] with Σ n_i² = q, minimising Σ ((n_i − t_i)/t_i)²
    /// (relative, because a shell's aspect scales as N_side³). Candidates are tried nearest-to-target first; the
    /// search stops after <paramref name="budget"/> nodes and returns the best found, or null.
    /// </summary>
    public static int[]? NearTargets(long q, ReadOnlySpan<double> targets, int delta, int budget)
    {
        int l = targets.Length;
        if (l == 0) return q == 0 ? [] : null;
        var t = targets.ToArray();
        var lo = new long[l];
        var hi = new long[l];
        var minRest = new long[l + 1];
        var maxRest = new long[l + 1];
        for (int i = 0; i < l; i++)
        {
            lo[i] = Math.Max(1, (long)Math.Floor(t[i]) - delta);
            hi[i] = (long)Math.Ceiling(t[i]) + delta;
        }
        for (int i = l - 1; i >= 0; i--)
        {
            minRest[i] = minRest[i + 1] + lo[i] * lo[i];
            maxRest[i] = maxRest[i + 1] + hi[i] * hi[i];
        }
        if (q < minRest[0] || q > maxRest[0]) return null;
        var current = new int[l];
        int[]? best = null;
        double bestScore = double.PositiveInfinity;
        int visited = 0;
        Search(0, q, 0.0);
        return best;

        void Search(int i, long remaining, double score)
        {
            if (++visited > budget || score >= bestScore) return;
            if (i == l - 1)
            {
                long root = ISqrt(remaining);
                if (root * root != remaining || root < lo[i] || root > hi[i]) return;
                double e = (root - t[i]) / t[i];
                if (score + e * e < bestScore)
                {
                    bestScore = score + e * e;
                    current[i] = (int)root;
                    best = (int[])current.Clone();
                }
                return;
            }
            long centre = Math.Clamp((long)Math.Round(t[i]), lo[i], hi[i]);
            // Nearest first: centre, centre − 1, centre + 1, centre − 2, …
            for (long step = 0; ; step++)
            {
                long a = centre - (step + 1) / 2 * ((step & 1) == 1 ? 1 : -1);
                if (centre - (step + 1) / 2 < lo[i] && centre + (step + 1) / 2 > hi[i]) break;
                if (a < lo[i] || a > hi[i]) continue;
                long rest = remaining - a * a;
                if (rest < minRest[i + 1] || rest > maxRest[i + 1]) continue;
                double e = (a - t[i]) / t[i];
                current[i] = (int)a;
                Search(i + 1, rest, score + e * e);
                if (visited > budget) return;
            }
        }
    }

    /// <summary>⌊√v⌋ for v ≥ 0, exact for 64-bit integers.</summary>
    public static long ISqrt(long v)
    {
        long r = (long)Math.Sqrt(v);
        while (r * r > v) r--;
        while ((r + 1) * (r + 1) <= v) r++;
        return r;
    }
}
