namespace Placement.IO;

/// <summary>Names of the body-level scalars and labels Placement writes (HDF5 group <c>/body</c>, see docs/file-formats.md).</summary>
public static class BodyNames
{
    /// <summary>HDF5 group holding the body-level values.</summary>
    public const string Group = "body";

    /// <summary>Adiabatic index γ (scalar, 1).</summary>
    public const string Gamma = "gamma";

    /// <summary>Label: where u came from, <c>ideal-gas</c> or <c>profile:NAME</c>.</summary>
    public const string EnergySource = "energy_source";

    /// <summary>Label: the quantities matched exactly, <c>density+pressure</c> or <c>density+entropy</c>.</summary>
    public const string Match = "match";

    /// <summary>Label: the point density estimate used (<c>sph</c>, <c>voronoi</c>) or <c>none</c>.</summary>
    public const string PointDensity = "point_density";

    /// <summary>rms relative deviation of the implied pressure from the profile's (scalar, 1).</summary>
    public const string PressureDeviationRms = "pressure_deviation_rms";

    /// <summary>Largest relative deviation of the implied pressure (scalar, 1).</summary>
    public const string PressureDeviationMax = "pressure_deviation_max";

    /// <summary>rms relative deviation of the implied adiabat K = P/ρ^γ (scalar, 1).</summary>
    public const string EntropyDeviationRms = "entropy_deviation_rms";

    /// <summary>Largest relative deviation of the implied adiabat (scalar, 1).</summary>
    public const string EntropyDeviationMax = "entropy_deviation_max";

    /// <summary>Gravitational energy of the points (energy).</summary>
    public const string PointsGravitationalEnergy = "points_gravitational_energy";

    /// <summary>Thermal energy Σ m u of the points (energy).</summary>
    public const string PointsThermalEnergy = "points_thermal_energy";

    /// <summary>Kinetic energy ½ Σ m v² of the points (energy).</summary>
    public const string PointsKineticEnergy = "points_kinetic_energy";

    /// <summary>Gravitational energy −G ∫ M dM / r of the profile (energy).</summary>
    public const string ProfileGravitationalEnergy = "profile_gravitational_energy";

    /// <summary>Thermal energy ∫ u dm of the profile (energy).</summary>
    public const string ProfileThermalEnergy = "profile_thermal_energy";

    /// <summary>Rotational energy ½ ∫ Ω² ϖ² dm of the profile (energy).</summary>
    public const string ProfileRotationalEnergy = "profile_rotational_energy";

    /// <summary>Potential energy Σ m Φ_core of the points in a softened central core's field (energy); only with a core.</summary>
    public const string PointsCorePotentialEnergy = "points_core_potential_energy";

    /// <summary>Potential energy ∫ Φ_core dm of the profile's gas in its softened central core's field (energy); only with a core.</summary>
    public const string ProfileCorePotentialEnergy = "profile_core_potential_energy";

    /// <summary>x of the body's centre (the profile's origin) in the file's frame after a centre-of-mass shift (length).</summary>
    public const string BodyCentreX = "body_centre_x";

    /// <summary>y of the body's centre in the file's frame (length).</summary>
    public const string BodyCentreY = "body_centre_y";

    /// <summary>z of the body's centre in the file's frame (length).</summary>
    public const string BodyCentreZ = "body_centre_z";

    /// <summary>Opening angle θ of the tree gravity, 0 for the exact sum (scalar, 1).</summary>
    public const string OpeningAngle = "tree_opening_angle";

    /// <summary>Wanted cells per pressure scale height (scalar, 1; NaN when none was set).</summary>
    public const string ResolutionThreshold = "resolution_threshold";

    /// <summary>Fewest cells per pressure scale height of the placed points (scalar, 1).</summary>
    public const string MinimumCellsPerScaleHeight = "min_cells_per_scale_height";

    /// <summary>Points needed for the threshold everywhere in the window (scalar, 1; NaN without a threshold).</summary>
    public const string PointsNeeded = "points_needed";

    /// <summary>Inner radius of the resolution window (length).</summary>
    public const string InnerRadius = "resolution_inner_radius";

    /// <summary>True for an identifier <c>[A-Za-z][A-Za-z0-9_]*</c> of at most 64 characters (HDF5 link and CSV safe).</summary>
    public static bool IsIdentifier(string? name)
    {
        if (string.IsNullOrEmpty(name) || name.Length > 64 || !char.IsAsciiLetter(name[0])) return false;
        foreach (char c in name)
            if (!char.IsAsciiLetterOrDigit(c) && c != '_') return false;
        return true;
    }
}
