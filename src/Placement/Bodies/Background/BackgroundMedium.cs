using Placement.Geometry;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Random;
using Placement.Samplers.Healpix;
using Placement.Spatial;
using Placement.Tessellation;
using Placement.Units;

namespace Placement.Bodies.Background;

/// <summary>
/// Places a low-density background medium in a box around a body: shells of HEALPix points about the body's centre
/// whose spacing starts at the body's surface spacing and grows outward to the box edge.
/// </summary>
/// <remarks>
/// <para>Spacing: the first shell's spacing s₀ is the median nearest-neighbour distance among the body's outermost points
/// (those within s/2 of the largest radius; <see cref="MeasureSurface"/>), so the mesh is continuous across the surface.
/// The body's surface layer is the ½ · 4π r_max²/s₀² outermost points (half of what one closed shell of that spacing
/// holds: the points that face the medium), r_b their mean radius. The factor ½ is our choice from measurements over five
/// samplers (HEALPix, random shells, lattice, glass, Poisson) and three profiles (n = 1.5, n = 3, the invented two-zone
/// star) at 20 000 points: the body's cells then fill its ball to within −2.6 … +2.3 %, random shells +4.5 … +7.8 % (their
/// nearest-neighbour distance underestimates the spacing); a whole shell's worth overshot by up to 18 %, the points
/// within s/2 of r_max alone undershot by up to 29 % on ragged (glass, Poisson) surfaces.
/// Shell k has spacing s_k = min(s₀(1 + g)^k, s_max) and radius r_(k+1) = r_k + (s_k + s_(k+1))/2, and carries
/// 12 N_side² points with N_side = round(r_k √(π/3) / s_k) (cells of side ≈ s_k; Górski et al. 2005 pixel centres,
/// project reference notes §2), each shell turned by its own random rotation (Shoemake 1992) keyed by (seed, shell), and
/// every point moved radially by a uniform random ±0.1 s_k (exactly co-spherical points make the bisector planes of a
/// shell meet at the centre, so cells reaching far inward would end in near-degenerate spikes).
/// Shells continue until they clear the box corners; points outside the box are dropped.</para>
/// <para>Surface: the first shell sits at r₀ = R + max(R − r_b, s₀/2), where r_b is the mean radius of the body's
/// outermost points, i.e. mirrored about the surface, so the Voronoi faces between the last body points and the first
/// background points lie on the surface on average (no gap, no overlap).</para>
/// <para>Masses: body and background points are tessellated together in the box (the body's cells fill the hole, so no
/// background cell reaches into the body) and each background point gets ρ_bg times the part of its cell outside the
/// body radius (<see cref="BackgroundDensityProfile"/> with an empty hole, exact radial integration). Their total is
/// ρ_bg (V_box − 4πR³/3) less ρ_bg times the volume by which the body's cells reach beyond R, which the mirrored first
/// shell keeps small (measured 1e-5 … 1.5e-3 of the background mass in a box of side 6R). The spacing grows, so masses grow
/// outward too (equal masses would force a uniform spacing at uniform density). For mesh generators
/// (<c>integrateBodyCells</c>) every cell instead gets ∫ρ dV of the whole field, so all masses add up to
/// M_body + ρ_bg (V_box − 4πR³/3). Deterministic: the same seed gives the same bits on any thread count.</para>
/// </remarks>
public static class BackgroundMedium
{
    /// <summary>Stream-key prefix of the shell rotations, distinct from the body samplers' shell keys.</summary>
    private const ulong KeyPrefix = 0xBAC6_0000_0000_0000UL;

    /// <summary>Fraction of one closed shell's worth of outermost points (4π r²/s²) that defines the surface layer.</summary>
    private const double SurfaceLayerFraction = 0.5;

    /// <summary>Half-width of the uniform radial jitter of background points, in units of their shell's spacing.</summary>
    private const double RadialJitter = 0.1;

    /// <summary>Measures the spacing and mean radius of the body's outermost points.</summary>
    /// <param name="body">Body points, centred on the origin.</param>
    /// <returns>The median nearest-neighbour distance s among the points within s/2 of the largest radius r_max, and the mean
    /// radius of the ½ · 4π r_max²/s² outermost points (half a closed shell's worth).</returns>
    /// <exception cref="ArgumentException">Fewer than two points.</exception>
    public static (double Spacing, double LayerRadius) MeasureSurface(PointSet body)
    {
        ArgumentNullException.ThrowIfNull(body);
        int n = body.Count;
        if (n < 2) throw new ArgumentException("Measuring the surface spacing needs at least two body points.", nameof(body));
        var radius = new double[n];
        for (int i = 0; i < n; i++) radius[i] = body.Radius(i);
        var order = new int[n];
        for (int i = 0; i < n; i++) order[i] = i;
        var keys = (double[])radius.Clone();
        Array.Sort(keys, order);
        var tree = new KdTree(body.X, body.Y, body.Z);
        var search = tree.CreateSearch();
        // First guess from the 12 outermost points, then the layer within half that spacing of the largest radius.
        double first = MedianNearest(body, search, order.AsSpan(Math.Max(0, n - 12)));
        double cut = keys[n - 1] - 0.5 * first;
        int start = Array.BinarySearch(keys, cut);
        start = start < 0 ? ~start : start;
        start = Math.Min(start, n - 2);
        double spacing = MedianNearest(body, search, order.AsSpan(start));
        // The surface layer: half as many outermost points as one closed shell of that spacing holds (a thin shell for shell
        // samplers; a deeper band for ragged surfaces such as Poisson or glass points).
        double rMax = keys[n - 1];
        int count = (int)Math.Clamp(Math.Round(SurfaceLayerFraction * 4 * Math.PI * rMax * rMax / (spacing * spacing)), 1, n);
        double sum = 0;
        for (int j = n - count; j < n; j++) sum += keys[j];
        return (spacing, sum / count);
    }

