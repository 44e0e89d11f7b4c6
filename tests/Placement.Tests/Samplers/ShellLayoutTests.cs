using Placement.Profiles;
using Placement.Samplers.Shells;

namespace Placement.Tests.Samplers;

public class ShellLayoutTests
{
    public static TheoryData<string> ProfileNames => ["uniform", "plummer", "polytrope-n1", "layered", "steep-envelope"];

    internal static IRadialProfile Profile(string name) => name switch
    {
        "uniform" => new UniformSphere(2.0, 3.0),
        "plummer" => TestProfiles.Plummer(),
        "polytrope-n1" => TestProfiles.PolytropeN1(),
        "layered" => TestProfiles.Layered(),
        "steep-envelope" => TestProfiles.SteepEnvelope(),
        _ => throw new ArgumentException(name),
    };

    [Theory]
    [MemberData(nameof(ProfileNames))]
    public void ShellLayout_EnclosedMass_MatchesProfileAtEveryShellBoundary(string name)
    {
        // M(r_k) = m·C_k by construction through r(M); the only error is the rounding of r(M) and M(r) (the
        // bisection-based test inverses are exact to ~1e-16 R), so 1e-12 M is a generous bound.
        var profile = Profile(name);
        foreach (int n in new[] { 1000, 54_321, 300_000 })
        {
            var layout = ShellLayout.Build(profile, n);
            layout.CheckValidity(profile, 1e-12);
            Assert.Equal(n, layout.CentreCount + SumShells(layout));
            Assert.Equal(profile.OuterRadius, layout.OuterRadius[^1]);
        }
    }

    [Fact]
    public void ShellLayout_EveryCountFrom1To400_IsMetExactly()
    {
        var profile = TestProfiles.Plummer();
        for (int n = 1; n <= 400; n++)
        {
            var layout = ShellLayout.Build(profile, n);
            layout.CheckValidity(profile, 1e-12);
            Assert.Equal(n % 12, layout.CentreCount);
        }
    }

    [Theory]
    [MemberData(nameof(ProfileNames))]
    public void ShellLayout_InteriorShells_AreNearCubic(string name)
    {
        // Integer N_side limits how close a shell can get to aspect 1: a step of 1 in N_side changes the aspect by
        // about 3/N_side (thickness ∝ N², spacing ∝ 1/N); shells with N_side ≥ 8 should be within ±30 %, and the
        // median shell within ±10 %. The last seven shells (re-chosen for the exact count) and N_side < 8 are excluded.
        var profile = Profile(name);
        var layout = ShellLayout.Build(profile, 500_000);
        var aspects = new List<double>();
        for (int k = 0; k < layout.ShellCount - 7; k++)
        {
            if (layout.NSide[k] < 8) continue;
            // A shell that straddles a density step (layered profile: r = 0.1 and 0.5) cannot be cubic on both sides.
            if (name == "layered" && (Straddles(layout, k, 0.1) || Straddles(layout, k, 0.5))) continue;
            double a = layout.Aspect(k);
            Assert.InRange(a, 0.7, 1.3);
            aspects.Add(a);
        }
        Assert.True(aspects.Count > 10, $"only {aspects.Count} shells checked");
        aspects.Sort();
        Assert.InRange(aspects[aspects.Count / 2], 0.9, 1.1);
    }

    [Fact]
    public void ShellLayout_Tail_KeepsOuterShellsCloseToCubic()
    {
        // The exact-count tail re-chooses the last shells near their greedy N_side. The aspect scales as N_side³, so
        // at N_side ≈ 20–60 a change of ±3 moves it by up to ±50 %: the tail must stay within a factor 2 of cubic
        // for a smooth profile (the interior shells are within ±30 %, see above).
        var profile = new UniformSphere(1, 1);
        foreach (int n in new[] { 99_999, 100_000, 100_001, 1_234_567, 3_000_000 })
        {
            var layout = ShellLayout.Build(profile, n);
            for (int k = Math.Max(0, layout.ShellCount - 7); k < layout.ShellCount; k++) Assert.InRange(layout.Aspect(k), 0.5, 2.0);
        }
    }

    [Fact]
    public void ShellLayout_AspectParameter_ScalesShellThickness()
    {
        var profile = new UniformSphere(1, 1);
        var thin = ShellLayout.Build(profile, 200_000, aspect: 0.5);
        var cubic = ShellLayout.Build(profile, 200_000);
        // Volume per point fixed: spacing ℓ ∝ a^(−1/3), thickness aℓ ∝ a^(2/3), so halving a gives 2^(2/3) = 1.59× the shells.
        Assert.True(thin.ShellCount > 1.4 * cubic.ShellCount, $"{thin.ShellCount} vs {cubic.ShellCount}");
        Assert.Throws<ArgumentOutOfRangeException>(() => ShellLayout.Build(profile, 10, aspect: 0));
    }

    private static bool Straddles(ShellLayout layout, int k, double r) => layout.InnerRadius[k] <= r && layout.OuterRadius[k] >= r;

    private static long SumShells(ShellLayout layout)
    {
        long s = 0;
        for (int k = 0; k < layout.ShellCount; k++) s += layout.ShellPointCount(k);
        return s;
    }
}
