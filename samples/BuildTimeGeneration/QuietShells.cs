using Placement.Samplers;

namespace BuildTimeGeneration;

/// <summary>
/// A sample plug-in that reuses a built-in sampler with its own defaults: HEALPix shells with a radial thickness of
/// 0.8 of the tangential spacing (slightly flattened cells). Shows that a plug-in can wrap library samplers.
/// </summary>
public sealed class QuietShells : IPointSampler
{
    private readonly IPointSampler _inner = SamplerCatalog.CreateDefault().Create("healpix-shells");

    public string Name => "quiet-shells";

    public SamplerDescription Describe() => new(Name, "HEALPix shells with aspect 0.8 (sample plug-in wrapping a built-in).", []);

    public SamplingPlan Plan(SamplingRequest request) => _inner.Plan(Inner(request));

    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output) => _inner.Fill(Inner(request), plan, batch, output);

    private SamplingRequest Inner(SamplingRequest request) => request with
    {
        Parameters = _inner.Describe().Parse(new Dictionary<string, string> { ["aspect"] = "0.8" }),
    };
}
