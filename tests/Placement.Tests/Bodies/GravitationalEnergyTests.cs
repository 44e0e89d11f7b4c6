using Placement.Bodies;
using Placement.Parallelism;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class GravitationalEnergyTests
{
    [Theory]
    // Polytrope binding energy W = −3GM²/((5 − n)R) (Chandrasekhar 1939; standard textbook result, e.g. Kippenhahn,
    // Weigert & Weiss, Stellar Structure and Evolution, §19).
    [InlineData(1.5)]
    [InlineData(3.0)]
    public void Polytrope_ProfileAndPlacedPoints_MatchTheClosedForm(double n)
    {
        var body = new Polytrope(n, 2.0, 1.5, UnitSystem.Solar);
        double expected = -3.0 * 4.0 / ((5 - n) * 1.5);
        Assert.Equal(expected, GravitationalEnergy.OfProfile(body), 1e-4 * Math.Abs(expected));
        var points = PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(body, 8000) { Seed = 3 }).Points;
        double w = GravitationalEnergy.OfPoints(points);
        // Equal-mass points leave out each point's self-energy (~ G m² / spacing per point): relative O(N^(-2/3)) ≈ 0.3 %
        // at N = 8000 here; allow 2 %.
        Assert.Equal(expected, w, 0.02 * Math.Abs(expected));
    }

    [Fact]
    public void PairwiseEnergy_IsIdenticalOnOneAndTwoThreads_AndExactForTwoPoints()
    {
        var body = new PlummerSphere(1.0, 0.3, 2.0, UnitSystem.Solar);
        var points = PointSampling.Place(new PoissonSampler(), new SamplingRequest(body, 3000) { Seed = 8 }).Points;
        Assert.Equal(GravitationalEnergy.OfPoints(points, new ParallelSettings { MaxDegreeOfParallelism = 1 }),
                     GravitationalEnergy.OfPoints(points, new ParallelSettings { MaxDegreeOfParallelism = 2 }));
        var pair = new Placement.Points.PointSet(2, UnitSystem.Solar);
        pair.X[1] = 2; pair.Mass[0] = 3; pair.Mass[1] = 5;
        Assert.Equal(-7.5, GravitationalEnergy.OfPoints(pair), 14); // −G m1 m2 / d with G = 1
    }
}

public class ThermalEnergyTests
{
    [Theory]
    [InlineData(1.0)]
    [InlineData(3.0)]
    public void Polytrope_SatisfiesTheVirialTheorem(double n)
    {
        // Hydrostatic equilibrium ⇒ 3∫P dV = −W (virial theorem, standard textbook result).
        var body = new Polytrope(n, 1.0, 1.0, UnitSystem.Solar);
        Assert.Equal(1.0, ThermalEnergy.VirialRatio(body), 1e-4);
        Assert.Throws<InvalidOperationException>(() => ThermalEnergy.OfProfile(new UniformSphere(1, 1), 5.0 / 3.0));
    }

    [Fact]
    public void InventedDemoStar_IsInHydrostaticEquilibrium()
    {
        // The demo star's pressure is integrated from hydrostatic equilibrium, so the virial theorem must hold too.
        Assert.Equal(1.0, ThermalEnergy.VirialRatio(DemoBodies.TwoZoneStar()), 1e-3);
    }
}
