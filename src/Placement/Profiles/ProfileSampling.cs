namespace Placement.Profiles;

/// <summary>Chooses radii at which to tabulate a profile so that steep envelopes, cusps and surfaces are all resolved.</summary>
public static class ProfileSampling
{
    private const double Inner = 1e-6;

    /// <summary>
    /// <paramref name="count"/> strictly increasing radii on [0, R], equally spaced in the blended coordinate
    /// s(r) = ¼[r/R + L(r) + M(r)/M + S(r)] with L = ln(1 + r/r_c)/ln(1 + R/r_c) (logarithmic above r_c = 1e-6 R)
    /// and S = 1 − ln(1 + (R − r)/r_c)/ln(1 + R/r_c) (logarithmic towards the surface), so rows are dense where the
    /// radius, the log radius, the enclosed mass or the depth below the surface changes, and the spacing varies
    /// smoothly (irregular spacing costs accuracy in any cubic interpolation). When ρ(0) is infinite (a cusp) the first
    /// radius is r_c instead of 0.
    /// </summary>
    /// <param name="profile">The profile to sample.</param>
    /// <param name="count">Number of radii, ≥ 8.</param>
    /// <returns>Ascending radii, first 0 (or 1e-6 R for a cusp), last R.</returns>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is below 8.</exception>
    public static double[] Radii(IRadialProfile profile, int count)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 8);
        double big = profile.OuterRadius, total = profile.TotalMass, rc = Inner * big;
        double logNorm = Math.Log(1 + big / rc);
        double S(double r) => 0.25 * (r / big + Math.Log(1 + r / rc) / logNorm + profile.EnclosedMass(r) / total
                                      + 1 - Math.Log(1 + (big - r) / rc) / logNorm);
        bool cusp = !double.IsFinite(profile.Density(0));
        double first = cusp ? rc : 0, s0 = S(first);
        var radii = new double[count];
        radii[0] = first;
        radii[^1] = big;
        double lo = first;
        for (int i = 1; i < count - 1; i++)
        {
            double target = s0 + (1 - s0) * i / (count - 1.0);
            double a = lo, b = big;
            for (int it = 0; it < 200 && b - a > 1e-15 * big; it++)
            {
                double mid = 0.5 * (a + b);
                if (S(mid) < target) a = mid; else b = mid;
            }
            radii[i] = 0.5 * (a + b);
            lo = radii[i];
        }
        for (int i = 1; i < count; i++)
            if (!(radii[i] > radii[i - 1])) throw new InvalidOperationException($"Sampling radii collapsed at index {i}; use fewer rows.");
        return radii;
    }
}
