namespace Placement.Points;

/// <summary>What produced a point set, written into every output file.</summary>
public sealed record Provenance
{
    /// <summary>Catalogue name of the sampler, e.g. <c>healpix-shells</c>.</summary>
    public string Sampler { get; init; } = "";

    /// <summary>Sampler parameters as name → invariant-culture text.</summary>
    public IReadOnlyDictionary<string, string> Parameters { get; init; } = new Dictionary<string, string>();

    /// <summary>Random seed used.</summary>
    public ulong Seed { get; init; }

    /// <summary>Fingerprint of the profile the points were placed for.</summary>
    public string ProfileFingerprint { get; init; } = "";

    /// <summary>Informational version of the Placement library that made the points.</summary>
    public string LibraryVersion { get; init; } = LibraryInfo.Version;
}
