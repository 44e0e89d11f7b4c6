using Placement.Units;

namespace Placement.Profiles;

/// <summary>A Plummer sphere truncated at a user radius R: ρ ∝ (1 + r²/a²)^(−5/2) on [0, R], zero beyond.</summary>
/// <remarks>
/// Closed forms (Plummer 1911; Binney &amp; Tremaine 2008, Galactic Dynamics, 2nd ed., eq. 2.44b):
/// ρ(r) = 3M∞/(4πa³) (1 + r²/a²)^(−5/2), M(r) = M∞ r³/(r² + a²)^(3/2). Truncation convention: the density inside R is
/// the untruncated Plummer density, with M∞ = M (R² + a²)^(3/2)/R³ chosen so that the truncated body has exactly
/// the user mass M = M(R). The inverse is closed-form: with x = m/M∞, r = a √(x^(2/3)/(1 − x^(2/3))), the
/// denominator written as (1 − x)(1 + x^(1/3))/(1 + x^(1/3) + x^(2/3)) with 1 − x = (M∞ − m)/M∞ to avoid cancellation.
/// M(r) and r(M) are accurate to a few ulp (≪ 1e-10 relative).
/// </remarks>
public sealed class PlummerSphere : TruncatedSphere
{
    private readonly double _a, _mInf, _rho0;

    /// <summary>Creates a Plummer sphere of mass <paramref name="mass"/> inside <paramref name="outerRadius"/>.</summary>
    /// <param name="mass">Mass inside R (the truncated total), in mass units.</param>
    /// <param name="scaleRadius">Plummer scale length a, in length units.</param>
    /// <param name="outerRadius">Truncation radius R, in length units.</param>
    /// <param name="units">Units; <see cref="UnitSystem.Dimensionless"/> when null.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is not finite and positive.</exception>
    public PlummerSphere(double mass, double scaleRadius, double outerRadius, UnitSystem? units = null)
        : base("plummer", mass, scaleRadius, outerRadius, units, (a, big) => { double q = big / Math.Sqrt(big * big + a * a); return q * q * q; })
    {
        _a = scaleRadius;
        _mInf = UntruncatedMass;
        _rho0 = 3 * UntruncatedMass / (4 * Math.PI * _a * _a * _a);
    }

    /// <inheritdoc />
    public override double Density(double r)
    {
        if (!(r >= 0 && r <= OuterRadius)) return 0;
        double u = 1 + r * r / (_a * _a);
        return _rho0 / (u * u * Math.Sqrt(u));
    }

    /// <inheritdoc />
    public override double EnclosedMass(double r)
    {
        if (!(r > 0)) return 0;
        if (r >= OuterRadius) return TotalMass;
        double s = Math.Sqrt(r * r + _a * _a);
        double q = r / s;
        return _mInf * q * q * q;
    }

    /// <inheritdoc />
    public override double RadiusOfEnclosedMass(double m)
    {
        ProfileGuards.MassInRange(m, TotalMass, nameof(m));
        if (m >= TotalMass) return OuterRadius;
        double x = m / _mInf;
        double c = Math.Cbrt(x);
        double oneMinusU = ((_mInf - m) / _mInf) * (1 + c) / (1 + c + c * c); // 1 − c² = (1 − c³)(1 + c)/(1 + c + c²)
        return _a * Math.Sqrt(c * c / oneMinusU);
    }
}
