using System.Globalization;
using Placement.Geometry;
using Placement.Random;

namespace Placement.Samplers.Lattices;

/// <summary>
/// A regular lattice (SC, BCC, FCC or HCP) cut to a ball and stretch-mapped onto the profile, with equal point
/// masses. Catalogue name <c>stretched-lattice</c>.
/// </summary>
/// <remarks>
/// <para>Lattice points p (cell units) are shifted by the offset, kept where |p + offset| ≤ R_c, rotated by the
/// orientation, and moved along their direction from radius r to r' with M(r')/M = min(1, (r/R0)³) (stretch mapping,
/// methods reference §3). R_c is found by bisection so the kept count is as close as possible to the requested N:
/// exactly N whenever the lattice distances from the ball centre are distinct (any generic offset); with a
/// symmetric offset, distances repeat and the count is the nearest achievable one (the plan's notes say so).
/// R0 = max(R_c, R_v) with (4π/3) R_v³ n = N_actual, so no point maps beyond the outer radius.</para>
/// <para>Masses are M/N_actual. The plan reports the radial and tangential stretch per radius
/// (<see cref="LatticePlan.Anisotropy"/>): stretched lattices become strongly anisotropic in steep envelopes.</para>
/// </remarks>
public sealed class StretchedLatticeSampler : IPointSampler
{
    /// <summary>Parameter name of the lattice kind.</summary>
    public const string LatticeParameter = "lattice";

    /// <summary>Parameter name of the orientation.</summary>
    public const string OrientationParameter = "orientation";

    /// <summary>Parameter name of the offset.</summary>
    public const string OffsetParameter = "offset";

    /// <summary>Key of the random stream used when the orientation is <c>random</c>.</summary>
    private const ulong OrientationKey = 0x6C61747469636521UL;

    private const int MappingChunk = 256;

    /// <inheritdoc />
    public string Name => "stretched-lattice";

    /// <inheritdoc />
    public SamplerDescription Describe() => new(Name,
        "A simple-cubic, BCC, FCC or HCP lattice cut to a ball and stretch-mapped radially onto the profile; equal masses; reports its radial/tangential stretch per radius.",
        [
            new(LatticeParameter, SamplerParameterKind.Choice, "bcc", "", "Lattice: sc, bcc, fcc or hcp.", ["sc", "bcc", "fcc", "hcp"]),
            new(OrientationParameter, SamplerParameterKind.Rotation, "identity", "",
                "Lattice orientation: identity, random (from the seed), or a quaternion w,x,y,z."),
            new(OffsetParameter, SamplerParameterKind.RealTriple, "0,0,0", "lattice cells",
                "Shift of the lattice relative to the centre, in fractions of the cell edges along x, y, z."),
        ]);

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The parameters do not belong to this sampler.</exception>
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var values = request.ParametersFor(Describe());
        var kind = values.GetChoice(LatticeParameter) switch
        {
            "sc" => LatticeKind.SimpleCubic,
            "fcc" => LatticeKind.FaceCentredCubic,
            "hcp" => LatticeKind.HexagonalClosePacked,
            _ => LatticeKind.BodyCentredCubic,
        };
        var lattice = Lattice.Create(kind);
        var q = values.GetRotation(OrientationParameter) ?? UnitQuaternion.Random(request.Seed, OrientationKey);
        var (ox, oy, oz) = values.GetTriple(OffsetParameter);
        double sx = ox * lattice.CellX, sy = oy * lattice.CellY, sz = oz * lattice.CellZ;
        int n = request.Count;

