using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>Common parameters of analytic spheres with a scale length, truncated at a user radius R and normalised to a user mass inside R.</summary>
/// <remarks>
/// Truncation convention shared by <see cref="PlummerSphere"/> and <see cref="HernquistSphere"/>: inside R the density is
/// the untruncated model's, whose mass parameter M∞ is chosen so that M(R) equals the user mass exactly; beyond R it is 0.
/// </remarks>
public abstract class TruncatedSphere : IRadialProfile
{
    /// <summary>Validates and stores the parameters.</summary>
    /// <param name="kind">Short model name used in the fingerprint.</param>
    /// <param name="mass">Mass inside R, mass units.</param>
    /// <param name="scaleRadius">Scale length a, length units.</param>
    /// <param name="outerRadius">Truncation radius R, length units.</param>
    /// <param name="units">Units; <see cref="UnitSystem.Dimensionless"/> when null.</param>
    /// <param name="enclosedFraction">M(R)/M∞ of the untruncated model as a function of (a, R).</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is not finite and positive.</exception>
    protected TruncatedSphere(string kind, double mass, double scaleRadius, double outerRadius, UnitSystem? units, Func<double, double, double> enclosedFraction)
    {
        ArgumentNullException.ThrowIfNull(enclosedFraction);
        ProfileGuards.Positive(mass, nameof(mass), "Mass");
        ProfileGuards.Positive(scaleRadius, nameof(scaleRadius), "Scale radius");
        ProfileGuards.Positive(outerRadius, nameof(outerRadius), "Outer radius");
        TotalMass = mass;
        OuterRadius = outerRadius;
        ScaleRadius = scaleRadius;
        Units = units ?? UnitSystem.Dimensionless;
        UntruncatedMass = mass / enclosedFraction(scaleRadius, outerRadius);
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"{kind}:M={mass:R}:a={scaleRadius:R}:R={outerRadius:R}:{Units.Name}");
    }

    /// <summary>Scale length a, in length units.</summary>
    public double ScaleRadius { get; }

    /// <summary>Mass parameter M∞ of the untruncated model, in mass units.</summary>
    public double UntruncatedMass { get; }

    /// <inheritdoc />
    public UnitSystem Units { get; }

    /// <inheritdoc />
    public double OuterRadius { get; }

    /// <inheritdoc />
    public double TotalMass { get; }

    /// <inheritdoc />
    public string Fingerprint { get; }

    /// <inheritdoc />
    public abstract double Density(double r);

    /// <inheritdoc />
    public abstract double EnclosedMass(double r);

    /// <inheritdoc />
    public abstract double RadiusOfEnclosedMass(double m);
}
