using Placement.Points;

namespace Placement.Samplers;

/// <summary>The points a sampler placed, together with the plan it followed (batches, layers, notes).</summary>
/// <param name="Points">The placed points, with masses, target densities, layers and provenance filled.</param>
/// <param name="Plan">The sampler's plan (derived types carry sampler-specific layout, e.g. shell radii).</param>
public sealed record SamplingResult(PointSet Points, SamplingPlan Plan);
