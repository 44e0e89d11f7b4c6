namespace Placement.Profiles;

/// <summary>
/// A place where a profile's density changes by a large factor over a radial width that points of a given mass cannot
/// resolve: a declared step (<see cref="IRadialProfile.DensitySteps"/>, width 0) or a transition found by
/// <see cref="DensityJumps.Find"/>, such as a composition change that a table resolves over one row.
/// </summary>
/// <param name="Radius">Radius of the jump, length units: the declared step, or where ln ρ crosses the mean of its values on either side.</param>
/// <param name="InnerDensity">Density just inside the jump, mass/length³.</param>
/// <param name="OuterDensity">Density just outside the jump, mass/length³.</param>
/// <param name="Width">Radial width over which the middle 80 % of the change in ln ρ happens, length units (0 for a declared step).</param>
/// <param name="Declared">True for a step the profile declares, false for one found from the density.</param>
public readonly record struct DensityJump(double Radius, double InnerDensity, double OuterDensity, double Width, bool Declared);

/// <summary>
/// Finds the density jumps that equal-mass points of a given mass see as steps: the declared ones and every transition
/// over which ln ρ changes by more than a given contrast within a window of half a local point spacing while the
/// change over a four times wider window is not much larger.
/// </summary>
/// <remarks>
/// <para>The local point spacing is ℓ(r) = (m/ρ(r))^{1/3}, the edge of a cube holding one point of mass m. The profile is
/// scanned outward from the radius of the first point's mass, r(m), in steps of ℓ/8; at each scan radius r,
/// with h = ℓ(r)/4, D₁ = ln ρ(r − h) − ln ρ(r + h) and D₄ = ln ρ(r − 4h) − ln ρ(r + 4h) (both windows inside [0, R], else the point is skipped). The
/// point is part of a jump when |D₁| ≥ ln(contrast), D₁ and D₄ have the same sign and |D₁| ≥ 0.6 |D₄|: the change is
/// concentrated in a window narrower than half a spacing, so no shell of points can follow it. A smooth profile,
/// however steep, has D₁/D₄ ≈ 1/4 where ln ρ is locally linear in r (an exponential atmosphere, a steep power law
/// away from its origin) and smaller still where it steepens outward (a surface where ρ → 0 has D₄ = ∞), so it is
/// never taken for a jump; a transition resolved over several spacings is not either (shells follow it). Consecutive
/// flagged scan points form one jump, placed by bisection where ln ρ crosses the mean of the window's two ends.</para>
/// <para>Cost: about 8 ∫ dr/ℓ scan points (a few thousand for 1e6 points), five density evaluations each. The result
/// depends only on the profile and m, so every caller (shell layouts, relaxation) sees the same jumps.</para>
/// </remarks>
public static class DensityJumps
{
    /// <summary>Contrast below which a found transition is left to the samplers' smooth treatment (factor 2 in ρ).</summary>
    public const double DefaultMinimumContrast = 2.0;

    /// <summary>Concentration |D₁|/|D₄| at or above which a transition counts as a jump.</summary>
    public const double ConcentrationThreshold = 0.6;

    private const int MaxScanPoints = 10_000_000;

