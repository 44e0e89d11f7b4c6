namespace Placement.Profiles;

/// <summary>Choices for building a <see cref="TabulatedProfile"/> from rows.</summary>
public sealed record TabulatedProfileOptions
{
    /// <summary>Allow ρ = 0 at the last row (a surface where density vanishes). Default true.</summary>
    public bool AllowZeroOuterDensity { get; init; } = true;

    /// <summary>Allow a radius (or mass coordinate) to appear on two consecutive rows, marking a density step. Default true.</summary>
    public bool AllowDensitySteps { get; init; } = true;

    /// <summary>Which mass to trust when both density and enclosed mass are given. Default <see cref="MassSource.IntegratedDensity"/>.</summary>
    public MassSource MassSource { get; init; } = MassSource.IntegratedDensity;

    /// <summary>Free text recorded with the profile (e.g. the file it came from).</summary>
    public string Description { get; init; } = "";

    /// <summary>The defaults.</summary>
    public static TabulatedProfileOptions Default { get; } = new();
}
