using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Velocity fields for a placed body: rest, solid-body rotation, or rotation with a user Ω(r).</summary>
/// <remarks>
/// Rotation is about an axis through the origin along a unit vector â: v = Ω(r) â × x, with r = |x| the spherical
/// radius (so Ω(r) = constant is solid-body rotation). Velocities are in the point set's units: length per time
/// unit of its <see cref="Units.UnitSystem"/> (for <c>solar</c>, R_sun per t_dyn = √(R_sun³/(G M_sun))).
/// The break-up angular velocity of a body of mass M and radius R is Ω_crit = √(G M / R³) (a point on the equator
/// orbits at the surface; common practice).
/// </remarks>
public static class Rotation
{
    /// <summary>Ω_crit = √(G M / R³) of <paramref name="profile"/>, in 1/time of its unit system.</summary>
    public static double BreakupAngularVelocity(IRadialProfile profile)
    {
        ArgumentNullException.ThrowIfNull(profile);
        double r = profile.OuterRadius;
        return Math.Sqrt(profile.Units.GravitationalConstant * profile.TotalMass / (r * r * r));
    }

    /// <summary>v = Ω(|x|) â × x for every point.</summary>
    /// <param name="points">The points.</param>
    /// <param name="omega">Angular velocity as a function of spherical radius, 1/time units.</param>
    /// <param name="axis">Rotation axis (normalised here); +z when null.</param>
    /// <param name="parallel">Parallelism; results are identical for any setting.</param>
    /// <returns>The velocity components, length/time units.</returns>
    /// <exception cref="ArgumentException">The axis is zero or not finite.</exception>
    public static (double[] Vx, double[] Vy, double[] Vz) Velocities(PointSet points, Func<double, double> omega,
        (double X, double Y, double Z)? axis = null, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(omega);
        var (ax, ay, az) = axis ?? (0.0, 0.0, 1.0);
        double len = Math.Sqrt(ax * ax + ay * ay + az * az);
        if (!(len > 0) || !double.IsFinite(len)) throw new ArgumentException($"Rotation axis ({ax}, {ay}, {az}) must be finite and non-zero.", nameof(axis));
        ax /= len; ay /= len; az /= len;
        int n = points.Count;
        var vx = new double[n];
        var vy = new double[n];
        var vz = new double[n];
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                double w = omega(points.Radius(i));
                double x = points.X[i], y = points.Y[i], z = points.Z[i];
                vx[i] = w * (ay * z - az * y);
                vy[i] = w * (az * x - ax * z);
                vz[i] = w * (ax * y - ay * x);
            }
        });
        return (vx, vy, vz);
    }

    /// <summary>Total angular momentum Σ m x × v of the points, mass·length²/time units.</summary>
    public static (double X, double Y, double Z) AngularMomentum(PointSet points, double[] vx, double[] vy, double[] vz)
    {
        ArgumentNullException.ThrowIfNull(points);
        double jx = 0, jy = 0, jz = 0;
        for (int i = 0; i < points.Count; i++)
        {
            double m = points.Mass[i], x = points.X[i], y = points.Y[i], z = points.Z[i];
            jx += m * (y * vz[i] - z * vy[i]);
            jy += m * (z * vx[i] - x * vz[i]);
            jz += m * (x * vy[i] - y * vx[i]);
        }
        return (jx, jy, jz);
    }
}
