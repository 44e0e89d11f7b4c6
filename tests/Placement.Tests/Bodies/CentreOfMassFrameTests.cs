using Placement.Bodies;
using Placement.Parallelism;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class CentreOfMassFrameTests
{
    [Fact]
    public void Shift_GasPlusCompanionAndCore_LeavesPositionAndMomentumZeroToRounding_OnAnyThreadCount()
    {
        var body = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        var results = new List<(double[] X, double[] Vx, PointMass Companion)>();
        foreach (int threads in new[] { 1, 2 })
        {
            var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(body, 20_000) { Seed = 3 }).Points;
            var (vx, vy, vz) = Rotation.Velocities(points, _ => 0.2);
            var masses = new List<PointMass> { new("core", 0.1, 0.05) };
            masses.Add(new CompanionOrbit("companion", 0.6, 3.0, 0.4).Place(1.1, UnitSystem.Solar));
            var parallel = new ParallelSettings { MaxDegreeOfParallelism = threads, MinimumChunk = 1000 };
            var shift = CentreOfMassFrame.Shift(points, vx, vy, vz, masses, parallel);
            Assert.True(shift.Offset > 1, "the companion moves the centre of mass by ~ m a(1+e)/M");
            var after = CentreOfMassFrame.Measure(points, vx, vy, vz, masses, parallel);
            // Residuals are rounding: a few ulps of the largest position (a(1+e) = 4.2) and speed, per unit mass.
            double scaleX = 4.2, scaleV = masses[1].Vy;
            Assert.True(after.Offset < 1e-14 * scaleX, $"COM residual {after.Offset}");
            Assert.True(after.Momentum < 1e-14 * after.Mass * Math.Abs(scaleV), $"momentum residual {after.Momentum}");
            results.Add((points.X, vx, masses[1]));
        }
        // Same bits on one and two threads.
        Assert.Equal(results[0].X, results[1].X);
        Assert.Equal(results[0].Vx, results[1].Vx);
        Assert.Equal(results[0].Companion, results[1].Companion);
    }
}
