namespace Placement.Parallelism;

/// <summary>How much parallelism a library call may use.</summary>
/// <remarks>
/// Results never depend on these settings: work is split into chunks whose boundaries depend only on the
/// problem size and <see cref="MinimumChunk"/>, and randomness is keyed by point or shell index.
/// </remarks>
public sealed record ParallelSettings
{
    /// <summary>Maximum worker threads; −1 means one per processor.</summary>
    public int MaxDegreeOfParallelism { get; init; } = -1;

    /// <summary>Smallest number of items worth handing to a worker; smaller jobs run inline.</summary>
    public int MinimumChunk { get; init; } = 4096;

    /// <summary>Defaults: all processors, chunks of at least 4096 items.</summary>
    public static ParallelSettings Default { get; } = new();

    /// <summary>Everything on the calling thread.</summary>
    public static ParallelSettings Sequential { get; } = new() { MaxDegreeOfParallelism = 1 };

    /// <summary>The effective number of workers.</summary>
    public int EffectiveDegree => MaxDegreeOfParallelism <= 0 ? Environment.ProcessorCount : MaxDegreeOfParallelism;
}
