using Placement.Units;

namespace Placement.Profiles;

/// <summary>Built-in demonstration bodies. These are INVENTED scenarios for trying the library, not models of real stars.</summary>
public static class DemoBodies
{
    /// <summary>Name of the hydrogen mass-fraction quantity of <see cref="TwoZoneStar"/>.</summary>
    public const string HydrogenFraction = "X_H";

    /// <summary>
    /// An INVENTED layered star (not a real stellar model) that exercises the hard cases: a dense core, a density step
    /// at a composition change, and a steep envelope falling to zero density at the surface over about 11 decades.
    /// </summary>
    /// <remarks>
    /// <para>Solar units (G = 1). Shape before normalisation, with R = 1 and core radius r_s = 0.2: core
    /// ρ = 1 − ½(r/r_s)² for r &lt; r_s; at r_s the density drops by a factor 4 (an invented composition change, X_H from
    /// 0.3 to 0.7); envelope ρ = ρ(r_s⁺) exp(−(r − r_s)/0.07) ((R − r)/(R − r_s))^1.5. The density is then scaled so the
    /// total mass is 1 M_sun (central density ≈ 17 M_sun/R_sun³ ≈ 1e2 g/cm³). Pressure <c>P</c> is obtained by
    /// integrating hydrostatic equilibrium dP/dr = −G M ρ / r² inward from P(R) = 0 (adaptive Gauss–Legendre per row
    /// interval, 1e-12 relative), so the body is in equilibrium by construction; <c>X_H</c> is carried as composition.</para>
    /// <para>Rows: 400, a radius repeated at the step, rows equally spaced in a blend of r and ln(R − r) so the envelope is
    /// resolved down to 1e-6 R below the surface.</para>
    /// </remarks>
    /// <param name="rows">Approximate number of rows, ≥ 40.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rows"/> is below 40.</exception>
    public static TabulatedProfile TwoZoneStar(int rows = 400)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(rows, 40);
        const double big = 1.0, rs = 0.2, scale = 0.07, step = 4.0;
        double Core(double r) => 1 - 0.5 * (r / rs) * (r / rs);
        double envelope0 = Core(rs) / step;
        double Envelope(double r) => r >= big ? 0 : envelope0 * Math.Exp(-(r - rs) / scale) * Math.Pow((big - r) / (big - rs), 1.5);

        int coreRows = rows / 5, envRows = rows - coreRows;
        var r = new List<double>(rows + 1);
        var rho = new List<double>(rows + 1);
        var x = new List<double>(rows + 1);
        for (int i = 0; i < coreRows; i++)
        {
            double ri = rs * i / (coreRows - 1.0);
            r.Add(ri); rho.Add(Core(ri)); x.Add(0.3);
        }
        // Envelope rows: equal steps in s = ½[(r − r_s)/(R − r_s) + 1 − ln(1 + (R − r)/c)/ln(1 + (R − r_s)/c)], c = 1e-6 R.
        const double c = 1e-6 * big;
        double norm = Math.Log(1 + (big - rs) / c);
        double S(double ri) => 0.5 * ((ri - rs) / (big - rs) + 1 - Math.Log(1 + (big - ri) / c) / norm);
        for (int i = 0; i < envRows; i++)
        {
            double target = (double)i / (envRows - 1), lo = rs, hi = big;
            for (int it = 0; it < 100; it++) { double mid = 0.5 * (lo + hi); if (S(mid) < target) lo = mid; else hi = mid; }
            double ri = i == 0 ? rs : i == envRows - 1 ? big : 0.5 * (lo + hi);
            r.Add(ri); rho.Add(Envelope(ri)); x.Add(0.7);
        }

        var shape = new TabulatedProfile(r, rho, UnitSystem.Solar);
        double k = 1.0 / shape.TotalMass;
        for (int i = 0; i < rho.Count; i++) rho[i] *= k;
        var composition = new[] { new TabulatedQuantity(new ProfileQuantity(HydrogenFraction, PhysicalUnit.One), x) };
        return new TabulatedProfile(r, rho, UnitSystem.Solar,
            new TabulatedProfileOptions { Description = "INVENTED two-zone demo star (not a real star)" }, quantities: composition)
            .WithHydrostaticPressure();
    }
}
