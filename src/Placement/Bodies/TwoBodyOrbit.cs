namespace Placement.Bodies;

/// <summary>
/// A bound Keplerian two-body orbit (relative orbit of a companion about a primary) given by its semi-major axis and
/// eccentricity; gives the relative position and velocity at any true anomaly.
/// </summary>
/// <remarks>
/// <para>Units: lengths in length units, the gravitational parameter μ = G(m₁ + m₂) in length³/time², velocities in
/// length/time. Formulas (Murray &amp; Dermott 1999, Solar System Dynamics, ch. 2, §2.4–2.5; standard textbook results):
/// r = a(1 − e²)/(1 + e cos f); specific angular momentum h = √(μ a (1 − e²)); radial and tangential velocity
/// ṙ = (μ/h) e sin f and r ḟ = (μ/h)(1 + e cos f), i.e. v = (μ/h)(−sin f, e + cos f, 0) in the orbital plane; vis-viva
/// v² = μ(2/r − 1/a); specific energy −μ/(2a); period 2π√(a³/μ).</para>
/// <para>Orientation: the orbit lies in the x–y plane with periastron on +x and motion counter-clockwise (angular
/// momentum along +z); an inclination i tilts the plane about the x axis (the line to periastron), so the angular
/// momentum becomes (0, −sin i, cos i).</para>
/// </remarks>
public sealed class TwoBodyOrbit
{
    /// <summary>Creates the orbit.</summary>
    /// <param name="gravitationalParameter">μ = G(m₁ + m₂), length³/time²; positive and finite.</param>
    /// <param name="semiMajorAxis">a, length units; positive and finite.</param>
    /// <param name="eccentricity">e, 0 ≤ e &lt; 1 (bound orbits only).</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public TwoBodyOrbit(double gravitationalParameter, double semiMajorAxis, double eccentricity)
    {
        if (!(gravitationalParameter > 0) || !double.IsFinite(gravitationalParameter))
            throw new ArgumentOutOfRangeException(nameof(gravitationalParameter), gravitationalParameter, "G(m1 + m2) must be positive and finite.");
        if (!(semiMajorAxis > 0) || !double.IsFinite(semiMajorAxis))
            throw new ArgumentOutOfRangeException(nameof(semiMajorAxis), semiMajorAxis, "The semi-major axis must be positive and finite.");
        if (!(eccentricity >= 0 && eccentricity < 1))
            throw new ArgumentOutOfRangeException(nameof(eccentricity), eccentricity, "The eccentricity must satisfy 0 <= e < 1 (bound orbit).");
        GravitationalParameter = gravitationalParameter;
        SemiMajorAxis = semiMajorAxis;
        Eccentricity = eccentricity;
    }

    /// <summary>μ = G(m₁ + m₂), length³/time².</summary>
    public double GravitationalParameter { get; }

    /// <summary>Semi-major axis a, length units.</summary>
    public double SemiMajorAxis { get; }

    /// <summary>Eccentricity e.</summary>
    public double Eccentricity { get; }

    /// <summary>Periastron distance a(1 − e), length units.</summary>
    public double Periastron => SemiMajorAxis * (1 - Eccentricity);

    /// <summary>Apastron distance a(1 + e), length units.</summary>
    public double Apastron => SemiMajorAxis * (1 + Eccentricity);

    /// <summary>Specific angular momentum h = √(μ a (1 − e²)), length²/time.</summary>
    public double SpecificAngularMomentum => Math.Sqrt(GravitationalParameter * SemiMajorAxis * (1 - Eccentricity * Eccentricity));

    /// <summary>Specific orbital energy −μ/(2a), length²/time².</summary>
    public double SpecificEnergy => -GravitationalParameter / (2 * SemiMajorAxis);

    /// <summary>Orbital period 2π√(a³/μ), time units.</summary>
    public double Period => 2 * Math.PI * Math.Sqrt(SemiMajorAxis * SemiMajorAxis * SemiMajorAxis / GravitationalParameter);

    /// <summary>Separation r(f) = a(1 − e²)/(1 + e cos f) at true anomaly <paramref name="trueAnomaly"/> (radians), length units.</summary>
    public double Distance(double trueAnomaly) =>
        SemiMajorAxis * (1 - Eccentricity * Eccentricity) / (1 + Eccentricity * Math.Cos(trueAnomaly));

    /// <summary>Relative speed from vis-viva, √(μ(2/r − 1/a)), at true anomaly <paramref name="trueAnomaly"/> (radians), length/time.</summary>
    public double Speed(double trueAnomaly) =>
        Math.Sqrt(GravitationalParameter * (2 / Distance(trueAnomaly) - 1 / SemiMajorAxis));

    /// <summary>Relative position and velocity (companion minus primary) at true anomaly <paramref name="trueAnomaly"/>.</summary>
    /// <param name="trueAnomaly">f in radians: 0 at periastron, π at apastron.</param>
    /// <param name="inclination">Tilt of the orbital plane about the x axis, radians (0: x–y plane).</param>
    /// <exception cref="ArgumentException">An angle is not finite.</exception>
    public OrbitalState StateAt(double trueAnomaly, double inclination = 0)
    {
        if (!double.IsFinite(trueAnomaly) || !double.IsFinite(inclination))
            throw new ArgumentException($"Angles must be finite (true anomaly {trueAnomaly}, inclination {inclination}).", nameof(trueAnomaly));
        double r = Distance(trueAnomaly);
        double c = Math.Cos(trueAnomaly), s = Math.Sin(trueAnomaly);
        double k = GravitationalParameter / SpecificAngularMomentum;
        double x = r * c, y = r * s, vx = -k * s, vy = k * (Eccentricity + c);
        double ci = Math.Cos(inclination), si = Math.Sin(inclination);
        return new OrbitalState(x, y * ci, y * si, vx, vy * ci, vy * si);
    }
}
