using Placement.Geometry;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Random;
using Placement.Samplers;
using Placement.Samplers.Healpix;
using Placement.Samplers.Lattices;
using Placement.Samplers.Shells;

namespace Placement.Tests.Samplers;

public class SamplerTests
{
    public static TheoryData<string> SamplerNames => ["healpix-shells", "random-shells", "stratified-shells", "stretched-lattice", "poisson"];

    private static readonly SamplerCatalog Catalog = SamplerCatalog.CreateDefault();

    private static SamplingResult Place(string sampler, IRadialProfile profile, int n, int threads = 2, ulong seed = 7,
        IReadOnlyDictionary<string, string>? parameters = null, SamplingMode mode = SamplingMode.EqualMassParticles)
    {
        var s = Catalog.Create(sampler);
        var request = new SamplingRequest(profile, n)
        {
            Seed = seed,
            Mode = mode,
            Parallel = new ParallelSettings { MaxDegreeOfParallelism = threads, MinimumChunk = 1000 },
            Parameters = parameters is null ? null : s.Describe().Parse(parameters),
        };
        return PointSampling.Place(s, request);
    }

    [Theory]
    [MemberData(nameof(SamplerNames))]
    public void Sampler_OneAndTwoThreads_GiveIdenticalBits(string name)
    {
        var profile = TestProfiles.Layered();
        var one = Place(name, profile, 60_001, threads: 1).Points;
        var two = Place(name, profile, 60_001, threads: 2).Points;
        Assert.Equal(one.X, two.X);
        Assert.Equal(one.Y, two.Y);
        Assert.Equal(one.Z, two.Z);
        Assert.Equal(one.Mass, two.Mass);
        Assert.Equal(one.TargetDensity, two.TargetDensity);
        Assert.Equal(one.Layer, two.Layer);
    }

    [Theory]
    [MemberData(nameof(SamplerNames))]
    public void Sampler_TotalMassIsExactAndPointsAreValid(string name)
    {
        foreach (string profileName in new[] { "uniform", "plummer", "layered", "steep-envelope" })
        {
            var profile = ShellLayoutTests.Profile(profileName);
            foreach (int n in new[] { 1, 2, 5, 12, 13, 100, 4321 })
            {
                var result = Place(name, profile, n);
                var p = result.Points;
                // Equal masses M/N summed N times (compensated): relative rounding far below 1e-12; radii ≤ R;
                // planned masses and layers; shell boundary masses for shell plans.
                result.CheckValidity(profile, 1e-12);
                if (name != "stretched-lattice") Assert.Equal(n, p.Count);
                Assert.Equal(name, p.Provenance.Sampler);
                Assert.Equal(profile.Fingerprint, p.Provenance.ProfileFingerprint);
                Assert.Equal(7UL, p.Provenance.Seed);
            }
        }
    }

    [Theory]
    [InlineData("healpix-shells", "polytrope-n1")]
    [InlineData("healpix-shells", "plummer")]
    [InlineData("healpix-shells", "layered")]
    [InlineData("healpix-shells", "steep-envelope")]
    [InlineData("random-shells", "plummer")]
    [InlineData("stratified-shells", "polytrope-n1")]
    public void ShellSamplers_PointsEnclosedMass_EqualsProfileAtEveryShellBoundary(string name, string profileName)
    {
        // From the points themselves: the mass of all points inside shell boundary r_k equals M(r_k). Exact up to
        // the rounding of r(M), M(r) and the sum (≤ 1e-12 M).
        var profile = ShellLayoutTests.Profile(profileName);
        var result = Place(name, profile, 123_457);
        var layout = ((ShellPlan)result.Plan).Layout;
        var p = result.Points;
        var massInLayer = new double[layout.ShellCount + 1];
        for (int i = 0; i < p.Count; i++)
        {
            int layer = p.Layer[i];
            massInLayer[layer] += p.Mass[i];
            double r = p.Radius(i);
            if (layer > 0)
            {
                // Every point lies on its shell's mass-midpoint sphere, inside the shell's boundaries.
                Assert.Equal(layout.PointRadius[layer - 1], r, layout.PointRadius[layer - 1] * 1e-12);
                Assert.InRange(r, layout.InnerRadius[layer - 1] * (1 - 1e-12), layout.OuterRadius[layer - 1] * (1 + 1e-12));
            }
            else Assert.True(r <= layout.CentreOuterRadius * (1 + 1e-12));
        }
        double enclosed = massInLayer[0];
        for (int k = 0; k < layout.ShellCount; k++)
        {
            enclosed += massInLayer[k + 1];
            Assert.Equal(profile.EnclosedMass(layout.OuterRadius[k]), enclosed, 1e-12 * profile.TotalMass);
        }
    }

