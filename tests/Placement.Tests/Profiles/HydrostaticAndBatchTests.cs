using Placement.Parallelism;
using Placement.Profiles;
using Placement.Random;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class HydrostaticAndBatchTests
{
    [Fact]
    public void WithHydrostaticPressure_OfSampledPolytrope_MatchesPolytropicPressure()
    {
        // The n = 1.5 polytrope's P = Kρ^(5/3) is the solution of hydrostatic equilibrium (Chandrasekhar 1939, ch. IV), so
        // integrating −GMρ/r² over the tabulated density must reproduce it. 1000 rows: interpolation of ρ and M limits
        // agreement; measured worst 3.5e-7 relative where P > 1e-6 P_c (largest near that cut); we require 1e-6.
        var poly = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        double[] radii = ProfileSampling.Radii(poly, 1000);
        var rho = radii.Select(poly.Density).ToArray();
        var table = new TabulatedProfile(radii, rho, UnitSystem.Solar).WithHydrostaticPressure();
        double worst = 0;
        foreach (double r in radii)
        {
            double exact = poly.Pressure(r);
            if (exact < 1e-6 * poly.CentralPressure) continue;
            worst = Math.Max(worst, Math.Abs(table.Quantity("P", r) / exact - 1));
        }
        Assert.True(worst < 1e-6, $"worst relative pressure error {worst:E2}");
        Assert.Throws<ArgumentException>(() => table.WithHydrostaticPressure());
    }

    [Fact]
    public void ParallelBatchInverse_IsIdenticalOnOneAndTwoThreads()
    {
        var star = DemoBodies.TwoZoneStar();
        var rng = new KeyedRandom(21, 0);
        var m = new double[50_000];
        for (int i = 0; i < m.Length; i++) m[i] = rng.NextDouble() * star.TotalMass;
        var one = new double[m.Length];
        var two = new double[m.Length];
        star.RadiusOfEnclosedMass(m, one, new ParallelSettings { MaxDegreeOfParallelism = 1, MinimumChunk = 1000 });
        star.RadiusOfEnclosedMass(m, two, new ParallelSettings { MaxDegreeOfParallelism = 2, MinimumChunk = 1000 });
        Assert.Equal(one, two);
        Assert.Equal(star.RadiusOfEnclosedMass(m[123]), one[123]);
    }
}
