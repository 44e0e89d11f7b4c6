using Placement.Bodies;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class TwoBodyOrbitTests
{
    // Expected values: the two-body formulas of Murray & Dermott 1999, Solar System Dynamics, ch. 2 (§2.4–2.5):
    // r = a(1 − e²)/(1 + e cos f), vis-viva v² = μ(2/r − 1/a), h = √(μa(1 − e²)), E = −μ/(2a).
    [Theory]
    [InlineData(1.0, 1.0, 0.0)]
    [InlineData(2.5, 3.0, 0.3)]
    [InlineData(0.7, 10.0, 0.9)]
    public void Orbit_PeriastronAndApastron_AreAOneMinusAndPlusE_WithVisVivaSpeeds(double mu, double a, double e)
    {
        var orbit = new TwoBodyOrbit(mu, a, e);
        var peri = orbit.StateAt(0);
        var apo = orbit.StateAt(Math.PI);
        // Relative tolerance 1e-14: a handful of roundings in closed-form expressions.
        Assert.Equal(a * (1 - e), peri.Distance, 1e-14 * a);
        Assert.Equal(a * (1 + e), apo.Distance, 1e-14 * a);
        Assert.Equal(Math.Sqrt(mu * (2 / (a * (1 - e)) - 1 / a)), peri.Speed, 1e-13 * peri.Speed);
        Assert.Equal(Math.Sqrt(mu * (2 / (a * (1 + e)) - 1 / a)), apo.Speed, 1e-13 * apo.Speed);
        // At the apsides the velocity is perpendicular to the radius vector.
        Assert.Equal(0.0, peri.X * peri.Vx + peri.Y * peri.Vy + peri.Z * peri.Vz, 1e-13 * a * peri.Speed);
        Assert.Equal(0.0, apo.X * apo.Vx + apo.Y * apo.Vy + apo.Z * apo.Vz, 1e-13 * a * apo.Speed);
        // Periastron on +x, motion counter-clockwise about +z.
        Assert.True(peri.X > 0 && peri.Vy > 0 && apo.X < 0);
    }

    [Fact]
    public void Orbit_EnergyAndAngularMomentum_AreTheSameAtEveryPhase_AndMatchTheClosedForms()
    {
        double mu = 1.7, a = 2.2, e = 0.6;
        var orbit = new TwoBodyOrbit(mu, a, e);
        double h = Math.Sqrt(mu * a * (1 - e * e));
        for (int k = 0; k < 36; k++)
        {
            double f = k * Math.PI / 18;
            var s = orbit.StateAt(f, inclination: 0.4);
            Assert.Equal(-mu / (2 * a), s.SpecificEnergy(mu), 1e-13);
            var (jx, jy, jz) = s.AngularMomentum;
            // Inclination i about x: ĵ = (0, −sin i, cos i).
            Assert.Equal(0.0, jx, 1e-13);
            Assert.Equal(-h * Math.Sin(0.4), jy, 1e-13);
            Assert.Equal(h * Math.Cos(0.4), jz, 1e-13);
            Assert.Equal(orbit.Distance(f), s.Distance, 1e-13);
            Assert.Equal(orbit.Speed(f), s.Speed, 1e-13);
        }
        Assert.Equal(2 * Math.PI * Math.Sqrt(a * a * a / mu), orbit.Period, 1e-12);
    }

    [Theory]
    [InlineData(0.0, 1.0, 0.1)]
    [InlineData(1.0, -1.0, 0.1)]
    [InlineData(1.0, 1.0, 1.0)]
    [InlineData(1.0, 1.0, -0.1)]
    public void Orbit_OutOfRangeParameters_AreRefused(double mu, double a, double e) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new TwoBodyOrbit(mu, a, e));

    [Fact]
    public void Companion_InTheCentreOfMassFrame_SharesTheRelativeOrbitInInverseMassRatio()
    {
        // Two point masses: primary 3, companion 1 at apastron of a = 4, e = 0.5, G = 1 (solar units).
        var companion = new CompanionOrbit("companion", 1.0, 4.0, 0.5).Place(3.0, UnitSystem.Solar);
        Assert.Equal(-6.0, companion.X, 1e-14); // apastron a(1 + e) on −x
        var relative = companion;
        var masses = new List<PointMass> { new("primary", 3.0, 0), companion };
        var none = new Placement.Points.PointSet(0, UnitSystem.Solar);
        CentreOfMassFrame.Shift(none, [], [], [], masses);
        // Standard two-body reduction (Murray & Dermott 1999 §2.2): x₁ = −m₂/M r, x₂ = m₁/M r, same for velocities.
        Assert.Equal(-0.25 * relative.X, masses[0].X, 1e-14);
        Assert.Equal(0.75 * relative.X, masses[1].X, 1e-14);
        Assert.Equal(-0.25 * relative.Vy, masses[0].Vy, 1e-14);
        Assert.Equal(0.75 * relative.Vy, masses[1].Vy, 1e-14);
        Assert.Throws<ArgumentException>(() => CentreOfMassFrame.Shift(none, null, null, null, [new("a", 1, 0, Vx: 1)]));
    }
}