        var (radius, count) = ClipRadius(lattice, sx, sy, sz, n);
        var ball = new LatticeBall(lattice, sx, sy, sz, radius);
        var planes = new List<(int, int)>();
        var batches = new List<PlannedBatch>();
        double mass = request.Profile.TotalMass / count;
        long start = 0;
        for (int b = 0; b < lattice.BasisCount; b++)
        {
            var (kLo, kHi) = ball.Planes(b);
            for (int k = kLo; k <= kHi; k++)
            {
                long c = ball.CountPlane(b, k);
                if (c == 0) continue;
                planes.Add((b, k));
                batches.Add(new PlannedBatch((int)start, (int)c, -1, mass, double.NaN));
                start += c;
            }
        }
        double rv = Math.Cbrt(3.0 * count / (4 * Math.PI * lattice.NumberDensity));
        var plan = new LatticePlan((int)count, batches, ball, [.. planes], q.ToRotation(), Math.Max(radius, rv),
            StretchAnisotropy.Compute(request.Profile));
        plan.Notes.Add(count == n
            ? string.Create(CultureInfo.InvariantCulture, $"{count} points of a {kind} lattice (exactly as requested).")
            : string.Create(CultureInfo.InvariantCulture,
                $"{count} points of a {kind} lattice instead of the requested {n}: lattice distances repeat for this offset, so the ball cannot hold exactly {n}; a generic offset gives the exact count."));
        return plan;
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The plan is not a <see cref="LatticePlan"/>.</exception>
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(request);
        if (plan is not LatticePlan lp) throw new ArgumentException("Expected the plan made by this sampler's Plan.", nameof(plan));
        var ball = lp.Ball;
        var (b, k) = lp.Planes[batch];
        var rot = lp.Orientation;
        var (jLo, jHi, z, _) = ball.Rows(b, k);
        int p = 0;
        for (int j = jLo; j <= jHi; j++)
        {
            var (iLo, iHi, y) = ball.Columns(b, j, z);
            for (int i = iLo; i <= iHi; i++)
            {
                var (px, py, pz) = rot.Apply(ball.X(b, i), y, z);
                output.X[p] = px;
                output.Y[p] = py;
                output.Z[p] = pz;
                p++;
            }
        }
        if (p != output.Length) throw new InvalidOperationException($"Lattice plane ({b}, {k}) held {p} points; the plan counted {output.Length}.");
        StretchMap(request, lp.MappingRadius, output);
    }

    /// <summary>Moves each point radially from r to r' with M(r')/M = min(1, (r/R0)³), in chunks through the profile's batch r(M).</summary>
    private static void StretchMap(SamplingRequest request, double r0, PointSpans output)
    {
        var profile = request.Profile;
        double mTot = profile.TotalMass;
        Span<double> mass = stackalloc double[MappingChunk];
        Span<double> radius = stackalloc double[MappingChunk];
        Span<double> original = stackalloc double[MappingChunk];
        for (int s = 0; s < output.Length; s += MappingChunk)
        {
            int n = Math.Min(MappingChunk, output.Length - s);
            for (int i = 0; i < n; i++)
            {
                double x = output.X[s + i], y = output.Y[s + i], z = output.Z[s + i];
                double r = Math.Sqrt(x * x + y * y + z * z);
                double f = r / r0;
                original[i] = r;
                mass[i] = mTot * Math.Min(1.0, f * f * f);
            }
            profile.RadiusOfEnclosedMass(mass[..n], radius[..n]);
            for (int i = 0; i < n; i++)
            {
                double scale = original[i] > 0 ? radius[i] / original[i] : 0.0;
                output.X[s + i] *= scale;
                output.Y[s + i] *= scale;
                output.Z[s + i] *= scale;
            }
        }
    }

    /// <summary>Bisects the clipping radius so the count is as close as possible to <paramref name="n"/>.</summary>
    private static (double Radius, long Count) ClipRadius(Lattice lattice, double sx, double sy, double sz, int n)
    {
        long CountAt(double r) => new LatticeBall(lattice, sx, sy, sz, r).Count();
        long c0 = CountAt(0);
        if (c0 >= n) return (0, c0);
        double lo = 0;
        double hi = Math.Cbrt(3.0 * n / (4 * Math.PI * lattice.NumberDensity)) + 2 * Math.Max(lattice.CellZ, lattice.CellY);
        while (CountAt(hi) < n) hi *= 1.5;
        for (int it = 0; it < 200 && hi - lo > 1e-13 * hi; it++)
        {
            double mid = 0.5 * (lo + hi);
            if (CountAt(mid) >= n) hi = mid; else lo = mid;
        }
        long cLo = CountAt(lo), cHi = CountAt(hi);
        return cLo >= 1 && n - cLo < cHi - n ? (lo, cLo) : (hi, cHi);
    }
}
