using Placement.Parallelism;

namespace Placement.Relaxation;

/// <summary>Helpers of the <see cref="RadialConstraint.KeepRadii"/> constraint shared by the relaxations.</summary>
internal static class SphericalSteps
{
    /// <summary>Removes from the step v its component along the position x (the radial direction).</summary>
    public static void Project(double x, double y, double z, ref double vx, ref double vy, ref double vz)
    {
        double r2 = x * x + y * y + z * z;
        if (!(r2 > 0)) return;
        double c = (vx * x + vy * y + vz * z) / r2;
        vx -= c * x; vy -= c * y; vz -= c * z;
    }

    /// <summary>Puts every point back on the sphere of its own radius (a tangential step moves it outward at second order).</summary>
    public static void BackToRadii(double[] x, double[] y, double[] z, double[] radius, ParallelSettings? parallel)
    {
        ParallelLoop.For(x.Length, parallel, (s, e) =>
        {
            for (int i = s; i < e; i++)
            {
                double r = Math.Sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
                if (r > 0) { double c = radius[i] / r; x[i] *= c; y[i] *= c; z[i] *= c; }
            }
        });
    }
}
