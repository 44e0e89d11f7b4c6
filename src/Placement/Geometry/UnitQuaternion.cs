using Placement.Random;

namespace Placement.Geometry;

/// <summary>A unit quaternion q = w + xi + yj + zk in double precision, used as a 3-D rotation.</summary>
/// <remarks>
/// The rotation it represents maps v to q v q*; <see cref="ToRotation"/> gives the equivalent 3×3 matrix.
/// Uniform random rotations use Shoemake's construction (K. Shoemake, "Uniform random rotations",
/// Graphics Gems III, 1992): u1, u2, u3 ~ U(0,1),
/// q = (√(1−u1) sin 2πu2, √(1−u1) cos 2πu2, √u1 sin 2πu3, √u1 cos 2πu3) as (x, y, z, w).
/// </remarks>
/// <param name="W">Scalar part.</param>
/// <param name="X">i component.</param>
/// <param name="Y">j component.</param>
/// <param name="Z">k component.</param>
public readonly record struct UnitQuaternion(double W, double X, double Y, double Z)
{
    /// <summary>The identity rotation (1, 0, 0, 0).</summary>
    public static UnitQuaternion Identity => new(1, 0, 0, 0);

    /// <summary>Creates a unit quaternion by normalising (w, x, y, z).</summary>
    /// <exception cref="ArgumentException">The components are not finite or their norm is zero.</exception>
    public static UnitQuaternion Normalise(double w, double x, double y, double z)
    {
        double n = Math.Sqrt(w * w + x * x + y * y + z * z);
        if (!double.IsFinite(n) || n == 0)
            throw new ArgumentException($"Cannot normalise quaternion ({w}, {x}, {y}, {z}); expected finite components, not all zero.");
        return new UnitQuaternion(w / n, x / n, y / n, z / n);
    }

    /// <summary>A rotation drawn uniformly (Haar measure on SO(3)) from <paramref name="random"/>; consumes three draws.</summary>
    /// <remarks>Shoemake 1992 (Graphics Gems III), see the type remarks.</remarks>
    public static UnitQuaternion Random(ref KeyedRandom random)
    {
        double u1 = random.NextDouble(), u2 = random.NextDouble(), u3 = random.NextDouble();
        double a = Math.Sqrt(1 - u1), b = Math.Sqrt(u1);
        (double s2, double c2) = Math.SinCos(2 * Math.PI * u2);
        (double s3, double c3) = Math.SinCos(2 * Math.PI * u3);
        return new UnitQuaternion(W: b * c3, X: a * s2, Y: a * c2, Z: b * s3);
    }

    /// <summary>The uniformly random rotation of stream <paramref name="key"/> under <paramref name="seed"/>.</summary>
    public static UnitQuaternion Random(ulong seed, ulong key)
    {
        var rng = new KeyedRandom(seed, key);
        return Random(ref rng);
    }

    /// <summary>The equivalent rotation matrix (standard quaternion-to-matrix formula for a unit quaternion).</summary>
    public Rotation3 ToRotation()
    {
        double ww = W * W, xx = X * X, yy = Y * Y, zz = Z * Z;
        double xy = X * Y, xz = X * Z, yz = Y * Z, wx = W * X, wy = W * Y, wz = W * Z;
        return new Rotation3(
            ww + xx - yy - zz, 2 * (xy - wz), 2 * (xz + wy),
            2 * (xy + wz), ww - xx + yy - zz, 2 * (yz - wx),
            2 * (xz - wy), 2 * (yz + wx), ww - xx - yy + zz);
    }
}
