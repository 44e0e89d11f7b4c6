using Placement.Points;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Kinetic energy of moving points and of a profile rotating with an angular velocity Ω(r).</summary>
/// <remarks>
/// Points: K = ½ Σ m_i |v_i|². Profile: T = ½ ∫ Ω² ϖ² dm with ϖ the distance from the rotation axis; for rotation on
/// spheres (Ω a function of the spherical radius) the shell average ⟨ϖ²⟩ = (2/3) r² gives T = (1/3) ∫ Ω(r)² r² dm
/// (by symmetry, standard result), integrated on equal mass panels by 4-point Gauss–Legendre. A uniform sphere in
/// solid-body rotation has T = ½ I Ω² = (1/5) M R² Ω² (standard textbook result). Units: mass·length²/time².
/// </remarks>
public static class KineticEnergy
{
    /// <summary>½ Σ m |v|² of the points, mass·length²/time² of their units.</summary>
    /// <exception cref="ArgumentException">A velocity array does not have one value per point.</exception>
    public static double OfPoints(PointSet points, double[] vx, double[] vy, double[] vz)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(vx);
        ArgumentNullException.ThrowIfNull(vy);
        ArgumentNullException.ThrowIfNull(vz);
        int n = points.Count;
        if (vx.Length != n || vy.Length != n || vz.Length != n)
            throw new ArgumentException($"Velocity components have {vx.Length}, {vy.Length}, {vz.Length} values for {n} points.", nameof(vx));
        double sum = 0;
        for (int i = 0; i < n; i++) sum += points.Mass[i] * (vx[i] * vx[i] + vy[i] * vy[i] + vz[i] * vz[i]);
        return 0.5 * sum;
    }

    /// <summary>T = (1/3) ∫ Ω(r)² r² dm of the profile rotating with <paramref name="angularVelocity"/> (1/time), mass·length²/time².</summary>
    public static double OfRotatingProfile(IRadialProfile profile, Func<double, double> angularVelocity, int panels = 2000)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(angularVelocity);
        return MassCoordinateQuadrature.Integrate(profile, (_, r) =>
        {
            double w = angularVelocity(r);
            return w * w * r * r / 3;
        }, panels);
    }
}
