using Placement.Bodies;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class RotationTests
{
    [Fact]
    public void SolidBodyRotation_OfAUniformSphere_HasTheMomentOfInertiaTwoFifthsMR2()
    {
        var body = new UniformSphere(3.0, 2.0, UnitSystem.Solar);
        var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(body, 20_000) { Seed = 2 }).Points;
        double omega = 0.3 * Rotation.BreakupAngularVelocity(body);
        var (vx, vy, vz) = Rotation.Velocities(points, _ => omega);
        var (jx, jy, jz) = Rotation.AngularMomentum(points, vx, vy, vz);
        // I = (2/5) M R² for a uniform sphere (standard textbook result); the discrete shells reproduce it to ~0.5 %
        // (the outermost shell sits at its mass midpoint, not at R).
        double expected = 0.4 * 3.0 * 4.0 * omega;
        Assert.Equal(expected, jz, 0.005 * expected);
        Assert.True(Math.Abs(jx) < 1e-3 * expected && Math.Abs(jy) < 1e-3 * expected);
        // Ω_crit = √(GM/R³) with G = 1 in solar units.
        Assert.Equal(Math.Sqrt(3.0 / 8.0), Rotation.BreakupAngularVelocity(body), 14);
        for (int i = 0; i < points.Count; i += 97)
        {
            // v ⊥ x and |v| = Ω × cylindrical radius.
            double dot = vx[i] * points.X[i] + vy[i] * points.Y[i] + vz[i] * points.Z[i];
            Assert.Equal(0.0, dot, 1e-12);
            double speed = Math.Sqrt(vx[i] * vx[i] + vy[i] * vy[i] + vz[i] * vz[i]);
            Assert.Equal(omega * Math.Sqrt(points.X[i] * points.X[i] + points.Y[i] * points.Y[i]), speed, 1e-12);
        }
        Assert.Throws<ArgumentException>(() => Rotation.Velocities(points, _ => 1, (0, 0, 0)));
    }
}
