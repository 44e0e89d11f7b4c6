namespace Placement.Bodies.Background;

/// <summary>What the background medium came to, for reports (lengths, masses, densities in the point set's units).</summary>
/// <param name="Points">Number of background points.</param>
/// <param name="Layer">Their layer index (<see cref="Points.PointLayers.Background"/>).</param>
/// <param name="Box">The box in the final frame, with density and pressure.</param>
/// <param name="Mass">Total mass of the background points.</param>
/// <param name="ExpectedMass">ρ_bg (V_box − 4πR³/3).</param>
/// <param name="SurfaceSpacing">Spacing of the first shell (the body's outermost spacing unless given).</param>
/// <param name="InnerRadius">Radius of the first shell about the body's centre (the body radius is below it).</param>
/// <param name="OuterSpacing">Spacing of the outermost shell with points in the box.</param>
/// <param name="Shells">Number of shells with points in the box.</param>
/// <param name="BodyCellVolumeRatio">Σ volume of the body's cells in the joint tessellation / (4π/3)R³: 1 when the surface neither gapes nor overlaps.</param>
public sealed record BackgroundSummary(int Points, int Layer, BackgroundBox Box, double Mass, double ExpectedMass,
    double SurfaceSpacing, double InnerRadius, double OuterSpacing, int Shells, double BodyCellVolumeRatio);
