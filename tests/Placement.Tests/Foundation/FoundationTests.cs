using Placement.Parallelism;
using Placement.Profiles;
using Placement.Random;
using Placement.Units;

namespace Placement.Tests.Foundation;

public class FoundationTests
{
    [Fact]
    public void UniformSphere_EnclosedMassAndInverse_AreConsistent()
    {
        var s = new UniformSphere(2.0, 3.0);
        // Closed form M(r) = M (r/R)^3 (definition of a uniform sphere).
        Assert.Equal(2.0 * 0.125, s.EnclosedMass(1.5), 14);
        Assert.Equal(1.5, s.RadiusOfEnclosedMass(0.25), 14);
        Assert.Equal(3 * 2.0 / (4 * Math.PI * 27), s.Density(1.0), 14);
        Assert.Equal(0.0, s.Density(3.5));
        Assert.Throws<ArgumentOutOfRangeException>(() => s.RadiusOfEnclosedMass(2.5));
    }

    [Fact]
    public void SolarUnits_GravitationalConstant_IsOne()
    {
        // The solar time unit is defined so that G = 1; check the derived value.
        Assert.Equal(1.0, UnitSystem.Solar.GravitationalConstant, 12);
        Assert.Equal(UnitSystem.GravitationalConstantCgs, UnitSystem.Cgs.GravitationalConstant);
    }

    [Fact]
    public void KeyedRandom_SameSeedAndKey_GiveSameStream_DifferentKeysDiffer()
    {
        var a = new KeyedRandom(42, 7);
        var b = new KeyedRandom(42, 7);
        var c = new KeyedRandom(42, 8);
        for (int i = 0; i < 100; i++)
        {
            ulong va = a.NextUInt64();
            Assert.Equal(va, b.NextUInt64());
            Assert.NotEqual(va, c.NextUInt64());
        }
    }

    [Fact]
    public void KeyedRandom_Uniform_HasMeanAndVarianceOfU01()
    {
        var rng = new KeyedRandom(1, 2);
        const int n = 200_000;
        double sum = 0, sum2 = 0;
        for (int i = 0; i < n; i++)
        {
            double u = rng.NextDouble();
            Assert.InRange(u, 0.0, 1.0);
            sum += u;
            sum2 += u * u;
        }
        double mean = sum / n, variance = sum2 / n - mean * mean;
        // U(0,1): mean 1/2, variance 1/12; 5-sigma tolerances for n = 2e5 (sigma_mean = 0.00065).
        Assert.InRange(mean, 0.5 - 0.0033, 0.5 + 0.0033);
        Assert.InRange(variance, 1.0 / 12 - 0.0015, 1.0 / 12 + 0.0015);
    }

    [Fact]
    public void ParallelLoop_ResultsIdenticalOnOneAndTwoThreads()
    {
        const int n = 100_000;
        double[] Run(int threads)
        {
            var output = new double[n];
            ParallelLoop.For(n, new ParallelSettings { MaxDegreeOfParallelism = threads, MinimumChunk = 1000 }, (s, e) =>
            {
                for (int i = s; i < e; i++) output[i] = new KeyedRandom(99, (ulong)i).NextDouble();
            });
            return output;
        }
        Assert.Equal(Run(1), Run(2));
    }
}
