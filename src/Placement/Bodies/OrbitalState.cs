namespace Placement.Bodies;

/// <summary>Position and velocity of one body relative to another (x₂ − x₁, v₂ − v₁), in length and length/time units.</summary>
/// <param name="X">Relative position x, length units.</param>
/// <param name="Y">Relative position y, length units.</param>
/// <param name="Z">Relative position z, length units.</param>
/// <param name="Vx">Relative velocity x, length/time units.</param>
/// <param name="Vy">Relative velocity y, length/time units.</param>
/// <param name="Vz">Relative velocity z, length/time units.</param>
public readonly record struct OrbitalState(double X, double Y, double Z, double Vx, double Vy, double Vz)
{
    /// <summary>Separation |r|, length units.</summary>
    public double Distance => Math.Sqrt(X * X + Y * Y + Z * Z);

    /// <summary>Relative speed |v|, length/time units.</summary>
    public double Speed => Math.Sqrt(Vx * Vx + Vy * Vy + Vz * Vz);

    /// <summary>Specific angular momentum r × v, length²/time units.</summary>
    public (double X, double Y, double Z) AngularMomentum => (Y * Vz - Z * Vy, Z * Vx - X * Vz, X * Vy - Y * Vx);

    /// <summary>Specific orbital energy v²/2 − μ/r for gravitational parameter <paramref name="mu"/> = G(m₁ + m₂), length²/time² units.</summary>
    public double SpecificEnergy(double mu) => 0.5 * (Vx * Vx + Vy * Vy + Vz * Vz) - mu / Distance;
}
