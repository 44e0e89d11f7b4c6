namespace Placement.Bodies;

/// <summary>Total mass, mass-weighted mean position and velocity of a system of gas points and point masses.</summary>
/// <param name="Mass">Total mass, mass units.</param>
/// <param name="X">Centre of mass x, length units.</param>
/// <param name="Y">Centre of mass y, length units.</param>
/// <param name="Z">Centre of mass z, length units.</param>
/// <param name="Vx">Centre-of-mass velocity x (total momentum / total mass), length/time units.</param>
/// <param name="Vy">Centre-of-mass velocity y, length/time units.</param>
/// <param name="Vz">Centre-of-mass velocity z, length/time units.</param>
public readonly record struct CentreOfMass(double Mass, double X, double Y, double Z, double Vx, double Vy, double Vz)
{
    /// <summary>|centre of mass|, length units.</summary>
    public double Offset => Math.Sqrt(X * X + Y * Y + Z * Z);

    /// <summary>|total momentum| = M |v_cm|, mass·length/time units.</summary>
    public double Momentum => Mass * Math.Sqrt(Vx * Vx + Vy * Vy + Vz * Vz);
}
