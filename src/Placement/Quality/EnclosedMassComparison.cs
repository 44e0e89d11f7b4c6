namespace Placement.Quality;

/// <summary>Mass of the points inside radius r against the profile's M(r), at the equal-mass bin edges.</summary>
/// <param name="Radius">Radii, length units.</param>
/// <param name="ProfileMass">M(r), mass units.</param>
/// <param name="PointMass">Σ m_i over points with |x_i| ≤ r, mass units.</param>
/// <param name="RelativeError">PointMass / ProfileMass − 1 per radius.</param>
/// <param name="MaxErrorOfTotal">max |PointMass − ProfileMass| / M_total.</param>
/// <param name="MaxRelativeError">max |RelativeError| over the radii.</param>
public sealed record EnclosedMassComparison(
    double[] Radius,
    double[] ProfileMass,
    double[] PointMass,
    double[] RelativeError,
    double MaxErrorOfTotal,
    double MaxRelativeError);
