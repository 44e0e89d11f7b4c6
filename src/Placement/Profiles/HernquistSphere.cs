using Placement.Units;

namespace Placement.Profiles;

/// <summary>A Hernquist sphere truncated at a user radius R: ρ ∝ 1/(r (r + a)³) on [0, R] (central cusp ρ ∝ 1/r), zero beyond.</summary>
/// <remarks>
/// Closed forms (Hernquist 1990, ApJ 356, 359, eqs. 2–3; Binney &amp; Tremaine 2008, eq. 2.64):
/// ρ(r) = M∞ a/(2π r (r + a)³), M(r) = M∞ r²/(r + a)². Truncation convention: the density inside R is the untruncated
/// one, with M∞ = M (R + a)²/R² so that the truncated body has exactly the user mass M = M(R). Inverse: with
/// s = √(m/M∞), r = a s/(1 − s), the denominator written as (1 − m/M∞)/(1 + s) with 1 − m/M∞ = (M∞ − m)/M∞.
/// ρ(0) = +∞ (the cusp); M(r) and r(M) are accurate to a few ulp.
/// </remarks>
public sealed class HernquistSphere : TruncatedSphere
{
    private readonly double _a, _mInf;

    /// <summary>Creates a Hernquist sphere of mass <paramref name="mass"/> inside <paramref name="outerRadius"/>.</summary>
    /// <param name="mass">Mass inside R (the truncated total), in mass units.</param>
    /// <param name="scaleRadius">Hernquist scale length a, in length units.</param>
    /// <param name="outerRadius">Truncation radius R, in length units.</param>
    /// <param name="units">Units; <see cref="UnitSystem.Dimensionless"/> when null.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is not finite and positive.</exception>
    public HernquistSphere(double mass, double scaleRadius, double outerRadius, UnitSystem? units = null)
        : base("hernquist", mass, scaleRadius, outerRadius, units, (a, big) => { double q = big / (big + a); return q * q; })
    {
        _a = scaleRadius;
        _mInf = UntruncatedMass;
    }

    /// <inheritdoc />
    public override double Density(double r)
    {
        if (!(r >= 0 && r <= OuterRadius)) return 0;
        if (r == 0) return double.PositiveInfinity;
        double s = r + _a;
        return _mInf * _a / (2 * Math.PI * r * s * s * s);
    }

    /// <inheritdoc />
    public override double EnclosedMass(double r)
    {
        if (!(r > 0)) return 0;
        if (r >= OuterRadius) return TotalMass;
        double q = r / (r + _a);
        return _mInf * q * q;
    }

    /// <inheritdoc />
    public override double RadiusOfEnclosedMass(double m)
    {
        ProfileGuards.MassInRange(m, TotalMass, nameof(m));
        if (m >= TotalMass) return OuterRadius;
        double s = Math.Sqrt(m / _mInf);
        return _a * s * (1 + s) / ((_mInf - m) / _mInf);
    }
}
