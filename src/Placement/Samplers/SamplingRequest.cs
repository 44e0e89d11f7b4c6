using Placement.Parallelism;
using Placement.Profiles;

namespace Placement.Samplers;

/// <summary>Everything a sampler needs to place points: the profile, how many points, the mode, the seed and its parameters.</summary>
public sealed record SamplingRequest
{
    /// <summary>Creates a request for <paramref name="count"/> points following <paramref name="profile"/>.</summary>
    /// <param name="profile">Target radial profile; positions are written in its units.</param>
    /// <param name="count">Requested number of points, 1 ≤ N ≤ <see cref="Array.MaxLength"/>.</param>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is below 1 or above the largest array length.</exception>
    public SamplingRequest(IRadialProfile profile, int count)
    {
        ArgumentNullException.ThrowIfNull(profile);
        if (count < 1 || count > Array.MaxLength)
            throw new ArgumentOutOfRangeException(nameof(count), count, $"Point count must be in [1, {Array.MaxLength}].");
        Profile = profile;
        Count = count;
    }

    /// <summary>Target radial profile.</summary>
    public IRadialProfile Profile { get; }

    /// <summary>Requested number of points (samplers that cannot hit it exactly say so in their plan's notes).</summary>
    public int Count { get; }

    /// <summary>Equal-mass SPH particles or mesh-generating points; see <see cref="SamplingMode"/>.</summary>
    public SamplingMode Mode { get; init; } = SamplingMode.EqualMassParticles;

    /// <summary>Seed of every random draw; the same seed gives the same bits on any thread count.</summary>
    public ulong Seed { get; init; } = 1;

    /// <summary>Parsed sampler parameters, or null for the sampler's defaults.</summary>
    public SamplerParameterValues? Parameters { get; init; }

    /// <summary>Parallelism; <see cref="ParallelSettings.Default"/> when null. Never changes the result.</summary>
    public ParallelSettings? Parallel { get; init; }

    /// <summary>The parameters to use for <paramref name="description"/>: <see cref="Parameters"/> or the defaults.</summary>
    /// <exception cref="ArgumentException">The parameters were parsed for another sampler.</exception>
    public SamplerParameterValues ParametersFor(SamplerDescription description)
    {
        ArgumentNullException.ThrowIfNull(description);
        if (Parameters is null) return description.Defaults();
        if (!string.Equals(Parameters.Sampler, description.Name, StringComparison.OrdinalIgnoreCase))
            throw new ArgumentException($"Parameters were parsed for sampler '{Parameters.Sampler}', not '{description.Name}'.");
        return Parameters;
    }
}
