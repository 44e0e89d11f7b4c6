namespace Placement.Samplers.Relaxed;

/// <summary>The start placement shared by the relaxing samplers: a built-in sampler run with the caller's request.</summary>
internal static class RelaxationStart
{
    /// <summary>Built-in samplers a relaxation may start from.</summary>
    public static readonly string[] Choices = ["healpix-shells", "random-shells", "stratified-shells", "stretched-lattice", "glass", "poisson"];

    /// <summary>Places the start with the request's profile, count, seed, mode and parallelism and the start's default parameters.</summary>
    public static Points.PointSet Place(SamplingRequest request, string startName, out IPointSampler start)
    {
        start = SamplerCatalog.CreateDefault().Create(startName);
        var startRequest = new SamplingRequest(request.Profile, request.Count)
        {
            Seed = request.Seed,
            Mode = request.Mode,
            Parallel = request.Parallel,
        };
        return PointSampling.Place(start, startRequest).Points;
    }

    /// <summary>The radial constraint for a <c>radial</c> parameter value: keep, rank-stretch, or auto (keep for shell starts, whose shells carry exact masses).</summary>
    public static Relaxation.RadialConstraint RadialConstraintFor(string choice, string start) => choice switch
    {
        "keep" => Relaxation.RadialConstraint.KeepRadii,
        "rank-stretch" => Relaxation.RadialConstraint.RankStretch,
        _ => start.EndsWith("shells", StringComparison.Ordinal) ? Relaxation.RadialConstraint.KeepRadii : Relaxation.RadialConstraint.RankStretch,
    };
}
