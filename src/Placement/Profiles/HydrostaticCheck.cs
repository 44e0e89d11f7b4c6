using Placement.Bodies;

namespace Placement.Profiles;

/// <summary>Measures hydrostatic equilibrium of a profile that carries pressure, optionally with a softened point mass at its centre.</summary>
/// <remarks>
/// Residual at r: |dP/dr + G M_tot(r) ρ(r)/r²| / (G M_tot(r) ρ(r)/r²) with M_tot = M(r) + m_c g(r/h) (g from
/// <see cref="SplineSoftening"/>); hydrostatic equilibrium dP/dr = −G M ρ/r² (e.g. Kippenhahn, Weigert &amp; Weiss 2012,
/// eq. 2.4). dP/dr is the five-point central difference with step δ = 1e-3 r (truncation ~δ⁴, rounding ~1e-16/δ relative),
/// so the residual of an exact equilibrium reads about 1e-10 or less; callers choose radii whose stencil [r − 2δ, r + 2δ]
/// does not cross a density step or the edge of the profile. The pressure is <see cref="ScaleHeights.PressureQuantity"/>, or
/// in dimensionless units (which carry no dimensions) the quantity named <c>P</c>.
/// </remarks>
public static class HydrostaticCheck
{
    /// <summary>Relative half-width of the difference stencil: it covers [r(1 − 2·StencilStep), r(1 + 2·StencilStep)].</summary>
    public const double StencilStep = 1e-3;

    /// <summary>Residual statistics at <paramref name="radii"/>.</summary>
    /// <param name="profile">The profile; must carry a pressure (<see cref="ScaleHeights.PressureQuantity"/>).</param>
    /// <param name="radii">Radii &gt; 0, length units; those where ρ, P or M_tot vanish are skipped.</param>
    /// <param name="coreMass">Mass of a softened point mass at the centre, mass units (0: none).</param>
    /// <param name="softening">Its softening length, length units (≥ 0).</param>
    /// <exception cref="ArgumentException">The profile carries no pressure.</exception>
    public static HydrostaticResidual Evaluate(IRadialProfile profile, IReadOnlyList<double> radii, double coreMass = 0, double softening = 0)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(radii);
        string name = PressureName(profile)
            ?? throw new ArgumentException("The profile carries no pressure (no quantity with the dimension of pressure).", nameof(profile));
        double g = profile.Units.GravitationalConstant;
        double P(double r) => profile.TryQuantity(name, r, out double v) ? v : double.NaN;
        int count = 0;
        double max = 0, sum = 0, where = double.NaN;
        foreach (double r in radii)
        {
            if (!(r > 0)) continue;
            double rho = profile.Density(r);
            double mTot = profile.EnclosedMass(r) + (coreMass == 0 ? 0 : SplineSoftening.EnclosedMass(r, coreMass, softening));
            if (!(rho > 0) || !(mTot > 0)) continue;
            double d = StencilStep * r;
            double dp = (P(r - 2 * d) - 8 * P(r - d) + 8 * P(r + d) - P(r + 2 * d)) / (12 * d);
            double weight = g * mTot * rho / (r * r);
            double res = Math.Abs(dp + weight) / weight;
            if (double.IsNaN(res)) continue;
            count++;
            sum += res * res;
            if (res > max) { max = res; where = r; }
        }
        return count == 0 ? HydrostaticResidual.None : new HydrostaticResidual(count, max, Math.Sqrt(sum / count), where);
    }

    /// <summary>The carried pressure's name: <see cref="ScaleHeights.PressureQuantity"/>, or <c>P</c> in dimensionless units; null when none.</summary>
    internal static string? PressureName(IRadialProfile profile)
    {
        if (ScaleHeights.PressureQuantity(profile) is { } name) return name;
        if (profile.Units.Name != "dimensionless") return null;
        foreach (var q in profile.Quantities) if (q.Name == Polytrope.PressureName) return q.Name;
        return null;
    }
}
