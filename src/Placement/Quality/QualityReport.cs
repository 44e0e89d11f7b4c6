namespace Placement.Quality;

/// <summary>
/// How well a point set reproduces its target profile, measured on its Voronoi cells; with the same numbers for a
/// Poisson (uniform random, equal N) baseline when one was given. Serialises to JSON with <see cref="QualityJson"/>.
/// </summary>
/// <param name="PointCount">Number of points.</param>
/// <param name="ProfileFingerprint">Fingerprint of the target profile.</param>
/// <param name="Domain">The tessellation domain, as text.</param>
/// <param name="LengthUnit">Name of the length unit.</param>
/// <param name="MassUnit">Name of the mass unit.</param>
/// <param name="MassSource">Where m_i came from: "point masses" or "equal shares of the profile mass".</param>
/// <param name="CellsOutsideProfile">Cells whose generator lies where ρ_target = 0 (left out of the log statistics).</param>
/// <param name="LogRatio">Distribution of ln(V ρ_target / m).</param>
/// <param name="LogRatioByRegion">ln(V ρ_target / m) for the body and the surface layer apart (split as for the SPH check).</param>
/// <param name="LogRatioHistogram">Histogram of ln(V ρ_target / m).</param>
/// <param name="RadialDensity">Voronoi against target density in equal-mass bins.</param>
/// <param name="EnclosedMass">Point mass inside r against M(r).</param>
/// <param name="Regularity">Moving-mesh regularity of the cells.</param>
/// <param name="Sph">SPH kernel density against the target, or null when switched off.</param>
/// <param name="PerPointLogRatio">ln(V ρ_target / m) per point (NaN outside the profile), or null when not kept.</param>
/// <param name="Baseline">The same report for the baseline set, or null.</param>
public sealed record QualityReport(
    int PointCount,
    string ProfileFingerprint,
    string Domain,
    string LengthUnit,
    string MassUnit,
    string MassSource,
    int CellsOutsideProfile,
    LogRatioStatistics LogRatio,
    LogRatioSplit LogRatioByRegion,
    Histogram LogRatioHistogram,
    RadialDensityComparison RadialDensity,
    EnclosedMassComparison EnclosedMass,
    RegularityStatistics Regularity,
    SphDensityComparison? Sph,
    double[]? PerPointLogRatio,
    QualityReport? Baseline);
