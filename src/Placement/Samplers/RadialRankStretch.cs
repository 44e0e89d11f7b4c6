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
}
