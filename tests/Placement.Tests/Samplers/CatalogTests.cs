using Placement.Profiles;
using Placement.Samplers;

namespace Placement.Tests.Samplers;

/// <summary>A user-written sampler, as a user's assembly would define it: every point at the origin.</summary>
public sealed class OriginTestSampler : IPointSampler
{
    public string Name => "origin-test";

    public SamplerDescription Describe() => new(Name, "All points at the origin (test).", []);

    public SamplingPlan Plan(SamplingRequest request) =>
        new(request.Count, [new PlannedBatch(0, request.Count, -1, request.Profile.TotalMass / request.Count, 0.0)]);

    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        output.X.Clear();
        output.Y.Clear();
        output.Z.Clear();
    }
}

public class CatalogTests
{
    [Fact]
    public void Catalog_FindsBuiltInsCaseInsensitively_AndListsNamesOnUnknown()
    {
        var catalog = SamplerCatalog.CreateDefault();
        Assert.Equal(["glass", "healpix-shells", "poisson", "random-shells", "relaxed", "stratified-shells", "stretched-lattice", "voronoi-relaxed"], catalog.Names);
        Assert.Equal("healpix-shells", catalog.Create("HEALPix-Shells").Name);
        var e = Assert.Throws<KeyNotFoundException>(() => catalog.Create("no-such-sampler"));
        Assert.Contains("healpix-shells", e.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => catalog.Register(() => new Placement.Samplers.PoissonSampler()));
    }

    [Fact]
    public void Catalog_DiscoversUserSamplers_AndTheDriverRunsThem()
    {
        var catalog = SamplerCatalog.CreateDefault();
        Assert.Equal(1, catalog.RegisterFromAssembly(typeof(CatalogTests).Assembly));
        var sampler = catalog.Create("origin-test");
        var result = PointSampling.Place(sampler, new SamplingRequest(new UniformSphere(3, 1), 10));
        Assert.Equal(10, result.Points.Count);
        Assert.Equal(3.0, result.Points.TotalMass(), 14);
        Assert.Equal(new UniformSphere(3, 1).Density(0), result.Points.TargetDensity[9]);
    }

    [Fact]
    public void Parameters_ParseFromText_WithClearErrors()
    {
        var d = SamplerCatalog.CreateDefault().Create("stretched-lattice").Describe();
        var values = d.Parse(new Dictionary<string, string> { ["Lattice"] = "HCP", ["offset"] = "0.5, 0, 0.25", ["orientation"] = "1,0,0,1" });
        Assert.Equal("hcp", values.GetChoice("lattice"));
        Assert.Equal((0.5, 0.0, 0.25), values.GetTriple("offset"));
        Assert.Equal(Math.Sqrt(0.5), values.GetRotation("orientation")!.Value.W, 15);
        Assert.Null(d.Parse(new Dictionary<string, string> { ["orientation"] = "random" }).GetRotation("orientation"));

        var unknown = Assert.Throws<ArgumentException>(() => d.Parse(new Dictionary<string, string> { ["spacing"] = "1" }));
        Assert.Contains("known parameters: lattice, orientation, offset", unknown.Message, StringComparison.Ordinal);
        var bad = Assert.Throws<ArgumentException>(() => d.Parse(new Dictionary<string, string> { ["lattice"] = "diamond" }));
        Assert.Contains("expected one of sc, bcc, fcc, hcp", bad.Message, StringComparison.Ordinal);
        var shell = SamplerCatalog.CreateDefault().Create("healpix-shells").Describe();
        var range = Assert.Throws<ArgumentException>(() => shell.Parse(new Dictionary<string, string> { ["aspect"] = "50" }));
        Assert.Contains("'aspect' has value '50'", range.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => shell.Parse(new Dictionary<string, string> { ["rotate"] = "maybe" }));
    }

    [Fact]
    public void Descriptions_HaveHelpForEveryParameter()
    {
        foreach (var d in SamplerCatalog.CreateDefault().DescribeAll())
        {
            Assert.False(string.IsNullOrWhiteSpace(d.Summary));
            foreach (var p in d.Parameters)
            {
                Assert.False(string.IsNullOrWhiteSpace(p.Help), $"{d.Name}.{p.Name}");
                p.Parse(p.DefaultText);
            }
        }
    }

    [Fact]
    public void ResultCheck_CatchesABrokenSampler()
    {
        // A sampler that places a point outside the body and plans the wrong mass must fail the invariant check.
        var profile = new UniformSphere(1, 1);
        var result = PointSampling.Place(new OriginTestSampler(), new SamplingRequest(profile, 5));
        result.CheckValidity(profile);
        result.Points.X[2] = 1.5;
        Assert.Throws<InvalidOperationException>(() => result.CheckValidity(profile));
        result.Points.X[2] = 0;
        result.Points.Mass[0] *= 2;
        Assert.Throws<InvalidOperationException>(() => result.CheckValidity(profile));
    }

    [Fact]
    public void Contract_Guards_RejectBadRequestsAndPlans()
    {
        var profile = new UniformSphere(1, 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => new SamplingRequest(profile, 0));
        Assert.Throws<ArgumentNullException>(() => new SamplingRequest(null!, 10));
        // Batches must tile [0, count) in order.
        Assert.Throws<ArgumentException>(() => new SamplingPlan(10, [new PlannedBatch(0, 4, -1, 0.1, double.NaN), new PlannedBatch(5, 5, -1, 0.1, double.NaN)]));
        Assert.Throws<ArgumentException>(() => new SamplingPlan(10, [new PlannedBatch(0, 9, -1, 0.1, double.NaN)]));
        Assert.Throws<ArgumentException>(() => new SamplingPlan(1, [new PlannedBatch(0, 1, -1, double.NaN, double.NaN)]));
        // Parameters parsed for one sampler cannot drive another.
        var catalog = SamplerCatalog.CreateDefault();
        var lattice = catalog.Create("stretched-lattice");
        var request = new SamplingRequest(profile, 100) { Parameters = catalog.Create("healpix-shells").Describe().Defaults() };
        Assert.Throws<ArgumentException>(() => PointSampling.Place(lattice, request));
        // A preallocated point set must match the plan.
        var plan = lattice.Plan(new SamplingRequest(profile, 100));
        Assert.Throws<ArgumentException>(() => PointSampling.Fill(lattice, new SamplingRequest(profile, 100), plan, new Placement.Points.PointSet(plan.Count + 1, profile.Units)));
    }
}
