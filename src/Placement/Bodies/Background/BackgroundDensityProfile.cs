using System.Globalization;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Bodies.Background;

/// <summary>
/// The density field of a body sitting in a uniform background medium, as a radial profile about the body's centre:
/// the body's ρ(r) inside its radius R, the background density ρ_bg from R out to an outer radius, 0 beyond.
/// </summary>
/// <remarks>
/// M(r) = M_body(min(r, R)) + ρ_bg (4π/3)(min(max(r, R), R_out)³ − R³) (exact). With no body this is the background
/// alone with an empty hole of radius R, whose integral over any region is ρ_bg times the region's volume outside the
/// hole — what <see cref="Tessellation.CellMasses"/> needs to give background cells their mass. The outer radius should
/// reach beyond every cell (e.g. past the corners of the box).
/// </remarks>
public sealed class BackgroundDensityProfile : IRadialProfile
{
    private readonly IRadialProfile? _body;
    private readonly double _bodyRadius, _density, _bodyMass;

    /// <summary>Creates the field.</summary>
    /// <param name="body">The body's profile (its outer radius is R), or null for an empty hole of radius <paramref name="holeRadius"/>.</param>
    /// <param name="holeRadius">R when <paramref name="body"/> is null (ignored otherwise), length units.</param>
    /// <param name="density">ρ_bg, mass/length³; positive and finite.</param>
    /// <param name="outerRadius">R_out &gt; R, length units.</param>
    /// <param name="units">Units (must equal the body's when a body is given).</param>
    /// <exception cref="ArgumentException">A value is out of range or the units differ from the body's.</exception>
    public BackgroundDensityProfile(IRadialProfile? body, double holeRadius, double density, double outerRadius, UnitSystem units)
    {
        ArgumentNullException.ThrowIfNull(units);
        _body = body;
        _bodyRadius = body?.OuterRadius ?? holeRadius;
        if (body is not null && body.Units != units) throw new ArgumentException($"Units '{units.Name}' differ from the body's '{body.Units.Name}'.", nameof(units));
        if (!(_bodyRadius > 0) || !double.IsFinite(_bodyRadius)) throw new ArgumentException($"Body radius {_bodyRadius} must be positive and finite.", nameof(holeRadius));
        if (!(density > 0) || !double.IsFinite(density)) throw new ArgumentException($"Background density {density} must be positive and finite.", nameof(density));
        if (!(outerRadius > _bodyRadius) || !double.IsFinite(outerRadius)) throw new ArgumentException($"Outer radius {outerRadius} must exceed the body radius {_bodyRadius}.", nameof(outerRadius));
        _density = density;
        _bodyMass = body?.TotalMass ?? 0;
        OuterRadius = outerRadius;
        Units = units;
        TotalMass = EnclosedMass(outerRadius);
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"background({body?.Fingerprint ?? "hole"};R={_bodyRadius:R};rho={density:R};Rout={outerRadius:R})");
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
    public double Density(double r) =>
        r < _bodyRadius ? (_body?.Density(r) ?? 0) : r <= OuterRadius ? _density : 0;

    /// <inheritdoc />
    public double EnclosedMass(double r)
    {
        if (!(r > 0)) return 0;
        double inner = _body?.EnclosedMass(Math.Min(r, _bodyRadius)) ?? 0;
        if (r <= _bodyRadius) return inner;
        double s = Math.Min(r, OuterRadius), b = _bodyRadius;
        // s³ − b³ = (s − b)(s² + s b + b²): no cancellation just outside the surface.
        return inner + _density * 4.0 / 3.0 * Math.PI * (s - b) * (s * s + s * b + b * b);
    }

    /// <inheritdoc />
    public double RadiusOfEnclosedMass(double m)
    {
        if (!(m >= 0 && m <= TotalMass * (1 + 1e-15)))
            throw new ArgumentOutOfRangeException(nameof(m), m, $"Mass must lie in [0, {TotalMass}].");
        if (_body is not null && m <= _bodyMass) return _body.RadiusOfEnclosedMass(m);
        if (_body is null && m == 0) return 0;
        double shell = (m - _bodyMass) / (_density * 4.0 / 3.0 * Math.PI);
        return Math.Min(OuterRadius, Math.Cbrt(_bodyRadius * _bodyRadius * _bodyRadius + shell));
    }
}