    /// <summary>Places the background medium around a body centred on the origin and gives its points their masses.</summary>
    /// <param name="settings">Box, density, pressure and spacing law.</param>
    /// <param name="body">The body's points (centred on the origin, inside the profile radius): they measure the surface
    /// (when <see cref="BackgroundSettings.SurfaceSpacing"/> is NaN) and are tessellated together with the background.</param>
    /// <param name="profile">The body's profile; its outer radius is the body radius R.</param>
    /// <param name="boxCentre">Centre of the box relative to the body's centre, length units (e.g. the centre of mass of body plus companions).</param>
    /// <param name="seed">Random seed of the shell rotations.</param>
    /// <param name="integrateBodyCells">Also give every body point the mass ∫ρ dV of its cell in the joint tessellation, with
    /// ρ the body's profile inside R and ρ_bg outside (mesh generators), in <see cref="BackgroundPoints.BodyCellMass"/>.</param>
    /// <param name="parallel">Parallelism; the result does not depend on it.</param>
    /// <exception cref="ArgumentException">A setting is out of range, the box does not hold the body with room for the first
    /// shell, a body point lies outside the box, or units differ.</exception>
    public static BackgroundPoints Place(BackgroundSettings settings, PointSet body, IRadialProfile profile,
        (double X, double Y, double Z) boxCentre, ulong seed, bool integrateBodyCells = false, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(body);
        ArgumentNullException.ThrowIfNull(profile);
        settings.Validate();
        double bodyRadius = profile.OuterRadius;
        UnitSystem units = body.Units;
        double s0 = settings.SurfaceSpacing, layerRadius = bodyRadius;
        if (double.IsNaN(s0)) (s0, layerRadius) = MeasureSurface(body);
        s0 = Math.Min(s0, settings.MaximumSpacing);
        double r0 = bodyRadius + Math.Max(bodyRadius - layerRadius, 0.5 * s0);

        double half = 0.5 * settings.BoxSide;
        var (cx, cy, cz) = boxCentre;
        double clearance = half - Math.Max(Math.Abs(cx), Math.Max(Math.Abs(cy), Math.Abs(cz)));
        if (!(clearance >= r0 + 0.5 * s0))
            throw new ArgumentException(FormattableString.Invariant(
                $"A background box of side {settings.BoxSide} centred at ({cx:G6}, {cy:G6}, {cz:G6}) does not hold the body (radius {bodyRadius:G6}) and its first background shell at radius {r0:G6}; use a side of at least {2 * (r0 + 0.5 * s0 + (half - clearance)):G6}."),
                nameof(settings));
        var domain = settings.Periodic
            ? TessellationDomain.PeriodicBox(cx - half, cy - half, cz - half, cx + half, cy + half, cz + half)
            : TessellationDomain.Box(cx - half, cy - half, cz - half, cx + half, cy + half, cz + half);
        double far = 0;
        foreach (double ex in new[] { domain.MinX, domain.MaxX })
            foreach (double ey in new[] { domain.MinY, domain.MaxY })
                foreach (double ez in new[] { domain.MinZ, domain.MaxZ })
                    far = Math.Max(far, Math.Sqrt(ex * ex + ey * ey + ez * ez));

        // Shell layout (sequential, cheap): radius, spacing, N_side, first candidate slot.
        var radii = new List<double>();
        var spacing = new List<double>();
        var nSide = new List<int>();
        var offset = new List<long> { 0 };
        double r = r0, s = s0;
        while (r - 0.5 * s <= far)
        {
            int ns = (int)Math.Clamp(Math.Round(r * Math.Sqrt(Math.PI / 3) / s), 1, HealpixGeometry.MaxNSide);
            radii.Add(r); spacing.Add(s); nSide.Add(ns);
            offset.Add(offset[^1] + HealpixGeometry.PixelCount(ns));
            if (offset[^1] > Array.MaxLength / 2 || radii.Count > 1_000_000)
                throw new ArgumentException(FormattableString.Invariant(
                    $"The background would need more than {offset[^1]:N0} candidate points in {radii.Count} shells; raise the spacing growth or the maximum spacing, or shrink the box."), nameof(settings));
            double next = Math.Min(s * (1 + settings.SpacingGrowth), settings.MaximumSpacing);
            r += 0.5 * (s + next);
            s = next;
        }
        int shells = radii.Count;
        int candidates = (int)offset[^1];
        var cxs = new double[candidates];
        var cys = new double[candidates];
        var czs = new double[candidates];
        ParallelLoop.For(shells, (parallel ?? ParallelSettings.Default) with { MinimumChunk = 1 }, (k0, k1) =>
        {
            for (int k = k0; k < k1; k++)
            {
                int first = (int)offset[k], count = (int)(offset[k + 1] - offset[k]);
                var random = new KeyedRandom(seed, KeyPrefix | (uint)k);
                var rotation = UnitQuaternion.Random(ref random).ToRotation();
                HealpixGeometry.WriteSphere(nSide[k], radii[k], rotation,
                    cxs.AsSpan(first, count), cys.AsSpan(first, count), czs.AsSpan(first, count));
                // Radial jitter of ±RadialJitter s_k: exactly co-spherical points make every bisector plane of a shell pass
                // through the centre, so cells reaching far inward end in near-degenerate spikes; the jitter breaks that.
                double amplitude = RadialJitter * spacing[k] / radii[k];
                for (int i = first; i < first + count; i++)
                {
                    double f = 1 + amplitude * (2 * random.NextDouble() - 1);
                    cxs[i] *= f; cys[i] *= f; czs[i] *= f;
                }
            }
        });

        // Keep the candidates inside the box, in shell order (deterministic).
        int kept = 0, lastShell = -1;
        for (int k = 0; k < shells; k++)
        {
            int before = kept;
            for (long i = offset[k]; i < offset[k + 1]; i++)
            {
                if (!domain.Contains(cxs[i], cys[i], czs[i])) continue;
                cxs[kept] = cxs[i]; cys[kept] = cys[i]; czs[kept] = czs[i];
                kept++;
            }
            if (kept > before) lastShell = k;
        }
        var points = new PointSet(kept, units);
        Array.Copy(cxs, points.X, kept);
        Array.Copy(cys, points.Y, kept);
        Array.Copy(czs, points.Z, kept);
        Array.Fill(points.Layer, PointLayers.Background);
        Array.Fill(points.TargetDensity, settings.Density);

        // Body and background tessellated together: the body's cells fill the hole, so background cells end at the surface.
        int nb = body.Count, n = nb + kept;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        body.X.CopyTo(x, 0); body.Y.CopyTo(y, 0); body.Z.CopyTo(z, 0);
        Array.Copy(cxs, 0, x, nb, kept); Array.Copy(cys, 0, y, nb, kept); Array.Copy(czs, 0, z, nb, kept);
        double outer = 2 * far + settings.BoxSide;
        var field = integrateBodyCells
            ? new BackgroundDensityProfile(profile, bodyRadius, settings.Density, outer, units)
            : new BackgroundDensityProfile(null, bodyRadius, settings.Density, outer, units);
        VoronoiCells cells;
        try
        {
            cells = VoronoiTessellation.Compute(x, y, z, domain, new TessellationOptions { MassProfile = field, Parallel = parallel });
        }
        catch (ArgumentException e) when (e.Message.Contains("outside", StringComparison.OrdinalIgnoreCase))
        {
            throw new ArgumentException($"A body point lies outside the background box: {e.Message}", nameof(body), e);
        }
        var mass = cells.Mass!;
        Array.Copy(mass, nb, points.Mass, 0, kept);
        var volume = cells.Volume.AsSpan(nb).ToArray();
        return new BackgroundPoints(points, volume, domain, settings, bodyRadius, s0, r0,
            lastShell >= 0 ? spacing[lastShell] : s0, lastShell + 1)
        {
            BodyCellVolume = cells.Volume.AsSpan(0, nb).ToArray(),
            BodyCellMass = integrateBodyCells ? mass.AsSpan(0, nb).ToArray() : null,
        };
    }

    private static double MedianNearest(PointSet body, KdTreeSearch search, ReadOnlySpan<int> which)
    {
        var distance = new double[which.Length];
        Span<int> slot = stackalloc int[1];
        Span<double> d2 = stackalloc double[1];
        for (int j = 0; j < which.Length; j++)
        {
            int i = which[j];
            search.Nearest(body.X[i], body.Y[i], body.Z[i], i, slot, d2);
            distance[j] = Math.Sqrt(d2[0]);
        }
        Array.Sort(distance);
        int m = distance.Length / 2;
        return distance.Length % 2 == 1 ? distance[m] : 0.5 * (distance[m - 1] + distance[m]);
    }
}
