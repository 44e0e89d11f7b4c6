namespace Placement.Parallelism;

/// <summary>The one helper through which the library runs loops in parallel.</summary>
public static class ParallelLoop
{
    /// <summary>
    /// Calls <paramref name="body"/>(start, end) over [0, <paramref name="count"/>) in chunks. Runs inline when
    /// the work is small or one worker is allowed. Chunk boundaries depend only on <paramref name="count"/> and
    /// the settings' minimum chunk, never on the thread count, so a body that writes only its own range gives
    /// identical bits on any number of threads.
    /// </summary>
    /// <param name="count">Number of items, ≥ 0.</param>
    /// <param name="settings">Parallelism settings; <see cref="ParallelSettings.Default"/> when null.</param>
    /// <param name="body">Work on the half-open range [start, end).</param>
    public static void For(int count, ParallelSettings? settings, Action<int, int> body)
    {
        ArgumentNullException.ThrowIfNull(body);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        settings ??= ParallelSettings.Default;
        if (count == 0) return;
        int chunk = ChunkSize(count, settings.MinimumChunk);
        int chunks = (count + chunk - 1) / chunk;
        if (chunks == 1 || settings.EffectiveDegree == 1)
        {
            for (int c = 0; c < chunks; c++) body(c * chunk, Math.Min(count, (c + 1) * chunk));
            return;
        }
        Parallel.For(0, chunks, new ParallelOptions { MaxDegreeOfParallelism = settings.EffectiveDegree },
            c => body(c * chunk, Math.Min(count, (c + 1) * chunk)));
    }

    /// <summary>
    /// Chunk size for <paramref name="count"/> items: at least <paramref name="minimumChunk"/>, and at most
    /// about 256 chunks so scheduling overhead stays small. Independent of the thread count.
    /// </summary>
    public static int ChunkSize(int count, int minimumChunk)
    {
        int min = Math.Max(1, minimumChunk);
        long byCount = ((long)count + 255) / 256;
        return (int)Math.Max(min, byCount);
    }
}
