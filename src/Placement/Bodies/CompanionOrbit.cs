using Placement.Units;

namespace Placement.Bodies;

/// <summary>
/// A companion point mass on a bound two-body orbit about the primary body: mass, softening, semi-major axis,
/// eccentricity, the orbital phase (true anomaly) and the tilt of the orbital plane.
/// </summary>
/// <remarks>
/// <see cref="Place"/> puts the companion at the relative state of <see cref="TwoBodyOrbit"/> for μ = G(M_primary + m)
/// with the primary at rest at the origin; moving both into the centre-of-mass frame
/// (<see cref="CentreOfMassFrame.Shift"/>) then gives the primary −m/(M + m) and the companion M/(M + m) of the
/// relative state (standard two-body reduction, Murray &amp; Dermott 1999 §2.2). With several companions each is placed
/// on its own two-body orbit about the primary alone (their mutual pull and the other companions' mass are ignored: a
/// hierarchical or test-particle approximation).
/// </remarks>
/// <param name="Name">Identifier written to files (letters, digits, '_' and '-').</param>
/// <param name="Mass">Companion mass m, mass units; positive.</param>
/// <param name="SemiMajorAxis">Semi-major axis a of the relative orbit, length units; positive.</param>
/// <param name="Eccentricity">Eccentricity e, 0 ≤ e &lt; 1.</param>
/// <param name="SofteningLength">Softening length of the companion, length units; ≥ 0.</param>
/// <param name="TrueAnomaly">Orbital phase at the start, radians: 0 periastron, π apastron.</param>
/// <param name="Inclination">Tilt of the orbital plane about the x axis, radians; 0 keeps the orbit in the x–y plane.</param>
public sealed record CompanionOrbit(string Name, double Mass, double SemiMajorAxis, double Eccentricity = 0,
    double SofteningLength = 0, double TrueAnomaly = Math.PI, double Inclination = 0)
{
    /// <summary>The relative orbit about a primary of mass <paramref name="primaryMass"/> in <paramref name="units"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A mass, the semi-major axis or the eccentricity is out of range.</exception>
    public TwoBodyOrbit Orbit(double primaryMass, UnitSystem units)
    {
        ArgumentNullException.ThrowIfNull(units);
        if (!(primaryMass > 0) || !double.IsFinite(primaryMass))
            throw new ArgumentOutOfRangeException(nameof(primaryMass), primaryMass, "The primary's mass must be positive and finite.");
        if (!(Mass > 0) || !double.IsFinite(Mass))
            throw new ArgumentOutOfRangeException(nameof(primaryMass), Mass, $"Companion '{Name}': mass must be positive and finite.");
        return new TwoBodyOrbit(units.GravitationalConstant * (primaryMass + Mass), SemiMajorAxis, Eccentricity);
    }

    /// <summary>The companion as a point mass relative to the primary's centre (primary at rest at the origin).</summary>
    /// <param name="primaryMass">Mass of the primary (gas plus any core), mass units.</param>
    /// <param name="units">Unit system (gives G).</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of range.</exception>
    /// <exception cref="InvalidOperationException">The resulting point mass is invalid (bad name or softening).</exception>
    public PointMass Place(double primaryMass, UnitSystem units)
    {
        var s = Orbit(primaryMass, units).StateAt(TrueAnomaly, Inclination);
        var result = new PointMass(Name, Mass, SofteningLength, s.X, s.Y, s.Z, s.Vx, s.Vy, s.Vz);
        result.CheckValidity();
        return result;
    }
}
