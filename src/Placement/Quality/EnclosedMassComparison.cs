namespace Placement.Quality;

/// <summary>Mass of the points inside radius r against the profile's M(r), at the radius of every point.</summary>
/// <remarks>
/// Points are sorted by radius; at the radius of a group of points that share it to 1e-10 relative (a shell), the points inside
/// count fully and the group counts half (the symmetric convention: a shell placed at its mass midpoint then
/// matches exactly). The maxima run over every point; the arrays hold up to 200 of those radii, evenly spaced in
/// rank, for plotting.
/// </remarks>
/// <param name="Radius">Radii, length units.</param>
/// <param name="ProfileMass">M(r), mass units.</param>
/// <param name="PointMass">Σ m_i over points with |x_i| &lt; r plus half the points at r, mass units.</param>
/// <param name="RelativeError">PointMass / ProfileMass − 1 per radius.</param>
/// <param name="MaxErrorOfTotal">max |PointMass − ProfileMass| / M_total.</param>
/// <param name="MaxRelativeError">max |RelativeError| over the radii of every point with at least <see cref="QualityChecker.RelativeErrorMinimumPoints"/> (100) points inside.</param>
public sealed record EnclosedMassComparison(
    double[] Radius,
    double[] ProfileMass,
    double[] PointMass,
    double[] RelativeError,
    double MaxErrorOfTotal,
    double MaxRelativeError);
