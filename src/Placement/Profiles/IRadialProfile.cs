using Placement.Units;

namespace Placement.Profiles;

/// <summary>
/// A spherically symmetric mass distribution on [0, R]: density ρ(r), enclosed mass M(r) and its inverse r(M).
/// This is the contract every sampler and every quality check works from.
/// </summary>
/// <remarks>
/// All lengths, masses and densities are in <see cref="Units"/>. Implementations must be thread-safe for
/// concurrent reads, must have ρ ≥ 0 on [0, R], M(0) = 0, M(R) = <see cref="TotalMass"/>, and M strictly
/// increasing wherever ρ &gt; 0 so that <see cref="RadiusOfEnclosedMass(double)"/> is well defined.
/// </remarks>
public interface IRadialProfile
{
    /// <summary>The units of every quantity this profile returns.</summary>
    UnitSystem Units { get; }

    /// <summary>Outer radius R, in length units.</summary>
    double OuterRadius { get; }

    /// <summary>Total mass M(R), in mass units.</summary>
    double TotalMass { get; }

    /// <summary>A short stable text that identifies the profile's data (a hash), for provenance.</summary>
    string Fingerprint { get; }

    /// <summary>Density ρ(r) in mass/length³; 0 outside [0, R].</summary>
    double Density(double r);

    /// <summary>Enclosed mass M(r) = ∫₀ʳ 4πs²ρ(s) ds; 0 for r ≤ 0 and <see cref="TotalMass"/> for r ≥ R.</summary>
    double EnclosedMass(double r);

    /// <summary>The radius r with M(r) = m, for 0 ≤ m ≤ <see cref="TotalMass"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="m"/> is outside [0, M(R)].</exception>
    double RadiusOfEnclosedMass(double m);

    /// <summary>Extra quantities carried along with density (e.g. pressure), each with its unit; empty by default.</summary>
    /// <remarks>Added as a default member so existing implementations need not change.</remarks>
    IReadOnlyList<ProfileQuantity> Quantities => [];

    /// <summary>Value of the extra quantity <paramref name="name"/> at radius r (length units), in the quantity's unit.</summary>
    /// <param name="name">One of the names in <see cref="Quantities"/> (ordinal comparison).</param>
    /// <param name="r">Radius in length units; quantities are 0 outside [0, R] by convention.</param>
    /// <param name="value">The value, or NaN when the profile does not carry the quantity.</param>
    /// <returns>False when the profile does not carry the quantity.</returns>
    bool TryQuantity(string name, double r, out double value)
    {
        value = double.NaN;
        return false;
    }

    /// <summary>
    /// Radii (length units) where the density jumps, such as composition changes in a layered body: ascending, strictly
    /// inside (0, R). Empty by default (a profile without steps, or one that does not know them). Shell samplers put a
    /// shell boundary on each, so no shell of points straddles a step.
    /// </summary>
    /// <remarks>Added as a default member so existing implementations need not change.</remarks>
    IReadOnlyList<double> DensitySteps => [];

    /// <summary>
    /// A softened point mass at the centre that the gas stands beside (the core left by core replacement), in this
    /// profile's units; null by default. It is not part of <see cref="TotalMass"/>.
    /// </summary>
    Bodies.PointMass? CentralPointMass => null;

    /// <summary>
    /// Mass whose gravity acts at radius r (mass units): M(r) plus the share of <see cref="CentralPointMass"/> inside r
    /// for its softening kernel (<see cref="Bodies.SplineSoftening.EnclosedMass"/>), so g = G·GravitatingMass(r)/r².
    /// </summary>
    /// <param name="r">Radius, length units.</param>
    double GravitatingMass(double r) =>
        EnclosedMass(r) + (CentralPointMass is { } c ? Bodies.SplineSoftening.EnclosedMass(r, c.Mass, c.SofteningLength) : 0);

    /// <summary>Batch form of <see cref="Density(double)"/>; implementations may override for speed.</summary>
    void Density(ReadOnlySpan<double> r, Span<double> rho)
    {
        if (rho.Length < r.Length) throw new ArgumentException("Output span is shorter than the input.", nameof(rho));
        for (int i = 0; i < r.Length; i++) rho[i] = Density(r[i]);
    }

    /// <summary>Batch form of <see cref="RadiusOfEnclosedMass(double)"/>; implementations may override for speed.</summary>
    void RadiusOfEnclosedMass(ReadOnlySpan<double> m, Span<double> r)
    {
        if (r.Length < m.Length) throw new ArgumentException("Output span is shorter than the input.", nameof(r));
        for (int i = 0; i < m.Length; i++) r[i] = RadiusOfEnclosedMass(m[i]);
    }
}
