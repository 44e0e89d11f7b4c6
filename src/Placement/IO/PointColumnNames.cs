namespace Placement.IO;

/// <summary>Names of the per-point columns that Placement itself writes, and of the core fields every file has.</summary>
/// <remarks>Using these names lets readers (and later tools) find a quantity without guessing. All are identifiers.</remarks>
public static class PointColumnNames
{
    /// <summary>Point identifier (int64), core field.</summary>
    public const string Id = "id";

    /// <summary>Position (3 components, length), core field.</summary>
    public const string Position = "position";

    /// <summary>Point mass (mass), core field.</summary>
    public const string Mass = "mass";

    /// <summary>Target density of the profile at the point (mass/length³), core field.</summary>
    public const string TargetDensity = "target_density";

    /// <summary>Shell or layer index (int32, −1 where none), core field.</summary>
    public const string Layer = "layer";

    /// <summary>Voronoi cell volume (length³).</summary>
    public const string CellVolume = "cell_volume";

    /// <summary>Mass of the Voronoi cell under the target profile (mass).</summary>
    public const string CellMass = "cell_mass";

    /// <summary>SPH kernel density estimate (mass/length³).</summary>
    public const string SphDensity = "sph_density";

    /// <summary>SPH smoothing length (length).</summary>
    public const string SmoothingLength = "smoothing_length";

    /// <summary>Specific internal energy (length²/time²).</summary>
    public const string InternalEnergy = "internal_energy";

    /// <summary>Pressure of the profile at the point's radius (mass/(length·time²)).</summary>
    public const string Pressure = "pressure";

    /// <summary>Temperature of the profile at the point's radius (K).</summary>
    public const string Temperature = "temperature";

    /// <summary>Velocity (3 components, length/time).</summary>
    public const string Velocity = "velocity";

    /// <summary>Names reserved for the core fields; extra columns may not use them (nor <c>x</c>, <c>y</c>, <c>z</c>).</summary>
    public static IReadOnlySet<string> Reserved { get; } =
        new HashSet<string>(StringComparer.OrdinalIgnoreCase) { Id, Position, Mass, TargetDensity, Layer, "x", "y", "z" };
}
