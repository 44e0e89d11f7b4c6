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
        var (lo, hi, minRest, maxRest) = Windows(t, _ => delta);
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
            for (long step = 0; NextCandidate(centre, ref step, i, remaining, lo, hi, minRest, maxRest, out long a, out long rest); step++)
            {
                double e = (a - t[i]) / t[i];
                current[i] = (int)a;
                Search(i + 1, rest, score + e * e);
                if (visited > budget) return;
            }
        }
    }

    /// <summary>
    /// Search windows n_i ∈ [max(1, ⌊t_i⌋ − δ_i), ⌈t_i⌉ + δ_i] with δ_i = <paramref name="delta"/>(t_i), and the least and
    /// largest Σ n_j² over j ≥ i (index i of MinRest/MaxRest, length l + 1) for pruning a search that fixes n_0, n_1, … in
    /// order.
    /// </summary>
    public static (long[] Lo, long[] Hi, long[] MinRest, long[] MaxRest) Windows(double[] targets, Func<double, int> delta)
    {
        int l = targets.Length;
        var lo = new long[l];
        var hi = new long[l];
        var minRest = new long[l + 1];
        var maxRest = new long[l + 1];
        for (int i = 0; i < l; i++)
        {
            int d = delta(targets[i]);
            lo[i] = Math.Max(1, (long)Math.Floor(targets[i]) - d);
            hi[i] = (long)Math.Ceiling(targets[i]) + d;
        }
        for (int i = l - 1; i >= 0; i--)
        {
            minRest[i] = minRest[i + 1] + lo[i] * lo[i];
            maxRest[i] = maxRest[i + 1] + hi[i] * hi[i];
        }
        return (lo, hi, minRest, maxRest);
    }

    /// <summary>
    /// Advances <paramref name="step"/> to the next candidate for window <paramref name="i"/> in nearest-first order around
    /// <paramref name="centre"/> (centre, centre − 1, centre + 1, centre − 2, …) that lies in the window and leaves a rest
    /// Σ the later windows can still hold; false once both sides have left the window.
    /// </summary>
    public static bool NextCandidate(long centre, ref long step, int i, long remaining, long[] lo, long[] hi, long[] minRest, long[] maxRest, out long a, out long rest)
    {
        for (; ; step++)
        {
            a = centre - (step + 1) / 2 * ((step & 1) == 1 ? 1 : -1);
            rest = 0;
            if (centre - (step + 1) / 2 < lo[i] && centre + (step + 1) / 2 > hi[i]) return false;
            if (a < lo[i] || a > hi[i]) continue;
            rest = remaining - a * a;
            if (rest >= minRest[i + 1] && rest <= maxRest[i + 1]) return true;
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
