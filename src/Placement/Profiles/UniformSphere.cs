using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>A sphere of constant density: ρ = 3M/(4πR³), M(r) = M (r/R)³.</summary>
public sealed class UniformSphere : IRadialProfile
{
    private readonly double _rho;

    /// <summary>Creates a uniform sphere of the given mass and radius.</summary>
    /// <param name="mass">Total mass, in <paramref name="units"/> mass units; finite and &gt; 0.</param>
    /// <param name="radius">Radius, in <paramref name="units"/> length units; finite and &gt; 0.</param>
    /// <param name="units">Units of mass and radius; <see cref="UnitSystem.Dimensionless"/> when null.</param>
    /// <exception cref="ArgumentOutOfRangeException">Mass or radius is not finite and positive.</exception>
    public UniformSphere(double mass, double radius, UnitSystem? units = null)
    {
        ProfileGuards.Positive(mass, nameof(mass), "Mass");
        ProfileGuards.Positive(radius, nameof(radius), "Radius");
        TotalMass = mass;
        OuterRadius = radius;
        Units = units ?? UnitSystem.Dimensionless;
        _rho = 3.0 * mass / (4.0 * Math.PI * radius * radius * radius);
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"uniform:M={mass:R}:R={radius:R}:{Units.Name}");
    }

    /// <inheritdoc />
    public UnitSystem Units { get; }

    /// <inheritdoc />
    public double OuterRadius { get; }

    /// <inheritdoc />
    public double TotalMass { get; }

    /// <inheritdoc />
    public string Fingerprint { get; }

    /// <inheritdoc />
    public double Density(double r) => r >= 0 && r <= OuterRadius ? _rho : 0.0;

    /// <inheritdoc />
    public double EnclosedMass(double r)
    {
        if (r <= 0) return 0.0;
        if (r >= OuterRadius) return TotalMass;
        double x = r / OuterRadius;
        return TotalMass * x * x * x;
    }

    /// <inheritdoc />
    public double RadiusOfEnclosedMass(double m)
    {
        if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m), m, $"Enclosed mass must lie in [0, {TotalMass}].");
        return OuterRadius * Math.Cbrt(m / TotalMass);
    }
}
