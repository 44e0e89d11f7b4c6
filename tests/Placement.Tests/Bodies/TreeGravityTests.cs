using Placement.Bodies;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class TreeGravityTests
{
    private static PointSet Place(IRadialProfile body, string sampler, int n, ulong seed) =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create(sampler), new SamplingRequest(body, n) { Seed = seed }).Points;

    [Theory]
    // A concentrated body (n = 3 polytrope, ρ_c/ρ̄ = 54) on shells and a cored halo with Poisson points.
    [InlineData("polytrope", "healpix-shells")]
    [InlineData("plummer", "poisson")]
    public void TreeEnergy_AtThetaHalf_AgreesWithThePairwiseSum(string kind, string sampler)
    {
        IRadialProfile body = kind == "polytrope" ? new Polytrope(3, 1, 1, UnitSystem.Solar) : new PlummerSphere(1, 0.2, 3, UnitSystem.Solar);
        var points = Place(body, sampler, 20_000, 11);
        double exact = GravitationalEnergy.OfPoints(points);
        double tree = GravitationalEnergy.OfPointsByTree(points, 0.5);
        // Our own measurement (this test, quadrupole nodes, θ = 0.5): relative error −9.9e-7 (polytrope shells) and −5.4e-7
        // (Plummer, Poisson points); the tolerance 1e-5 leaves a factor of 10.
        Assert.True(Math.Abs(tree / exact - 1) < 1e-5, $"tree {tree} pairwise {exact}: {tree / exact - 1:E2}");
        // θ = 0 opens every node: the pairwise sum in another order, equal to rounding.
        Assert.Equal(exact, GravitationalEnergy.OfPointsByTree(points, 0), 1e-12 * Math.Abs(exact));
    }

    [Fact]
    public void TreeEnergy_IsBitIdenticalOnOneAndTwoThreads_AndTheTreeIsConsistent()
    {
        var body = DemoBodies.TwoZoneStar();
        var points = Place(body, "poisson", 30_000, 4);
        double one = GravitationalEnergy.OfPointsByTree(points, 0.6, new ParallelSettings { MaxDegreeOfParallelism = 1 });
        double two = GravitationalEnergy.OfPointsByTree(points, 0.6, new ParallelSettings { MaxDegreeOfParallelism = 2, MinimumChunk = 16 });
        Assert.Equal(one, two);
        var tree = new GravityOctree(points.X, points.Y, points.Z, points.Mass);
        tree.CheckValidity();
        Assert.True(tree.NodeCount > points.Count / GravityOctree.LeafSize);
    }

    [Fact]
    public void TreeEnergy_ExactForTwoPoints_AndRefusesCoincidentPointsAndBadAngles()
    {
        var pair = new PointSet(2, UnitSystem.Solar);
        pair.X[1] = 2; pair.Mass[0] = 3; pair.Mass[1] = 5;
        Assert.Equal(-7.5, GravitationalEnergy.OfPointsByTree(pair), 14); // −G m1 m2 / d with G = 1
        var twins = new PointSet(20, UnitSystem.Solar);
        for (int i = 0; i < 20; i++) { twins.X[i] = i % 10; twins.Mass[i] = 1; }
        Assert.Contains("coincide", Assert.Throws<ArgumentException>(() => GravitationalEnergy.OfPointsByTree(twins)).Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => GravitationalEnergy.OfPointsByTree(pair, 1.5));
    }
}
