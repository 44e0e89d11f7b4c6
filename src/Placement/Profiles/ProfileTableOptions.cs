using Placement.Units;

namespace Placement.Profiles;

/// <summary>How to read a profile table: the column map, the units of the resulting profile and the build options.</summary>
public sealed record ProfileTableOptions
{
    /// <summary>Which columns mean what. Default: <see cref="ProfileColumnMap.Default"/>.</summary>
    public ProfileColumnMap Columns { get; init; } = ProfileColumnMap.Default;

    /// <summary>Unit system of the resulting profile; every column is converted into it. Default: cgs.</summary>
    public UnitSystem TargetUnits { get; init; } = UnitSystem.Cgs;

    /// <summary>Options for building the profile (zero surface, steps, which mass to trust).</summary>
    public TabulatedProfileOptions Profile { get; init; } = TabulatedProfileOptions.Default;

    /// <summary>The defaults.</summary>
    public static ProfileTableOptions Default { get; } = new();
}
