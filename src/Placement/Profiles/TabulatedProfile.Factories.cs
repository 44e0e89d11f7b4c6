using Placement.Numerics;
using Placement.Units;

namespace Placement.Profiles;

public sealed partial class TabulatedProfile
{
    /// <summary>
    /// Samples any profile into a tabulated one at <see cref="ProfileSampling.Radii"/>, with the sampled profile's exact
    /// M at every row (<see cref="MassSource.Tabulated"/>) and every quantity it carries.
    /// </summary>
    /// <param name="profile">The profile to sample; its density must be &gt; 0 on [0, R) (0 allowed at R).</param>
    /// <param name="rows">Target number of rows, ≥ 8.</param>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rows"/> is below 8.</exception>
    /// <exception cref="ArgumentException">The sampled density breaks a table rule (e.g. zero inside).</exception>
    public static TabulatedProfile FromProfile(IRadialProfile profile, int rows = 2000)
    {
        ArgumentNullException.ThrowIfNull(profile);
        double[] r = ProfileSampling.Radii(profile, rows);
        var rho = new double[r.Length];
        var m = new double[r.Length];
        for (int i = 0; i < r.Length; i++)
        {
            rho[i] = profile.Density(r[i]);
            m[i] = profile.EnclosedMass(r[i]);
        }
        var quantities = new List<TabulatedQuantity>();
        foreach (var q in profile.Quantities)
        {
            var v = new double[r.Length];
            for (int i = 0; i < r.Length; i++) profile.TryQuantity(q.Name, r[i], out v[i]);
            quantities.Add(new TabulatedQuantity(q, v));
        }
        var options = new TabulatedProfileOptions { MassSource = MassSource.Tabulated, Description = $"sampled from {profile.Fingerprint}" };
        return new TabulatedProfile(r, rho, profile.Units, options, m, quantities);
    }

    /// <summary>
    /// Builds a profile from rows given in mass coordinate (enclosed mass m, density ρ), converting to radius with
    /// dr³/dm = 3/(4πρ).
    /// </summary>
    /// <remarks>
    /// ρ(m) is interpolated like density in radius (PCHIP of ln ρ against ln m; ρ0 + (ρ1 − ρ0)(m/m1)^(2/3) from a
    /// centre row m = 0, the equivalent of the even centre in r; a power law below a first row m0 &gt; 0), and
    /// ∫ dm/ρ is integrated per interval by adaptive Gauss–Legendre quadrature to 1e-13 relative. A zero-density last row
    /// gets the radius at which a density falling linearly in r from the previous row holds the last interval's mass.
    /// The resulting profile reproduces the given m at every row exactly (<see cref="MassSource.Tabulated"/>); its
    /// <see cref="Consistency"/> reports how far the radius-space interpolant's own integral was from them.
    /// </remarks>
    /// <param name="mass">Enclosed masses, mass units: ≥ 0, non-decreasing, a repeated value marking a density step.</param>
    /// <param name="density">Densities, mass/length³.</param>
    /// <param name="units">Units of both columns and of the result.</param>
    /// <param name="options">Build options (its <see cref="TabulatedProfileOptions.MassSource"/> is ignored).</param>
    /// <param name="quantities">Optional extra quantities, one value per row.</param>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ArgumentException">The rows break a rule (the message names the row, column and value).</exception>
    public static TabulatedProfile FromMassCoordinate(IReadOnlyList<double> mass, IReadOnlyList<double> density, UnitSystem units,
        TabulatedProfileOptions? options = null, IReadOnlyList<TabulatedQuantity>? quantities = null)
    {
        ArgumentNullException.ThrowIfNull(mass);
        ArgumentNullException.ThrowIfNull(density);
        ArgumentNullException.ThrowIfNull(units);
        options ??= TabulatedProfileOptions.Default;
        double[] m = [.. mass], rho = [.. density];
        Throw(ProfileTableChecks.Check(m, rho, options.AllowZeroOuterDensity, options.AllowDensitySteps, "mass"));
        int n = m.Length;
        bool zeroSurface = rho[^1] == 0;
        int positive = zeroSurface ? n - 1 : n;
        var r3 = new double[n];
        if (positive >= 2)
        {
            var curve = ProfileCurve.Build(m.AsSpan(0, positive), rho.AsSpan(0, positive), density: true, centreExponent: 2.0 / 3.0);
            double acc = 0;
            for (int k = 0; k < curve.Count; k++)
            {
                acc += 3 / (4 * Math.PI) * VolumeIntegral(curve, k);
                double end = curve.R1[k];
                for (int i = 0; i < positive; i++) if (m[i] == end) r3[i] = acc;
            }
        }
        else
        {
            r3[0] = 3 * m[0] / (4 * Math.PI * rho[0]); // one positive row: a uniform core under a zero-density surface row
        }
        var r = new double[n];
        for (int i = 0; i < positive; i++) r[i] = Math.Cbrt(r3[i]);
        if (zeroSurface)
        {
            bool hasInner = n >= 3 && m[n - 3] < m[n - 2];
            r[n - 1] = SurfaceRadius(r[n - 2], rho[n - 2], m[n - 1] - m[n - 2], hasInner ? r[n - 3] : double.NaN, hasInner ? rho[n - 3] : double.NaN);
        }
        var opts = options with { MassSource = MassSource.Tabulated };
        return new TabulatedProfile(r, rho, units, opts, m, quantities);
    }

    private static double VolumeIntegral(ProfileCurve c, int k)
    {
        double y0 = c.Y0[k], y1 = c.Y1[k];
        switch (c.Kind[k])
        {
            case ProfileCurve.CorePower:
                return c.R1[k] / (y0 * (1 - c.D0[k]));
            case ProfileCurve.Centre:
                {
                    // m = m1 t³ turns ∫ dm/(ρ0 + (ρ1 − ρ0)(m/m1)^(2/3)) into a smooth integral over t ∈ [0, 1].
                    double m1 = c.R1[k];
                    return AdaptiveQuadrature.Integrate(t => 3 * m1 * t * t / (y0 + (y1 - y0) * t * t), 0, 1).Value;
                }
            default:
                {
                    // ∫ dm/ρ = m0 ∫ exp(u − y(u)) du with u = ln(m/m0) local to the interval (full precision for large m).
                    double m0 = c.R0[k], h = c.Hx[k], d0 = c.D0[k], d1 = c.D1[k];
                    return m0 * AdaptiveQuadrature.Integrate(
                        u => Math.Exp(u - MonotoneCubic.Hermite(u / h, h, y0, y1, d0, d1)), 0, h).Value;
                }
        }
    }

    private static double SurfaceRadius(double ra, double rhoA, double dm, double rb, double rhoB)
    {
        // The radius R at which the surface shell the profile will build, ρ_a ((R − r)/(R − r_a))^p with p fitted to
        // the previous row exactly as TabulatedProfile fits it (p = 1 without one), holds the last interval's mass.
        double Shell(double big)
        {
            double p = double.IsNaN(rb) ? 1 : SurfaceShell.Exponent(rb, rhoB, ra, rhoA, big);
            return SurfaceShell.Mass(ra, big, rhoA, p, big) - dm;
        }
        double lo = ra, hi = ra + Math.Max(ra, Math.Cbrt(3 * dm / (4 * Math.PI * rhoA)));
        for (int i = 0; i < 200 && Shell(hi) < 0; i++) hi = ra + 2 * (hi - ra);
        for (int i = 0; i < 200 && hi - lo > 1e-15 * hi; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (Shell(mid) < 0) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }
}
