using Placement.Geometry;
using Placement.Random;
using Placement.Samplers.Healpix;

namespace Placement.Samplers.Shells;

/// <summary>
/// The same equal-mass shells with one point uniformly at random in each of 12 N_side² equal-area strata, then
/// the shell's random rotation. Catalogue name <c>stratified-shells</c>.
/// </summary>
/// <remarks>
/// Strata: HEALPix ring i's equal-area band z ∈ [z_bottom, z_top] (bounded by the cumulative pixel count, so each
/// band's area is 4π × pixels/N_pix) cut into the ring's azimuth sectors [φ_j − Δφ/2, φ_j + Δφ/2]. Since area is
/// dz dφ on the unit sphere, a point uniform in (z, φ) within a stratum is uniform on it, and the set is a
/// jittered (stratified) sample of the sphere. Ring geometry: Górski et al. 2005.
/// </remarks>
public sealed class StratifiedShellSampler : ShellSampler
{
    /// <inheritdoc />
    public override string Name => "stratified-shells";

    /// <inheritdoc />
    protected override string Summary =>
        "Equal-mass shells with one point jittered uniformly inside each equal-area stratum of the shell (HEALPix ring bands cut into sectors).";

    /// <inheritdoc />
    protected override void FillShell(ShellPlan plan, int shell, in Rotation3 rotation,
        ref KeyedRandom random, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var layout = plan.Layout;
        int nSide = layout.NSide[shell];
        double radius = layout.PointRadius[shell];
        int rings = 4 * nSide - 1;
        for (int i = 1; i <= rings; i++)
        {
            var ring = HealpixGeometry.RingUnchecked(nSide, i);
            int first = (int)ring.FirstPixel;
            double height = ring.ZTop - ring.ZBottom;
            for (int j = 0; j < ring.PixelCount; j++)
            {
                double z = ring.ZTop - random.NextDouble() * height;
                double phi = ring.FirstPhi + (j + random.NextDouble() - 0.5) * ring.PhiStep;
                (double s, double c) = Math.SinCos(phi);
                double rho = Math.Sqrt(Math.Max(0, (1 - z) * (1 + z)));
                var (px, py, pz) = rotation.Apply(rho * c, rho * s, z);
                output.X[first + j] = radius * px;
                output.Y[first + j] = radius * py;
                output.Z[first + j] = radius * pz;
            }
        }
    }
}