    [Fact]
    public void HealpixShells_UnrotatedShell_IsTheHealpixSphereAtTheShellRadius()
    {
        var profile = new UniformSphere(1, 1);
        var result = Place("healpix-shells", profile, 5000, parameters: new Dictionary<string, string> { ["rotate"] = "false" });
        var layout = ((ShellPlan)result.Plan).Layout;
        int k = layout.ShellCount / 2;
        var (x, y, z) = HealpixGeometryTests.Centres(layout.NSide[k]);
        double r = layout.PointRadius[k];
        int first = layout.FirstPoint[k];
        for (int i = 0; i < x.Length; i++)
        {
            Assert.Equal(r * x[i], result.Points.X[first + i], 1e-14);
            Assert.Equal(r * y[i], result.Points.Y[first + i], 1e-14);
            Assert.Equal(r * z[i], result.Points.Z[first + i], 1e-14);
        }
    }

    [Fact]
    public void HealpixShells_RotatedShell_KeepsPairwiseGeometry()
    {
        // A rotation preserves dot products: the rotated shell's Gram entries equal the HEALPix sphere's.
        var profile = TestProfiles.Plummer();
        var result = Place("healpix-shells", profile, 20_000);
        var layout = ((ShellPlan)result.Plan).Layout;
        int k = layout.ShellCount - 1;
        var (x, y, z) = HealpixGeometryTests.Centres(layout.NSide[k]);
        double r = layout.PointRadius[k];
        int f = layout.FirstPoint[k];
        var p = result.Points;
        for (int i = 0; i < x.Length; i += 7)
        {
            int j = (i * 31 + 5) % x.Length;
            double expected = x[i] * x[j] + y[i] * y[j] + z[i] * z[j];
            double got = (p.X[f + i] * p.X[f + j] + p.Y[f + i] * p.Y[f + j] + p.Z[f + i] * p.Z[f + j]) / (r * r);
            Assert.Equal(expected, got, 1e-13);
        }
    }

    [Fact]
    public void StratifiedShells_EachPointLiesInItsStratum()
    {
        var profile = new UniformSphere(1, 1);
        var request = new SamplingRequest(profile, 30_000) { Seed = 3 };
        var sampler = new StratifiedShellSampler();
        var result = PointSampling.Place(sampler, request);
        var layout = ((ShellPlan)result.Plan).Layout;
        var p = result.Points;
        for (int k = 0; k < layout.ShellCount; k++)
        {
            // Undo the shell's rotation (stream (seed, layer), first three draws) and check band and sector.
            var rng = new KeyedRandom(3, (ulong)(k + 1));
            var rot = UnitQuaternion.Random(ref rng).ToRotation();
            var inverse = new Rotation3(rot.R00, rot.R10, rot.R20, rot.R01, rot.R11, rot.R21, rot.R02, rot.R12, rot.R22);
            int nSide = layout.NSide[k];
            double r = layout.PointRadius[k];
            for (int i = 1; i <= 4 * nSide - 1; i++)
            {
                var ring = HealpixGeometry.Ring(nSide, i);
                for (int j = 0; j < ring.PixelCount; j++)
                {
                    int idx = layout.FirstPoint[k] + (int)ring.FirstPixel + j;
                    var (ux, uy, uz) = inverse.Apply(p.X[idx] / r, p.Y[idx] / r, p.Z[idx] / r);
                    Assert.InRange(uz, ring.ZBottom - 1e-12, ring.ZTop + 1e-12);
                    double phi = Math.Atan2(uy, ux);
                    double centre = ring.FirstPhi + j * ring.PhiStep;
                    double d = Math.IEEERemainder(phi - centre, 2 * Math.PI);
                    Assert.InRange(d, -0.5 * ring.PhiStep - 1e-9, 0.5 * ring.PhiStep + 1e-9);
                }
            }
        }
    }

