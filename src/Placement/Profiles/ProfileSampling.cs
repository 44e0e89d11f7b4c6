namespace Placement.Profiles;

/// <summary>Chooses radii at which to tabulate a profile so that steep envelopes, cusps and surfaces are all resolved.</summary>
public static class ProfileSampling
{
    /// <summary>
    /// About <paramref name="count"/> strictly increasing radii on [0, R] (0 omitted when ρ(0) is infinite): the union
    /// of four equal shares: uniform in r, uniform in ln r from 1e-6 R, uniform in enclosed mass, and uniform in
    /// ln(R − r) down to 1e-6 R from the surface; radii closer than 1e-9 R are merged.
    /// </summary>
    /// <param name="profile">The profile to sample.</param>
    /// <param name="count">Target number of radii, ≥ 8.</param>
    /// <returns>Ascending radii, first 0 (or 1e-6 R for a cusp), last R.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is below 8.</exception>
    public static double[] Radii(IRadialProfile profile, int count)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 8);
        double big = profile.OuterRadius, m = profile.TotalMass;
        int share = count / 4;
        const double inner = 1e-6;
        var all = new List<double>(4 * share + 2) { big };
        bool finiteCentre = double.IsFinite(profile.Density(0));
        all.Add(finiteCentre ? 0 : inner * big);
        for (int i = 1; i < share; i++)
        {
            double f = (double)i / share;
            all.Add(big * f);
            all.Add(big * Math.Pow(inner, 1 - f));
            all.Add(profile.RadiusOfEnclosedMass(m * f));
            all.Add(big * (1 - Math.Pow(inner, f)));
        }
        all.Sort();
        var result = new List<double>(all.Count);
        foreach (double r in all)
        {
            if (!finiteCentre && r < inner * big) continue;
            if (result.Count > 0 && r - result[^1] <= 1e-9 * big) continue;
            result.Add(r);
        }
        result[^1] = big;
        return [.. result];
    }
}
