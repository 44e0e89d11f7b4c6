namespace Placement.IO.Hdf5;

/// <summary>Names of the groups, datasets and attributes of Placement's own HDF5 point-file layout (see docs/file-formats.md).</summary>
/// <remarks>
/// <code>
/// /                      attributes: format, format_version, point_count, unit system, provenance
/// /points/position       float64 (N, 3)  units = length unit
/// /points/mass           float64 (N)     units = mass unit
/// /points/target_density float64 (N)     units = mass/length^3
/// /points/layer          int32   (N)     units = 1
/// /points/id             int64   (N)     units = 1
/// /points/NAME           float64 (N) or (N, k): extra columns
/// /point_masses/         optional: name (k strings), mass, softening_length (k), position, velocity (k, 3)
/// /background            optional, attributes only: box_min, box_max, periodic, density, pressure, layer
/// </code>
/// Every dataset has the attributes <c>units</c> (string), <c>cgs_factor</c> (float64, NaN if unknown) and
/// <c>description</c> (string).
/// </remarks>
public static class Hdf5Layout
{
    /// <summary>Value of the root attribute <see cref="FormatAttribute"/> that marks a Placement point file.</summary>
    public const string FormatName = "placement-points";

    /// <summary>Layout version written by this library; readers accept files up to this version.</summary>
    public const int FormatVersion = 1;

    /// <summary>Root attribute holding <see cref="FormatName"/>.</summary>
    public const string FormatAttribute = "format";

    /// <summary>Root attribute holding the layout version (int32).</summary>
    public const string FormatVersionAttribute = "format_version";

    /// <summary>Root attribute holding N (int64).</summary>
    public const string PointCountAttribute = "point_count";

    /// <summary>Root attribute: unit system name.</summary>
    public const string UnitSystemAttribute = "unit_system";

    /// <summary>Root attribute: length unit name.</summary>
    public const string LengthUnitAttribute = "length_unit";

    /// <summary>Root attribute: mass unit name.</summary>
    public const string MassUnitAttribute = "mass_unit";

    /// <summary>Root attribute: time unit name.</summary>
    public const string TimeUnitAttribute = "time_unit";

    /// <summary>Root attribute: one length unit in cm (float64).</summary>
    public const string LengthInCmAttribute = "length_unit_in_cm";

    /// <summary>Root attribute: one mass unit in g (float64).</summary>
    public const string MassInGramsAttribute = "mass_unit_in_g";

    /// <summary>Root attribute: one time unit in s (float64).</summary>
    public const string TimeInSecondsAttribute = "time_unit_in_s";

    /// <summary>Root attribute: Newton's constant in these units (float64), for convenience.</summary>
    public const string GravitationalConstantAttribute = "gravitational_constant";

    /// <summary>Root attribute: sampler name.</summary>
    public const string SamplerAttribute = "sampler";

    /// <summary>Root attribute: sampler parameters as a JSON object of strings.</summary>
    public const string ParametersAttribute = "parameters";

    /// <summary>Root attribute: random seed (uint64).</summary>
    public const string SeedAttribute = "seed";

    /// <summary>Root attribute: profile fingerprint.</summary>
    public const string ProfileFingerprintAttribute = "profile_fingerprint";

    /// <summary>Root attribute: version of the library that made the points.</summary>
    public const string LibraryVersionAttribute = "library_version";

    /// <summary>Root attribute: name and version of the library that wrote the file.</summary>
    public const string WriterAttribute = "writer";

    /// <summary>Optional group holding the point masses (cores, companions), one row per point mass; absent means none.</summary>
    public const string PointMassesGroup = "point_masses";

    /// <summary>Optional group whose attributes describe a background medium (box, density, pressure); absent means none.</summary>
    public const string BackgroundGroup = "background";

    /// <summary>Group holding the per-point datasets.</summary>
    public const string PointsGroup = "points";

    /// <summary>Dataset attribute: unit name.</summary>
    public const string UnitsAttribute = "units";

    /// <summary>Dataset attribute: factor converting values to cgs (float64, NaN if unknown).</summary>
    public const string CgsFactorAttribute = "cgs_factor";

    /// <summary>Dataset attribute: one-line description.</summary>
    public const string DescriptionAttribute = "description";
}