    [Fact]
    public void StretchedLattice_GenericOffset_GivesExactCountAndAnisotropyTable()
    {
        var profile = TestProfiles.Plummer();
        foreach (string lattice in new[] { "sc", "bcc", "fcc", "hcp" })
        {
            var result = Place("stretched-lattice", profile, 20_000, parameters: new Dictionary<string, string>
            {
                ["lattice"] = lattice,
                ["offset"] = "0.1234,0.2345,0.3456",
                ["orientation"] = "random",
            });
            Assert.Equal(20_000, result.Points.Count);
            var plan = (LatticePlan)result.Plan;
            Assert.Equal(64, plan.Anisotropy.Count);
        }
    }

    [Fact]
    public void StretchedLattice_SymmetricLattice_ReportsNearestCount()
    {
        // Zero offset: many lattice points share a distance from the centre (all integer vectors of one |v|²), so
        // the count can miss N by up to half such a group; the group at |v|² ≈ 460 holds ~100 points, so allow 1 %.
        var result = Place("stretched-lattice", new UniformSphere(1, 1), 10_000, parameters: new Dictionary<string, string> { ["lattice"] = "sc" });
        Assert.NotEqual(10_000, result.Points.Count);
        Assert.InRange(result.Points.Count, 10_000 - 100, 10_000 + 100);
        Assert.Contains(result.Plan.Notes, n => n.Contains("instead of the requested 10000", StringComparison.Ordinal));
    }

    [Fact]
    public void StretchedLattice_MapsRadiiByEnclosedMass()
    {
        // Every point's mapped radius r' satisfies M(r')/M = (r/R0)³ with r its radius in the (rotated) lattice ball:
        // check monotonicity of the map through the fraction of points inside several radii, which for a lattice
        // deviates from M(r)/M only by surface fluctuations (≈ 3 spacings / R0 ≈ 3 / N^(1/3) relative).
        var profile = TestProfiles.PolytropeN1();
        var p = Place("stretched-lattice", profile, 50_000, parameters: new Dictionary<string, string> { ["lattice"] = "fcc", ["offset"] = "0.31,0.17,0.05" }).Points;
        var radii = new double[p.Count];
        for (int i = 0; i < p.Count; i++) radii[i] = p.Radius(i);
        Array.Sort(radii);
        foreach (double f in new[] { 0.1, 0.3, 0.5, 0.7, 0.9 })
        {
            double r = profile.RadiusOfEnclosedMass(f * profile.TotalMass);
            int inside = ~Array.BinarySearch(radii, r);
            if (inside < 0) inside = ~inside;
            double fraction = (double)inside / p.Count;
            Assert.InRange(fraction, f - 0.01, f + 0.01);
        }
    }

    [Fact]
    public void StretchAnisotropy_UniformSphere_IsIsotropic_PlummerMatchesFormula()
    {
        foreach (var row in StretchAnisotropy.Compute(new UniformSphere(1, 2), 16))
        {
            Assert.Equal(1.0, row.RadialStretch, 12);
            Assert.Equal(1.0, row.TangentialStretch, 12);
        }
        // Plummer (a = 0.2, R = 1): dr'/dr from M(r')/M = (r/R)³ differentiated directly (finite difference of r(M)).
        var plummer = TestProfiles.Plummer();
        foreach (var row in StretchAnisotropy.Compute(plummer, 8))
        {
            double h = 1e-6;
            double r1 = row.UniformRadius * (1 - h), r2 = row.UniformRadius * (1 + h);
            double d = (plummer.RadiusOfEnclosedMass(Math.Pow(r2, 3)) - plummer.RadiusOfEnclosedMass(Math.Pow(r1, 3))) / (r2 - r1);
            Assert.Equal(d, row.RadialStretch, 1e-6 * Math.Max(1, d));
            Assert.Equal(row.Radius / row.UniformRadius, row.TangentialStretch, 12);
        }
    }

