using Placement.Profiles;

namespace Placement.Samplers.Lattices;

/// <summary>The distortion a stretch mapping of a uniform ball applies to a profile, as a table over radius.</summary>
/// <remarks>
/// Map radius r of a uniform ball of radius R (the profile's outer radius, so a uniform profile gives no distortion)
/// to r' with M(r')/M = (r/R)³ (standard stretch mapping; methods reference §3). Then dr'/dr = 3 M r² / (R³ 4π r'²
/// ρ(r')) and the tangential stretch is r'/r; a cell is isotropic only where the two agree.
/// </remarks>
public static class StretchAnisotropy
{
    /// <summary>
    /// Tabulates the stretch at <paramref name="rows"/> radii, at the mass fractions (i − ½)/rows, i = 1 … rows.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rows"/> is below 1.</exception>
    public static IReadOnlyList<StretchAnisotropyRow> Compute(IRadialProfile profile, int rows = 64)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentOutOfRangeException.ThrowIfLessThan(rows, 1);
        double m = profile.TotalMass, big = profile.OuterRadius;
        var table = new StretchAnisotropyRow[rows];
        for (int i = 0; i < rows; i++)
        {
            double f = (i + 0.5) / rows;
            double r = big * Math.Cbrt(f);
            double rp = profile.RadiusOfEnclosedMass(f * m);
            double rho = profile.Density(rp);
            double radial = rho > 0 ? 3 * m * r * r / (big * big * big * 4 * Math.PI * rp * rp * rho) : double.PositiveInfinity;
            table[i] = new StretchAnisotropyRow(f, r, rp, radial, rp / r);
        }
        return table;
    }
}
