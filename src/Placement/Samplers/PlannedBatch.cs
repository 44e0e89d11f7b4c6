namespace Placement.Samplers;

/// <summary>One batch of a sampling plan: a contiguous range of points filled by one call of <see cref="IPointSampler.Fill"/>.</summary>
/// <param name="Start">Index of the batch's first point in the point set.</param>
/// <param name="Count">Number of points in the batch (≥ 0).</param>
/// <param name="Layer">Shell or layer index written to every point of the batch, or −1 for none.</param>
/// <param name="MassPerPoint">Mass given to every point of the batch, in the profile's mass units.</param>
/// <param name="Radius">
/// The one radius every point of the batch lies at (a shell), in length units, or NaN when points lie at
/// different radii; when finite the driver fills the target density ρ(Radius) once per batch instead of per point.
/// </param>
/// <param name="Density">
/// Target density to give every point of the batch instead of ρ at its position, mass/length³, or NaN (the default)
/// to use the profile; e.g. the mean density of a central ball held by a single point at a cusp.
/// </param>
public readonly record struct PlannedBatch(int Start, int Count, int Layer, double MassPerPoint, double Radius, double Density = double.NaN);
