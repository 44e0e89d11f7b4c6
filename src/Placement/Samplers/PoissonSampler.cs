using Placement.Geometry;
using Placement.Random;

namespace Placement.Samplers;

/// <summary>
/// Independent random points: radius by inverse CDF, direction isotropic. The baseline every other sampler is
/// compared with. Catalogue name <c>poisson</c>.
/// </summary>
/// <remarks>
/// r = r(M u) with u ~ U(0,1) (inverse-transform sampling of the enclosed-mass distribution); direction
/// z = 1 − 2v, φ = 2πw. Points come in fixed blocks of 65 536, block b drawing from
/// <see cref="KeyedRandom"/>(seed, b), so the output is the same on any thread count. Masses M/N.
/// </remarks>
public sealed class PoissonSampler : IPointSampler
{
    /// <summary>Points per batch (fixed, so the result never depends on threads).</summary>
    public const int BlockSize = 65_536;

    private const int Chunk = 256;

    /// <inheritdoc />
    public string Name => "poisson";

    /// <inheritdoc />
    public SamplerDescription Describe() => new(Name,
        "Independent random points with the profile's radial distribution (inverse-CDF radius, isotropic direction): the noisy baseline.",
        []);

    /// <inheritdoc />
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        int n = request.Count;
        double mass = request.Profile.TotalMass / n;
        int blocks = (n + BlockSize - 1) / BlockSize;
        var batches = new PlannedBatch[blocks];
        for (int b = 0; b < blocks; b++)
            batches[b] = new PlannedBatch(b * BlockSize, Math.Min(BlockSize, n - b * BlockSize), -1, mass, double.NaN);
        return new SamplingPlan(n, batches);
    }

    /// <inheritdoc />
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(request);
        var profile = request.Profile;
        double mTot = profile.TotalMass;
        var rng = new KeyedRandom(request.Seed, (ulong)batch);
        Span<double> mass = stackalloc double[Chunk];
        Span<double> radius = stackalloc double[Chunk];
        for (int s = 0; s < output.Length; s += Chunk)
        {
            int n = Math.Min(Chunk, output.Length - s);
            for (int i = 0; i < n; i++) mass[i] = mTot * rng.NextDouble();
            profile.RadiusOfEnclosedMass(mass[..n], radius[..n]);
            for (int i = 0; i < n; i++)
            {
                var (x, y, z) = UnitSphere.RandomDirection(ref rng);
                output.X[s + i] = radius[i] * x;
                output.Y[s + i] = radius[i] * y;
                output.Z[s + i] = radius[i] * z;
            }
        }
    }
}
