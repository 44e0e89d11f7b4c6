using System.Runtime.CompilerServices;
using Placement.Random;

namespace Placement.Geometry;

/// <summary>Random directions on the unit sphere.</summary>
public static class UnitSphere
{
    /// <summary>
    /// A direction uniform on the unit sphere from two draws: z = 1 − 2u, φ = 2πv (area element dz dφ, Archimedes'
    /// hat-box theorem), sin θ = √((1 − z)(1 + z)).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static (double X, double Y, double Z) RandomDirection(ref KeyedRandom random)
    {
        double z = 1 - 2 * random.NextDouble();
        (double s, double c) = Math.SinCos(2 * Math.PI * random.NextDouble());
        double sinTheta = Math.Sqrt((1 - z) * (1 + z));
        return (sinTheta * c, sinTheta * s, z);
    }
}
