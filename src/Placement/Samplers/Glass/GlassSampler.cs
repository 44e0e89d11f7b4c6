using System.Globalization;
using Placement.Geometry;
using Placement.Glass;
using Placement.Random;

namespace Placement.Samplers.Glass;

/// <summary>
/// A periodic glass tile repeated over space, cut to the N points nearest the centre and stretch-mapped onto the
/// profile by rank; equal masses. Catalogue name <c>glass</c>.
/// </summary>
/// <remarks>
/// <para>The tile (N_t points in the unit cube, from <see cref="GlassMaker"/> or a cache file) is turned by a random
/// rotation and shifted by a random offset (both from the seed), repeated over every tile that meets a ball holding
/// about N points, and the N points nearest the centre are kept. They are then moved radially with
/// <see cref="RadialRankStretch"/>, so the enclosed mass matches M(r) to half a point's mass at every radius. A glass has
/// no preferred directions and no long-range density fluctuations (superhomogeneous), unlike a lattice (anisotropic)
/// or random points (Poisson noise).</para>
/// <para>The tile repeats with period 1 in tile units, which adds a weak feature at that scale; bigger tiles push it
/// to larger scales. With <c>tile-file</c> set, the tile is read from that file when it exists (its size must match
/// <c>tile-points</c>) and written there after it is made, so later runs reuse it.</para>
/// </remarks>
public sealed class GlassSampler : IPointSampler
{
    /// <summary>Parameter: points in the glass tile.</summary>
    public const string TilePointsParameter = "tile-points";

    /// <summary>Parameter: relaxation steps used to make the tile.</summary>
    public const string IterationsParameter = "tile-iterations";

    /// <summary>Parameter: cache file of the tile.</summary>
    public const string TileFileParameter = "tile-file";

    private const ulong OrientationKey = 0x676C617373526F74UL;
    private const ulong OffsetKey = 0x676C6173734F6666UL;

    /// <inheritdoc />
    public string Name => "glass";

    /// <inheritdoc />
    public SamplerDescription Describe() => new(Name,
        "A relaxed periodic glass tile repeated over space, cut to the N points nearest the centre and stretch-mapped by rank onto the profile; no preferred directions, no long-range noise; equal masses.",
        [
            new(TilePointsParameter, SamplerParameterKind.Integer, "4096", "points", "Points in the glass tile (larger tiles repeat less often; cost grows linearly).", minimum: 8, maximum: 2_000_000),
            new(IterationsParameter, SamplerParameterKind.Integer, "300", "steps", "Relaxation steps used to make the tile.", minimum: 0, maximum: 100_000),
            new(TileFileParameter, SamplerParameterKind.Text, "", "", "Cache file for the tile: read when it exists, written after the tile is made (empty: no cache)."),
        ]);

    /// <inheritdoc />
    /// <exception cref="ArgumentException">Parameters are invalid, or the cache file holds a tile of another size.</exception>
    /// <exception cref="InvalidDataException">The cache file exists but is not a glass tile.</exception>
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var values = request.ParametersFor(Describe());
        int tilePoints = values.GetInt32(TilePointsParameter);
        int iterations = values.GetInt32(IterationsParameter);
        string cache = values.GetText(TileFileParameter);
        var tile = LoadOrMake(cache, tilePoints, iterations, request);

        int n = request.Count;
        var rot = UnitQuaternion.Random(request.Seed, OrientationKey).ToRotation();
        var rng = new KeyedRandom(request.Seed, OffsetKey);
        double ox = rng.NextDouble(), oy = rng.NextDouble(), oz = rng.NextDouble();
        // Ball that holds about N points at N_t points per unit volume, with a margin for the glass's (small) fluctuations.
        double ball = Math.Cbrt(3.0 * n / (4 * Math.PI * tile.Count));
        double reach = 1.15 * ball + 1.0;
        List<double> px, py, pz, pr;
        while (true)
        {
            (px, py, pz, pr) = Collect(tile, rot, ox, oy, oz, reach);
            if (pr.Count >= n) break;
            reach *= 1.3;
        }
        var order = new int[pr.Count];
        for (int i = 0; i < order.Length; i++) order[i] = i;
        var keys = pr.ToArray();
        Array.Sort(order, (a, b) => keys[a] != keys[b] ? keys[a].CompareTo(keys[b]) : a.CompareTo(b));
        var x = new double[n];
        var y = new double[n];
        var z = new double[n];
        for (int k = 0; k < n; k++)
        {
            int i = order[k];
            x[k] = px[i]; y[k] = py[i]; z[k] = pz[i];
        }
        RadialRankStretch.Apply(request.Profile, x, y, z);

        var plan = new GlassPlan(x, y, z, request.Profile.TotalMass / n, tile.Count);
        plan.Notes.Add(string.Create(CultureInfo.InvariantCulture,
            $"{n} points from a {tile.Count}-point glass tile ({tile.Iterations} relaxation steps, last rms step {tile.FinalRmsStep:G2} of the spacing), rank-stretched onto the profile."));
        return plan;
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The plan is not a <see cref="GlassPlan"/>.</exception>
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        if (plan is not GlassPlan gp) throw new ArgumentException("Expected the plan made by this sampler's Plan.", nameof(plan));
        gp.CopyBatch(batch, output);
    }

    private static GlassTile LoadOrMake(string cache, int tilePoints, int iterations, SamplingRequest request)
    {
        if (cache.Length > 0 && File.Exists(cache))
        {
            var loaded = GlassTile.Load(cache);
            if (loaded.Count != tilePoints)
                throw new ArgumentException($"Glass cache '{cache}' holds a {loaded.Count}-point tile; tile-points is {tilePoints}.");
            return loaded;
        }
        if (cache.Length > 0) GlassTile.PrepareDirectory(cache);
        var tile = GlassMaker.Make(tilePoints, request.Seed, new GlassSettings { MaxIterations = iterations }, request.Parallel);
        if (cache.Length > 0) tile.Save(cache);
        return tile;
    }

    private static (List<double> X, List<double> Y, List<double> Z, List<double> R) Collect(
        GlassTile tile, Rotation3 rot, double ox, double oy, double oz, double reach)
    {
        var x = new List<double>();
        var y = new List<double>();
        var z = new List<double>();
        var r = new List<double>();
        int k = (int)Math.Ceiling(reach) + 1;
        double reach2 = reach * reach;
        for (int a = -k; a <= k; a++)
            for (int b = -k; b <= k; b++)
                for (int c = -k; c <= k; c++)
                {
                    // Skip tiles wholly outside the ball (nearest corner farther than the reach).
                    double gx = Gap(a - ox), gy = Gap(b - oy), gz = Gap(c - oz);
                    if (gx * gx + gy * gy + gz * gz > reach2) continue;
                    for (int i = 0; i < tile.Count; i++)
                    {
                        double qx = tile.X[i] + a - ox, qy = tile.Y[i] + b - oy, qz = tile.Z[i] + c - oz;
                        double d2 = qx * qx + qy * qy + qz * qz;
                        if (d2 > reach2) continue;
                        var (rx, ry, rz) = rot.Apply(qx, qy, qz);
                        x.Add(rx); y.Add(ry); z.Add(rz); r.Add(d2);
                    }
                }
        return (x, y, z, r);
    }

    /// <summary>Distance from 0 to the unit interval [lo, lo + 1] along one axis.</summary>
    private static double Gap(double lo) => lo > 0 ? lo : lo + 1 < 0 ? -(lo + 1) : 0;
}
