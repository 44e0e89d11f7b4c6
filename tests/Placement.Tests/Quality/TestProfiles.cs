using System.Globalization;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Quality;

/// <summary>
/// A Plummer sphere truncated at radius R: ρ = (3M/4πa³)(1 + r²/a²)^(−5/2), M(r) = M r³/(r² + a²)^(3/2)
/// (standard textbook result, e.g. Binney &amp; Tremaine 2008), zero beyond R. Test-only stand-in until the
/// library's profile types are merged.
/// </summary>
internal sealed class TruncatedPlummer : IRadialProfile
{
    private readonly double _m, _a;

    public TruncatedPlummer(double plummerMass, double scale, double radius)
    {
        _m = plummerMass; _a = scale; OuterRadius = radius;
        TotalMass = Enclosed(radius);
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"test-plummer:{plummerMass:R}:{scale:R}:{radius:R}");
    }

    public UnitSystem Units => UnitSystem.Dimensionless;
    public double OuterRadius { get; }
    public double TotalMass { get; }
    public string Fingerprint { get; }

    public double Density(double r)
    {
        if (r < 0 || r > OuterRadius) return 0;
        double q = 1 + r * r / (_a * _a);
        return 3 * _m / (4 * Math.PI * _a * _a * _a) * Math.Pow(q, -2.5);
    }

    public double EnclosedMass(double r) => r <= 0 ? 0 : Enclosed(Math.Min(r, OuterRadius));

    public double RadiusOfEnclosedMass(double m)
    {
        if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m));
        if (m == 0) return 0;
        // Invert M(r) = M r³/(r² + a²)^(3/2): r = a / √((M/m)^(2/3) − 1).
        return Math.Min(OuterRadius, _a / Math.Sqrt(Math.Pow(_m / m, 2.0 / 3.0) - 1));
    }

    private double Enclosed(double r) => _m * r * r * r / Math.Pow(r * r + _a * _a, 1.5);
}

/// <summary>
/// Two uniform layers: ρ₁ for r &lt; r₁, ρ₂ for r₁ ≤ r ≤ R (a density step, as at a composition change);
/// M(r) in closed form. Test-only.
/// </summary>
internal sealed class TwoLayerSphere : IRadialProfile
{
    private readonly double _rho1, _rho2, _r1;

    public TwoLayerSphere(double rho1, double rho2, double r1, double radius)
    {
        _rho1 = rho1; _rho2 = rho2; _r1 = r1; OuterRadius = radius;
        TotalMass = EnclosedMass(radius);
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"test-two-layer:{rho1:R}:{rho2:R}:{r1:R}:{radius:R}");
    }

    public UnitSystem Units => UnitSystem.Dimensionless;
    public double OuterRadius { get; }
    public double TotalMass { get; }
    public string Fingerprint { get; }

    public double Density(double r) => r < 0 || r > OuterRadius ? 0 : r < _r1 ? _rho1 : _rho2;

    public double EnclosedMass(double r)
    {
        if (r <= 0) return 0;
        r = Math.Min(r, OuterRadius);
        double k = 4 * Math.PI / 3;
        return r < _r1 ? k * _rho1 * r * r * r : k * (_rho1 * _r1 * _r1 * _r1 + _rho2 * (r * r * r - _r1 * _r1 * _r1));
    }

    public double RadiusOfEnclosedMass(double m)
    {
        if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m));
        double k = 4 * Math.PI / 3, m1 = k * _rho1 * _r1 * _r1 * _r1;
        return m <= m1 ? Math.Cbrt(m / (k * _rho1)) : Math.Cbrt(_r1 * _r1 * _r1 + (m - m1) / (k * _rho2));
    }
}
