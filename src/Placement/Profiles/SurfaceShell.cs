namespace Placement.Profiles;

/// <summary>Closed forms for the outermost shell of a body whose density falls to zero at R as ρ_a ((R − r)/(R − r_a))^p.</summary>
internal static class SurfaceShell
{
    /// <summary>∫ from r_a to r of 4πs²ρ(s) ds, written with u = (R − r)/(R − r_a) and 1 − u^a = −expm1(a ln u) so it stays accurate near r_a.</summary>
    public static double Mass(double ra, double big, double rhoA, double p, double r)
    {
        double u0 = big - ra;
        double u = Math.Max(0, (big - r) / u0), lu = Math.Log(u);
        double a1 = u > 0 ? -double.ExpM1((p + 1) * lu) : 1, a2 = u > 0 ? -double.ExpM1((p + 2) * lu) : 1, a3 = u > 0 ? -double.ExpM1((p + 3) * lu) : 1;
        return 4 * Math.PI * rhoA * u0 * (big * big * a1 / (p + 1) - 2 * big * u0 * a2 / (p + 2) + u0 * u0 * a3 / (p + 3));
    }

    /// <summary>The exponent p fitted to the row (r_b, ρ_b) inside (r_a, ρ_a), clamped to [0.25, 10]; 1 when undefined.</summary>
    public static double Exponent(double rb, double rhoB, double ra, double rhoA, double big)
    {
        double p = Math.Log(rhoB / rhoA) / Math.Log((big - rb) / (big - ra));
        return double.IsFinite(p) ? Math.Clamp(p, 0.25, 10) : 1;
    }
}