    /// <summary>
    /// The declared steps and the jumps found for points of mass <paramref name="pointMass"/>, ascending in radius; found
    /// jumps within one window of a declared step are left out.
    /// </summary>
    /// <param name="profile">Profile to scan.</param>
    /// <param name="pointMass">Mass of one point, mass units (M/N for N equal-mass points).</param>
    /// <param name="minimumContrast">Smallest density ratio across a jump that is reported (≥ 1; found jumps only).</param>
    /// <exception cref="ArgumentOutOfRangeException">The point mass is not positive or the contrast is below 1.</exception>
    public static IReadOnlyList<DensityJump> Find(IRadialProfile profile, double pointMass, double minimumContrast = DefaultMinimumContrast)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ProfileGuards.Positive(pointMass, nameof(pointMass), "Point mass");
        if (!(minimumContrast >= 1) || !double.IsFinite(minimumContrast))
            throw new ArgumentOutOfRangeException(nameof(minimumContrast), minimumContrast, "Minimum contrast must be finite and ≥ 1.");
        double outer = profile.OuterRadius;
        var jumps = DeclaredList(profile);
        var declared = jumps.Count;
        double threshold = Math.Log(minimumContrast);
        double r = profile.RadiusOfEnclosedMass(Math.Min(profile.TotalMass, pointMass));
        double floor = 1e-12 * outer;
        // The current run of flagged scan points: the one with the largest |D₁| stands for the run.
        double bestR = double.NaN, bestH = 0, bestD = 0;
        for (int scanned = 0; r < outer && scanned < MaxScanPoints; scanned++)
        {
            double rho = profile.Density(r);
            if (!(rho > 0)) break;
            double h = Math.Max(0.25 * Math.Cbrt(pointMass / rho), floor);
            // Both windows must lie inside the body: a window clamped at the centre or the surface compares the same
            // two densities at both widths and would take any smooth profile for a jump. A jump within a spacing of the
            // surface or the centre is below the resolution of the points anyway.
            if (r - 4 * h < 0 || r + 4 * h > outer)
            {
                if (!double.IsNaN(bestR)) { AddFound(profile, jumps, declared, bestR, bestH); bestR = double.NaN; }
                r += 0.5 * h;
                continue;
            }
            double d1 = LogDensity(profile, r - h) - LogDensity(profile, r + h);
            double d4 = LogDensity(profile, r - 4 * h) - LogDensity(profile, r + 4 * h);
            bool flagged = double.IsFinite(d1) && Math.Abs(d1) >= threshold && Math.Abs(d1) > 0
                && Math.Sign(d1) == Math.Sign(d4) && Math.Abs(d1) >= ConcentrationThreshold * Math.Abs(d4);
            if (flagged)
            {
                if (double.IsNaN(bestR) || Math.Abs(d1) > Math.Abs(bestD)) { bestR = r; bestH = h; bestD = d1; }
            }
            else if (!double.IsNaN(bestR))
            {
                AddFound(profile, jumps, declared, bestR, bestH);
                bestR = double.NaN;
            }
            r += 0.5 * h;
        }
        if (!double.IsNaN(bestR)) AddFound(profile, jumps, declared, bestR, bestH);
        jumps.Sort((a, b) => a.Radius.CompareTo(b.Radius));
        return jumps;
    }

    /// <summary>The profile's declared steps (<see cref="IRadialProfile.DensitySteps"/> inside (0, R)) as jumps of width 0.</summary>
    public static IReadOnlyList<DensityJump> Declared(IRadialProfile profile)
    {
        ArgumentNullException.ThrowIfNull(profile);
        return DeclaredList(profile);
    }

    private static List<DensityJump> DeclaredList(IRadialProfile profile)
    {
        double outer = profile.OuterRadius;
        var jumps = new List<DensityJump>();
        foreach (double s in profile.DensitySteps)
        {
            if (!(s > 0 && s < outer)) continue;
            double eps = 1e-9 * s;
            jumps.Add(new DensityJump(s, profile.Density(s - eps), profile.Density(Math.Min(s + eps, outer)), 0, Declared: true));
        }
        return jumps;
    }

    private static void AddFound(IRadialProfile profile, List<DensityJump> jumps, int declared, double centre, double h)
    {
        double lo = Math.Max(0, centre - h), hi = Math.Min(profile.OuterRadius, centre + h);
        double lnIn = LogDensity(profile, lo), lnOut = LogDensity(profile, hi);
        for (int k = 0; k < declared; k++)
            if (Math.Abs(jumps[k].Radius - centre) <= 2 * h) return;
        double at = Crossing(profile, lo, hi, lnIn, lnOut, 0.5);
        double width = Math.Abs(Crossing(profile, lo, hi, lnIn, lnOut, 0.9) - Crossing(profile, lo, hi, lnIn, lnOut, 0.1));
        jumps.Add(new DensityJump(at, Math.Exp(lnIn), Math.Exp(lnOut), width, Declared: false));
    }

    // Radius in [lo, hi] where ln ρ crosses lnIn + f (lnOut − lnIn), by bisection (ln ρ need not be monotone there; one
    // crossing is found).
    private static double Crossing(IRadialProfile profile, double lo, double hi, double lnIn, double lnOut, double f)
    {
        double target = lnIn + f * (lnOut - lnIn);
        double sign = Math.Sign(lnOut - lnIn);
        for (int i = 0; i < 100 && hi - lo > 1e-15 * hi; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (sign * (LogDensity(profile, mid) - target) < 0) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    private static double LogDensity(IRadialProfile profile, double r) =>
        Math.Log(profile.Density(Math.Clamp(r, 0, profile.OuterRadius)));
}
