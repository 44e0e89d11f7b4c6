using System.Globalization;
using Placement.Points;
using Placement.Profiles;

namespace Placement.Samplers;

/// <summary>The points a sampler placed, together with the plan it followed (batches, layers, notes).</summary>
/// <param name="Points">The placed points, with masses, target densities, layers and provenance filled.</param>
/// <param name="Plan">The sampler's plan (derived types carry sampler-specific layout, e.g. shell radii).</param>
public sealed record SamplingResult(PointSet Points, SamplingPlan Plan)
{
    /// <summary>
    /// Asserts what every sampler promises: valid points (<see cref="PointSet.CheckValidity"/>) and plan
    /// (<see cref="SamplingPlan.CheckValidity(IRadialProfile, double)"/>), as many points as planned, each batch's
    /// masses and layers as planned, total mass M within <paramref name="relativeTolerance"/>, every point within
    /// the profile's outer radius, and provenance naming the profile.
    /// </summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the point or batch.</exception>
    public void CheckValidity(IRadialProfile profile, double relativeTolerance = 1e-12)
    {
        ArgumentNullException.ThrowIfNull(profile);
        var inv = CultureInfo.InvariantCulture;
        Points.CheckValidity();
        Plan.CheckValidity(profile, relativeTolerance);
        if (Points.Count != Plan.Count)
            throw new InvalidOperationException(string.Create(inv, $"{Points.Count} points placed; the plan has {Plan.Count}."));
        for (int k = 0; k < Plan.Batches.Count; k++)
        {
            var b = Plan.Batches[k];
            for (int i = b.Start; i < b.Start + b.Count; i++)
            {
                if (Points.Mass[i] != b.MassPerPoint || Points.Layer[i] != b.Layer)
                    throw new InvalidOperationException(string.Create(inv,
                        $"Point {i} (batch {k}) has mass {Points.Mass[i]:R} and layer {Points.Layer[i]}; planned {b.MassPerPoint:R} and {b.Layer}."));
            }
        }
        double total = Points.TotalMass();
        if (!(Math.Abs(total - profile.TotalMass) <= relativeTolerance * profile.TotalMass))
            throw new InvalidOperationException(string.Create(inv, $"Total point mass {total:R} differs from M = {profile.TotalMass:R}."));
        double limit = profile.OuterRadius * (1 + 1e-12);
        for (int i = 0; i < Points.Count; i++)
        {
            double r = Points.Radius(i);
            if (!(r <= limit)) throw new InvalidOperationException(string.Create(inv, $"Point {i} lies at r = {r:R}, beyond R = {profile.OuterRadius:R}."));
        }
        if (Points.Provenance.ProfileFingerprint != profile.Fingerprint)
            throw new InvalidOperationException("The provenance names another profile.");
    }
}
