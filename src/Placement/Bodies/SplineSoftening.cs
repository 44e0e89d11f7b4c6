namespace Placement.Bodies;

/// <summary>
/// The softened gravity of a point mass used everywhere in Placement: the field of a cubic B-spline mass distribution of
/// compact support h, exactly Newtonian for r ≥ h. Every <see cref="PointMass"/> softening length means this kernel.
/// </summary>
/// <remarks>
/// <para>With u = r/h, the point mass m is spread as the cubic spline density
/// ρ(r) = (8m/(πh³)) · {1 − 6u² + 6u³ for u &lt; ½; 2(1 − u)³ for ½ ≤ u &lt; 1; 0 beyond}, the kernel of the softened
/// gravity in tree/particle codes (Springel, Yoshida &amp; White 2001, New Astron. 6, 79; Springel 2005, MNRAS 364, 1105;
/// cited from memory — the forms below were derived here from that density and are checked numerically in the tests).
/// Enclosed mass fraction g(u) = M(&lt;r)/m:
/// g = (32/3)u³ − (192/5)u⁵ + 32u⁶ for u &lt; ½; g = 64(u³/3 − 3u⁴/4 + 3u⁵/5 − u⁶/6) − 1/15 for ½ ≤ u &lt; 1; 1 beyond.
/// Potential Φ = −(Gm/h) f(u): f = 14/5 − (16/3)u² + (48/5)u⁴ − (32/5)u⁵ for u &lt; ½;
/// f = 16/5 − 1/(15u) − (32/3)u² + 16u³ − (48/5)u⁴ + (32/15)u⁵ for ½ ≤ u &lt; 1; f = 1/u beyond. The radial acceleration is
/// −dΦ/dr = −G m g(u)/r². Both g and Φ are continuous with continuous first derivatives at u = ½ and u = 1.</para>
/// <para>The central potential is −(14/5)Gm/h, the same as a Plummer sphere of scale ε = 5h/14 = h/2.8, which is why
/// h = 2.8 ε is quoted as the "Plummer-equivalent" softening (follows from the formula above).</para>
/// <para>h = 0 means an unsoftened (Newtonian) point mass. Lengths and masses in any consistent units; G is passed in.</para>
/// </remarks>
public static class SplineSoftening
{
    /// <summary>h/ε for the Plummer sphere with the same central potential: 14/5.</summary>
    public const double PlummerEquivalentRatio = 14.0 / 5.0;

    /// <summary>Dimensionless density shape w(u) with ρ(r) = (m/h³) w(r/h); ∫ 4πu² w(u) du = 1 over [0, 1].</summary>
    /// <param name="u">r/h, ≥ 0.</param>
    public static double DensityShape(double u)
    {
        const double c = 8 / Math.PI;
        if (u < 0.5) return c * (1 - 6 * u * u + 6 * u * u * u);
        if (u < 1)
        {
            double a = 1 - u;
            return 2 * c * a * a * a;
        }
        return 0;
    }

    /// <summary>Enclosed mass fraction g(u) = M(&lt;r)/m of the spline distribution, u = r/h; 0 at u ≤ 0, 1 at u ≥ 1.</summary>
    /// <param name="u">r/h.</param>
    public static double MassFraction(double u)
    {
        if (!(u > 0)) return 0;
        double u3 = u * u * u;
        if (u < 0.5) return u3 * (32.0 / 3 - 192.0 / 5 * u * u + 32 * u3);
        if (u < 1) return 64 * u3 * (1.0 / 3 - 0.75 * u + 0.6 * u * u - u3 / 6) - 1.0 / 15;
        return 1;
    }

    /// <summary>Dimensionless potential f(u) with Φ = −(Gm/h) f(r/h); f = 1/u for u ≥ 1, f(0) = 14/5.</summary>
    /// <param name="u">r/h, ≥ 0.</param>
    public static double PotentialShape(double u)
    {
        double u2 = u * u;
        if (u < 0.5) return 14.0 / 5 + u2 * (-16.0 / 3 + u2 * (48.0 / 5 - 32.0 / 5 * u));
        if (u < 1) return 16.0 / 5 - 1 / (15 * u) + u2 * (-32.0 / 3 + u * (16 + u * (-48.0 / 5 + 32.0 / 15 * u)));
        return 1 / u;
    }

    /// <summary>Mass of the softened point mass inside radius r, mass units.</summary>
    /// <param name="r">Radius, length units.</param>
    /// <param name="mass">Point mass m, mass units.</param>
    /// <param name="softening">Softening length h ≥ 0, length units (0: all the mass at the centre).</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="softening"/> is negative or not finite.</exception>
    public static double EnclosedMass(double r, double mass, double softening)
    {
        CheckSoftening(softening);
        if (!(r > 0)) return 0;
        return softening == 0 ? mass : mass * MassFraction(r / softening);
    }

    /// <summary>Potential Φ(r) of the softened point mass, length²/time² of the units of <paramref name="gravitationalConstant"/>.</summary>
    /// <param name="r">Radius, length units, ≥ 0 (r = 0 allowed when h &gt; 0).</param>
    /// <param name="mass">Point mass m, mass units.</param>
    /// <param name="softening">Softening length h ≥ 0, length units.</param>
    /// <param name="gravitationalConstant">G in the same units.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="softening"/> is negative or not finite.</exception>
    public static double Potential(double r, double mass, double softening, double gravitationalConstant)
    {
        CheckSoftening(softening);
        if (softening == 0) return -gravitationalConstant * mass / r;
        return -gravitationalConstant * mass / softening * PotentialShape(Math.Abs(r) / softening);
    }

    /// <summary>Radial acceleration −dΦ/dr = −G m g(r/h)/r² (negative: towards the mass), length/time² units.</summary>
    /// <param name="r">Radius, length units, &gt; 0.</param>
    /// <param name="mass">Point mass m, mass units.</param>
    /// <param name="softening">Softening length h ≥ 0, length units.</param>
    /// <param name="gravitationalConstant">G in the same units.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="softening"/> is negative or not finite.</exception>
    public static double RadialAcceleration(double r, double mass, double softening, double gravitationalConstant) =>
        -gravitationalConstant * EnclosedMass(r, mass, softening) / (r * r);

    private static void CheckSoftening(double softening)
    {
        if (!(softening >= 0) || !double.IsFinite(softening))
            throw new ArgumentOutOfRangeException(nameof(softening), softening, "Softening length must be finite and ≥ 0.");
    }
}
