using Placement.Profiles;

namespace Placement.Samplers;

/// <summary>
/// Moves points along their directions so that the k-th nearest to the centre sits at the radius enclosing the mass
/// fraction (k + ½)/N: after it, the enclosed mass of the points differs from M(r) by at most half a point's mass at
/// every radius, whatever the set's noise.
/// </summary>
/// <remarks>
/// A rank form of stretch mapping (methods reference §3): the same radial map M(r')/M = F(r) with the empirical
/// fraction F of the set itself in place of (r/R0)³, so it is exact for any starting set (glass, relaxed, noisy),
/// and it preserves the radial order and every direction. Ties in radius are broken by index, so the result is
/// deterministic. Cost O(N log N).
/// </remarks>
public static class RadialRankStretch
{
    /// <summary>Applies the rank stretch in place to points of equal mass.</summary>
    /// <param name="profile">Target profile.</param>
    /// <param name="x">x coordinates, moved in place (length units).</param>
    /// <param name="y">y coordinates.</param>
    /// <param name="z">z coordinates.</param>
    /// <exception cref="ArgumentException">Spans differ in length.</exception>
    public static void Apply(IRadialProfile profile, Span<double> x, Span<double> y, Span<double> z)
    {
        ArgumentNullException.ThrowIfNull(profile);
        if (x.Length != y.Length || x.Length != z.Length) throw new ArgumentException("x, y and z must have the same length.", nameof(x));
        int n = x.Length;
        if (n == 0) return;
        var r = new double[n];
        var order = new int[n];
        for (int i = 0; i < n; i++)
        {
            r[i] = Math.Sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
            order[i] = i;
        }
        var keys = (double[])r.Clone();
        // Sort by radius, ties by index (Array.Sort is unstable, so sort on a composite key).
        Array.Sort(order, (a, b) => keys[a] != keys[b] ? keys[a].CompareTo(keys[b]) : a.CompareTo(b));
        var mass = new double[n];
        double total = profile.TotalMass;
        for (int k = 0; k < n; k++) mass[k] = total * ((k + 0.5) / n);
        var target = new double[n];
        profile.RadiusOfEnclosedMass(mass, target);
        for (int k = 0; k < n; k++)
        {
            int i = order[k];
            if (r[i] > 0)
            {
                double s = target[k] / r[i];
                x[i] *= s; y[i] *= s; z[i] *= s;
            }
            else
            {
                // A point exactly at the centre keeps no direction: give it the +z axis.
                x[i] = 0; y[i] = 0; z[i] = target[k];
            }
        }
    }

    /// <summary>
    /// A smooth form of the rank stretch: one monotone piecewise-linear map r → r′ through knots every
    /// <paramref name="pointsPerKnot"/> points in radius order, each knot going to the radius that encloses its rank's
    /// share of the mass; every point moves by the same map, so points at one radius (a shell) stay at one radius and
    /// local structure survives, while the enclosed mass is exact at every knot.
    /// </summary>
    /// <param name="profile">Target profile.</param>
    /// <param name="x">x coordinates, moved in place (length units).</param>
    /// <param name="y">y coordinates.</param>
    /// <param name="z">z coordinates.</param>
    /// <param name="pointsPerKnot">Points between knots, ≥ 1 (1 is the exact rank stretch up to ties).</param>
    /// <exception cref="ArgumentException">Spans differ in length.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="pointsPerKnot"/> &lt; 1.</exception>
    public static void ApplySmooth(IRadialProfile profile, Span<double> x, Span<double> y, Span<double> z, int pointsPerKnot)
    {
        ArgumentNullException.ThrowIfNull(profile);
        if (x.Length != y.Length || x.Length != z.Length) throw new ArgumentException("x, y and z must have the same length.", nameof(x));
        ArgumentOutOfRangeException.ThrowIfLessThan(pointsPerKnot, 1);
        int n = x.Length;
        if (n == 0) return;
        var r = new double[n];
        for (int i = 0; i < n; i++) r[i] = Math.Sqrt(x[i] * x[i] + y[i] * y[i] + z[i] * z[i]);
        var sorted = (double[])r.Clone();
        Array.Sort(sorted);
        // Knots: (the radius below which k points lie, the radius enclosing k/N of the mass), k = 0, K, 2K, …, N; a knot
        // whose radius equals the previous one (points tied on a shell) is merged into it.
        var from = new List<double> { 0.0 };
        var to = new List<double> { 0.0 };
        double total = profile.TotalMass;
        for (int k = pointsPerKnot; ; k += pointsPerKnot)
        {
            if (k >= n) k = n;
            // The knot sits midway between the k-th and (k+1)-th radii, so a shell is not split by it.
            double knot = k == n ? sorted[n - 1] : 0.5 * (sorted[k - 1] + sorted[k]);
            if (knot > from[^1])
            {
                from.Add(knot);
                to.Add(profile.RadiusOfEnclosedMass(total * ((double)k / n)));
            }
            if (k == n) break;
        }
        for (int i = 0; i < n; i++)
        {
            double ri = r[i];
            int j = from.BinarySearch(ri);
            double target;
            if (j >= 0) target = to[j];
            else
            {
                j = ~j;
                if (j >= from.Count) target = to[^1] * (ri / from[^1]);
                else
                {
                    double t = (ri - from[j - 1]) / (from[j] - from[j - 1]);
                    target = to[j - 1] + t * (to[j] - to[j - 1]);
                }
            }
            if (ri > 0)
            {
                double s = target / ri;
                x[i] *= s; y[i] *= s; z[i] *= s;
            }
        }
    }
}
