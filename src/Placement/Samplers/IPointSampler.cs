namespace Placement.Samplers;

/// <summary>
/// The plug-in contract for a point sampler: plan the exact count and batches once, then fill the positions of
/// each batch. Implement it in your own assembly (with a public parameterless constructor so catalogues can find
/// it) and run it with <see cref="PointSampling.Place"/>.
/// </summary>
/// <remarks>
/// The driver calls <see cref="Plan"/> once, allocates the point set, fills masses, layers and target densities
/// from the plan, and calls <see cref="Fill"/> once per batch — never once per point — possibly concurrently for
/// different batches. <see cref="Fill"/> must write only the spans it is given, and draw any randomness from
/// streams keyed by (request seed, batch or layer index), never by thread, so the result is the same on any
/// number of threads.
/// </remarks>
public interface IPointSampler
{
    /// <summary>Catalogue name, lower-case with dashes (e.g. <c>healpix-shells</c>).</summary>
    string Name { get; }

    /// <summary>Describes the sampler and its parameters (for help text and provenance).</summary>
    SamplerDescription Describe();

    /// <summary>Decides the exact number of points and the batches for <paramref name="request"/>.</summary>
    /// <exception cref="ArgumentException">The request's parameters are invalid for this sampler.</exception>
    SamplingPlan Plan(SamplingRequest request);

    /// <summary>Writes the positions of batch <paramref name="batch"/> of <paramref name="plan"/> into <paramref name="output"/>.</summary>
    /// <param name="request">The request the plan was made for.</param>
    /// <param name="plan">The plan returned by <see cref="Plan"/> for this request.</param>
    /// <param name="batch">Index into <see cref="SamplingPlan.Batches"/>.</param>
    /// <param name="output">The batch's coordinate spans, in the profile's length units.</param>
    void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output);
}
