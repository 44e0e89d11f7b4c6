using Placement.Points;

namespace Placement.Profiles;

public static partial class ScaleHeights
{
    /// <summary>
    /// Cells per pressure scale height of PLACED points, from each point's own volume, in equal-count radial bins, and
    /// the point count that would give <paramref name="cellsPerScaleHeight"/> everywhere between
    /// <paramref name="innerRadius"/> and the radius enclosing <paramref name="massFraction"/> of the mass.
    /// </summary>
    /// <remarks>
    /// <para>Per bin (points sorted by radius, equal numbers per bin): r̄ the mean radius, the spacing Δ = ⟨V⟩^(1/3) with
    /// ⟨V⟩ the mean volume per point (the edge of a cube of that volume, as in <see cref="Resolution"/>; the Voronoi cell
    /// radius (3V/4π)^(1/3) is 0.62 Δ), H_P(r̄) from the profile, cells per H_P = H_P / Δ. The volume per point may be
    /// a Voronoi cell volume or m/ρ with an SPH density. Points needed: N (k / cells)³, since the spacing of a given
    /// sampler scales as N^(−1/3); the largest over the bins is the count that resolves H_P everywhere in the window.
    /// The threshold k is the user's: no published value is built in (see the type's remarks).</para>
    /// </remarks>
    /// <param name="profile">The target profile; must carry a pressure.</param>
    /// <param name="points">The placed points, in the profile's units.</param>
    /// <param name="volumePerPoint">Volume per point (length³, finite and &gt; 0), one per point.</param>
    /// <param name="cellsPerScaleHeight">Wanted cells per H_P (&gt; 0), or null for none (then no points-needed column).</param>
    /// <param name="innerRadius">Radius inside which points are left out (e.g. a softened core), length units, ≥ 0.</param>
    /// <param name="massFraction">Points beyond the radius enclosing this mass fraction are left out (H_P → 0 at the surface), in (0, 1].</param>
    /// <param name="bins">Number of radial bins, ≥ 1 (fewer when the window holds fewer points).</param>
    /// <exception cref="InvalidOperationException">The profile carries no pressure.</exception>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    /// <exception cref="ArgumentException">Units differ, the volume array has the wrong length or a bad value, or no point lies in the window.</exception>
    public static ResolutionReport PlacedResolution(IRadialProfile profile, PointSet points, double[] volumePerPoint, double? cellsPerScaleHeight,
        double innerRadius = 0, double massFraction = 0.99, int bins = 50)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(volumePerPoint);
        if (cellsPerScaleHeight is { } k && (!(k > 0) || !double.IsFinite(k)))
            throw new ArgumentOutOfRangeException(nameof(cellsPerScaleHeight), k, "Cells per scale height must be finite and > 0.");
        if (!(innerRadius >= 0) || !double.IsFinite(innerRadius)) throw new ArgumentOutOfRangeException(nameof(innerRadius), innerRadius, "The inner radius must be finite and >= 0.");
        if (!(massFraction > 0 && massFraction <= 1)) throw new ArgumentOutOfRangeException(nameof(massFraction), massFraction, "Mass fraction must lie in (0, 1].");
        ArgumentOutOfRangeException.ThrowIfLessThan(bins, 1);
        if (points.Units != profile.Units)
            throw new ArgumentException($"The points are in '{points.Units.Name}' units but the profile in '{profile.Units.Name}'.", nameof(points));
        int n = points.Count;
        if (volumePerPoint.Length != n) throw new ArgumentException($"{volumePerPoint.Length} volumes for {n} points.", nameof(volumePerPoint));
        string name = PressureQuantity(profile)
            ?? throw new InvalidOperationException("The profile carries no pressure (no quantity with the dimension of pressure), so scale heights are undefined.");
        double outer = profile.RadiusOfEnclosedMass(profile.TotalMass * massFraction);
        var radius = new List<double>(n);
        var index = new List<int>(n);
        for (int i = 0; i < n; i++)
        {
            if (!(volumePerPoint[i] > 0) || !double.IsFinite(volumePerPoint[i]))
                throw new ArgumentException($"Point {i} has volume {volumePerPoint[i]}; expected finite and > 0.", nameof(volumePerPoint));
            double r = points.Radius(i);
            if (r < innerRadius || r > outer) continue;
            radius.Add(r);
            index.Add(i);
        }
        int m = radius.Count;
        if (m == 0) throw new ArgumentException($"No point lies between the inner radius {innerRadius:G6} and the radius {outer:G6} enclosing {massFraction:P1} of the mass.", nameof(innerRadius));
        var keys = radius.ToArray();
        var order = index.ToArray();
        Array.Sort(keys, order);
        int rows = Math.Min(bins, m);
        var binRadius = new double[rows];
        var scale = new double[rows];
        var spacing = new double[rows];
        var cells = new double[rows];
        var needed = new double[rows];
        double g = profile.Units.GravitationalConstant, worst = double.NaN, fewest = double.PositiveInfinity, limiting = double.NaN;
        for (int b = 0; b < rows; b++)
        {
            int s0 = (int)((long)m * b / rows), s1 = (int)((long)m * (b + 1) / rows);
            double sumR = 0, sumV = 0;
            for (int s = s0; s < s1; s++) { sumR += keys[s]; sumV += volumePerPoint[order[s]]; }
            double r = sumR / (s1 - s0);
            binRadius[b] = r;
            spacing[b] = Math.Cbrt(sumV / (s1 - s0));
            scale[b] = At(profile, name, r, g);
            cells[b] = scale[b] / spacing[b];
            needed[b] = cellsPerScaleHeight is { } wanted ? n * Math.Pow(wanted / cells[b], 3) : double.NaN;
            if (cells[b] < fewest) { fewest = cells[b]; limiting = r; }
            if (!(needed[b] <= worst)) worst = double.IsNaN(needed[b]) ? worst : needed[b];
        }
        return new ResolutionReport(profile.Units, name, n, cellsPerScaleHeight ?? double.NaN, massFraction, binRadius, scale, cells, needed, worst, limiting)
        {
            InnerRadius = innerRadius,
            Spacing = spacing,
        };
    }
}