    [Fact]
    public void Poisson_RadiiFollowEnclosedMassDistribution()
    {
        // Kolmogorov–Smirnov against F(r) = M(r)/M; n = 20 000, 0.1 % critical value 1.95/√n = 0.0138.
        var profile = TestProfiles.Layered();
        var p = Place("poisson", profile, 20_000).Points;
        var r = new double[p.Count];
        for (int i = 0; i < p.Count; i++) r[i] = p.Radius(i);
        Array.Sort(r);
        double d = 0;
        for (int i = 0; i < r.Length; i++)
        {
            double f = profile.EnclosedMass(r[i]) / profile.TotalMass;
            d = Math.Max(d, Math.Max(Math.Abs(f - (double)i / r.Length), Math.Abs(f - (i + 1.0) / r.Length)));
        }
        Assert.True(d < 0.0138, $"KS distance {d}");
    }

    [Fact]
    public void Samplers_SameSeedSameBits_DifferentSeedDifferentPoints()
    {
        var profile = TestProfiles.Plummer();
        foreach (string name in new[] { "healpix-shells", "random-shells", "poisson" })
        {
            var a = Place(name, profile, 3000, seed: 11).Points;
            var b = Place(name, profile, 3000, seed: 11).Points;
            var c = Place(name, profile, 3000, seed: 12).Points;
            Assert.Equal(a.X, b.X);
            Assert.NotEqual(a.X, c.X);
        }
    }

    [Fact]
    public void MeshGeneratorMode_RecordsModeAndKeepsExactMass()
    {
        var profile = TestProfiles.Plummer();
        var result = Place("healpix-shells", profile, 1000, mode: SamplingMode.MeshGenerators);
        result.CheckValidity(profile);
        var p = result.Points;
        Assert.Equal("mesh-generators", p.Provenance.Parameters["mode"]);
        Assert.Equal("1000", p.Provenance.Parameters["requested-count"]);
        Assert.Equal("1", p.Provenance.Parameters["aspect"]);
        Assert.Equal(1.0, p.TotalMass(), 1e-12);
    }

    [Fact]
    public void LatticePointAtCusp_GetsMeanDensityOfItsBall()
    {
        // The layered profile has ρ → ∞ at r = 0 (α = 1 cusp); a lattice with zero offset keeps a point there.
        var profile = TestProfiles.Layered();
        var p = Place("stretched-lattice", profile, 2000).Points;
        p.CheckValidity();
        int centre = -1;
        for (int i = 0; i < p.Count; i++) if (p.Radius(i) == 0) centre = i;
        Assert.True(centre >= 0, "expected a lattice point at the origin");
        double m = p.Mass[centre], rc = profile.RadiusOfEnclosedMass(m);
        Assert.Equal(m / (4.0 / 3.0 * Math.PI * rc * rc * rc), p.TargetDensity[centre], 1e-12 * p.TargetDensity[centre]);
    }

    [Fact]
    public void SingleCentralPoint_GetsMeanDensityOfCentralBall()
    {
        // N = 13: one point at the origin plus one 12-point shell. At the cusp of the layered profile ρ(0) is not
        // usable; the central point carries m / (4π/3 r_c³) with M(r_c) = m.
        var profile = TestProfiles.Layered();
        var p = Place("healpix-shells", profile, 13).Points;
        double m = profile.TotalMass / 13;
        double rc = profile.RadiusOfEnclosedMass(m);
        Assert.Equal(0.0, p.Radius(0));
        Assert.Equal(m / (4.0 / 3.0 * Math.PI * rc * rc * rc), p.TargetDensity[0], 1e-12 * p.TargetDensity[0]);
        Assert.Equal(0, p.Layer[0]);
        Assert.All(p.Layer.AsSpan(1).ToArray(), l => Assert.Equal(1, l));
    }
}
