using Placement.Geometry;
using Placement.Random;

namespace Placement.Tests.Samplers;

public class RotationTests
{
    [Fact]
    public void RandomRotations_AreOrthonormalWithDeterminantOne()
    {
        var rng = new KeyedRandom(5, 0);
        for (int i = 0; i < 10_000; i++)
        {
            var r = UnitQuaternion.Random(ref rng).ToRotation();
            // Double-precision products of unit-norm components: errors of a few ulp; 1e-14 is ample.
            r.CheckValidity(1e-14);
        }
    }

    [Fact]
    public void RandomRotations_AngleFollowsHaarDistribution()
    {
        // For rotations uniform on SO(3) (Haar measure) the rotation angle ω has density (1 − cos ω)/π on [0, π],
        // CDF F(ω) = (ω − sin ω)/π (standard result, e.g. Miles 1965, Biometrika 52, 636). Kolmogorov–Smirnov
        // test with n = 20 000: the 0.1 % critical value is 1.95/√n = 0.0138 (Kolmogorov distribution).
        const int n = 20_000;
        var angles = new double[n];
        double sx = 0, sy = 0, sz = 0;
        for (int i = 0; i < n; i++)
        {
            var r = UnitQuaternion.Random(42, (ulong)i).ToRotation();
            angles[i] = Math.Acos(Math.Clamp((r.Trace - 1) / 2, -1, 1));
            var (x, y, z) = r.Apply(0, 0, 1);
            sx += x;
            sy += y;
            sz += z;
        }
        Array.Sort(angles);
        double d = 0;
        for (int i = 0; i < n; i++)
        {
            double f = (angles[i] - Math.Sin(angles[i])) / Math.PI;
            d = Math.Max(d, Math.Max(Math.Abs(f - (double)i / n), Math.Abs(f - (i + 1.0) / n)));
        }
        Assert.True(d < 0.0138, $"KS distance {d}");
        // The image of a fixed axis is uniform on the sphere: mean 0, σ of the mean = √(1/3 / n) = 0.0041; 5σ = 0.02.
        Assert.InRange(sx / n, -0.02, 0.02);
        Assert.InRange(sy / n, -0.02, 0.02);
        Assert.InRange(sz / n, -0.02, 0.02);
    }

    [Fact]
    public void QuaternionRotation_MatchesKnownQuarterTurn()
    {
        // A quarter turn about z: q = (cos 45°, 0, 0, sin 45°) maps x̂ → ŷ (right-hand rule).
        var r = UnitQuaternion.Normalise(1, 0, 0, 1).ToRotation();
        var (x, y, z) = r.Apply(1, 0, 0);
        Assert.Equal(0, x, 15);
        Assert.Equal(1, y, 15);
        Assert.Equal(0, z, 15);
        Assert.Throws<ArgumentException>(() => UnitQuaternion.Normalise(0, 0, 0, 0));
    }
}
