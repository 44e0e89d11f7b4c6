using Placement.Parallelism;
using Placement.Points;

namespace Placement.Bodies;

/// <summary>
/// Measures the centre of mass of gas points plus point masses, and moves the whole system into its centre-of-mass
/// frame (mass-weighted position and total momentum zero).
/// </summary>
/// <remarks>
/// X_cm = Σ m_i x_i / M and V_cm = Σ m_i v_i / M over every gas point and every point mass (common practice). Sums run in
/// fixed chunks of the points (boundaries from the count only, <see cref="ParallelLoop"/>) whose partial sums are added
/// in order, so the result is the same on any number of threads. <see cref="Shift"/> subtracts X_cm and V_cm from
/// every position and velocity and then repeats the measurement and the subtraction once, so what is left is the
/// rounding of the last subtraction: |Σ m x| / (M max|x|) and |Σ m v| / (M max|v|) of order 1e-16 per point.
/// </remarks>
public static class CentreOfMassFrame
{
    /// <summary>The centre of mass of the gas points and the point masses.</summary>
    /// <param name="points">Gas points (positions and masses).</param>
    /// <param name="vx">Gas velocity x per point, or null when the gas is at rest (then <paramref name="vy"/>, <paramref name="vz"/> are ignored).</param>
    /// <param name="vy">Gas velocity y.</param>
    /// <param name="vz">Gas velocity z.</param>
    /// <param name="pointMasses">Point masses travelling with the gas (same units).</param>
    /// <param name="parallel">Parallelism; the result does not depend on it.</param>
    /// <exception cref="ArgumentException">Velocity arrays of the wrong length, or a zero total mass.</exception>
    public static CentreOfMass Measure(PointSet points, double[]? vx, double[]? vy, double[]? vz, IReadOnlyList<PointMass> pointMasses, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(pointMasses);
        CheckVelocities(points, vx, vy, vz);
        int n = points.Count;
        var settings = parallel ?? ParallelSettings.Default;
        int chunk = ParallelLoop.ChunkSize(n, settings.MinimumChunk);
        int chunks = n == 0 ? 0 : (n + chunk - 1) / chunk;
        var partial = new double[chunks * 7];
        var x = points.X; var y = points.Y; var z = points.Z; var m = points.Mass;
        ParallelLoop.For(n, settings, (s, e) =>
        {
            double sm = 0, sx = 0, sy = 0, sz = 0, px = 0, py = 0, pz = 0;
            for (int i = s; i < e; i++)
            {
                double mi = m[i];
                sm += mi; sx += mi * x[i]; sy += mi * y[i]; sz += mi * z[i];
                if (vx is not null) { px += mi * vx[i]; py += mi * vy![i]; pz += mi * vz![i]; }
            }
            int c = s / chunk * 7;
            partial[c] = sm; partial[c + 1] = sx; partial[c + 2] = sy; partial[c + 3] = sz;
            partial[c + 4] = px; partial[c + 5] = py; partial[c + 6] = pz;
        });
        var total = new double[7];
        for (int c = 0; c < chunks; c++)
            for (int k = 0; k < 7; k++) total[k] += partial[c * 7 + k];
        foreach (var p in pointMasses)
        {
            total[0] += p.Mass;
            total[1] += p.Mass * p.X; total[2] += p.Mass * p.Y; total[3] += p.Mass * p.Z;
            total[4] += p.Mass * p.Vx; total[5] += p.Mass * p.Vy; total[6] += p.Mass * p.Vz;
        }
        double mass = total[0];
        if (!(mass > 0)) throw new ArgumentException($"The system's total mass is {mass}; a centre of mass needs a positive total.", nameof(points));
        return new CentreOfMass(mass, total[1] / mass, total[2] / mass, total[3] / mass, total[4] / mass, total[5] / mass, total[6] / mass);
    }

    /// <summary>
    /// Moves gas points and point masses into the centre-of-mass frame, in place: positions and velocities lose
    /// X_cm and V_cm (measured, subtracted, measured again and subtracted again).
    /// </summary>
    /// <param name="points">Gas points; positions are changed.</param>
    /// <param name="vx">Gas velocity x (changed), or null when the gas has no velocity array: then V_cm must be zero,
    /// i.e. the point masses carry no net momentum.</param>
    /// <param name="vy">Gas velocity y.</param>
    /// <param name="vz">Gas velocity z.</param>
    /// <param name="pointMasses">Point masses; each entry is replaced by its shifted copy.</param>
    /// <param name="parallel">Parallelism; the result does not depend on it.</param>
    /// <returns>The total shift that was subtracted (the system's centre of mass before the call).</returns>
    /// <exception cref="ArgumentException">Velocity arrays of the wrong length, a zero total mass, or a net momentum with no gas velocity array to absorb it.</exception>
    public static CentreOfMass Shift(PointSet points, double[]? vx, double[]? vy, double[]? vz, IList<PointMass> pointMasses, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(pointMasses);
        var first = Measure(points, vx, vy, vz, pointMasses.AsReadOnly(), parallel);
        if (vx is null && (first.Vx != 0 || first.Vy != 0 || first.Vz != 0))
            throw new ArgumentException("The point masses carry a net momentum but the gas has no velocity array to take the opposite share.", nameof(vx));
        Subtract(points, vx, vy, vz, pointMasses, first, parallel);
        var second = Measure(points, vx, vy, vz, pointMasses.AsReadOnly(), parallel);
        if (vx is null) second = second with { Vx = 0, Vy = 0, Vz = 0 };
        Subtract(points, vx, vy, vz, pointMasses, second, parallel);
        return new CentreOfMass(first.Mass, first.X + second.X, first.Y + second.Y, first.Z + second.Z,
            first.Vx + second.Vx, first.Vy + second.Vy, first.Vz + second.Vz);
    }

    private static void Subtract(PointSet points, double[]? vx, double[]? vy, double[]? vz, IList<PointMass> pointMasses, CentreOfMass cm, ParallelSettings? parallel)
    {
        var x = points.X; var y = points.Y; var z = points.Z;
        ParallelLoop.For(points.Count, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                x[i] -= cm.X; y[i] -= cm.Y; z[i] -= cm.Z;
                if (vx is not null) { vx[i] -= cm.Vx; vy![i] -= cm.Vy; vz![i] -= cm.Vz; }
            }
        });
        for (int k = 0; k < pointMasses.Count; k++)
        {
            var p = pointMasses[k];
            pointMasses[k] = p with { X = p.X - cm.X, Y = p.Y - cm.Y, Z = p.Z - cm.Z, Vx = p.Vx - cm.Vx, Vy = p.Vy - cm.Vy, Vz = p.Vz - cm.Vz };
        }
    }

    private static void CheckVelocities(PointSet points, double[]? vx, double[]? vy, double[]? vz)
    {
        if (vx is null) return;
        if (vy is null || vz is null || vx.Length != points.Count || vy.Length != points.Count || vz.Length != points.Count)
            throw new ArgumentException($"Velocity arrays must all be given with {points.Count} values each.", nameof(vx));
    }
}
