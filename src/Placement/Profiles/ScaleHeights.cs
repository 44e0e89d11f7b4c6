using Placement.Units;

namespace Placement.Profiles;

/// <summary>Pressure scale heights of a profile and the number of equal-mass points needed to resolve them.</summary>
/// <remarks>
/// <para>H_P(r) = P / (ρ g) with g = G M_grav(r) / r², M_grav = <see cref="IRadialProfile.GravitatingMass"/> (gas plus any softened central core) (hydrostatic definition; G from the profile's unit system). The
/// pressure is the profile's first carried quantity whose unit has the dimension of pressure (mass length⁻¹ time⁻²),
/// e.g. <c>P</c> of a polytrope or a table column in dyn/cm².</para>
/// <para>Resolution: N equal-mass points give a local spacing Δ(r) = (M / (N ρ(r)))^(1/3), so k cells per scale height
/// at r need N ≥ M k³ / (ρ H_P³). Near the surface P → 0 and H_P → 0, which no finite N resolves, so the requirement
/// is taken over the radii inside the one enclosing a chosen mass fraction. How many cells per H_P a run needs is the
/// user's choice: no published threshold is built in (Zingale et al. 2002 discuss the dependence; their number is not
/// confirmed here).</para>
/// </remarks>
public static partial class ScaleHeights
{
    /// <summary>The name of the quantity used as pressure, or null when the profile carries none.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    public static string? PressureQuantity(IRadialProfile profile) => QuantityLookup.FirstWithDimension(profile, -1, 1, -2, 0);

    /// <summary>H_P at radius r (length units), or NaN where it is undefined (no pressure, r = 0, ρ = 0).</summary>
    public static double PressureScaleHeight(IRadialProfile profile, double r)
    {
        ArgumentNullException.ThrowIfNull(profile);
        string? name = PressureQuantity(profile);
        return name is null ? double.NaN : At(profile, name, r, profile.Units.GravitationalConstant);
    }

    /// <summary>
    /// Tabulates H_P, the cells per H_P that <paramref name="count"/> points would give, and the points needed for
    /// <paramref name="cellsPerScaleHeight"/> cells, at radii enclosing equal steps of mass up to
    /// <paramref name="massFraction"/> of the total.
    /// </summary>
    /// <param name="profile">The profile; must carry a pressure.</param>
    /// <param name="count">A point count to evaluate (cells per H_P it gives).</param>
    /// <param name="cellsPerScaleHeight">Cells per H_P wanted, &gt; 0.</param>
    /// <param name="massFraction">Mass fraction inside which the requirement counts, in (0, 1].</param>
    /// <param name="rows">Number of radii, ≥ 2.</param>
    /// <exception cref="InvalidOperationException">The profile carries no pressure.</exception>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static ResolutionReport Resolution(IRadialProfile profile, long count, double cellsPerScaleHeight, double massFraction = 0.99, int rows = 200)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        if (!(cellsPerScaleHeight > 0) || !double.IsFinite(cellsPerScaleHeight)) throw new ArgumentOutOfRangeException(nameof(cellsPerScaleHeight), cellsPerScaleHeight, "Cells per scale height must be finite and > 0.");
        if (!(massFraction > 0 && massFraction <= 1)) throw new ArgumentOutOfRangeException(nameof(massFraction), massFraction, "Mass fraction must lie in (0, 1].");
        ArgumentOutOfRangeException.ThrowIfLessThan(rows, 2);
        string name = PressureQuantity(profile)
            ?? throw new InvalidOperationException("The profile carries no pressure (no quantity with the dimension of pressure), so scale heights are undefined.");
        double g = profile.Units.GravitationalConstant, m = profile.TotalMass;
        var radius = new double[rows];
        var scale = new double[rows];
        var cells = new double[rows];
        var needed = new double[rows];
        var spacings = new double[rows];
        double worst = 0, worstRadius = double.NaN;
        for (int i = 0; i < rows; i++)
        {
            double r = profile.RadiusOfEnclosedMass(m * massFraction * (i + 1) / rows);
            double h = At(profile, name, r, g);
            double rho = profile.Density(r);
            radius[i] = r;
            scale[i] = h;
            double spacing = Math.Cbrt(m / (count * rho));
            spacings[i] = spacing;
            cells[i] = h / spacing;
            needed[i] = m * Math.Pow(cellsPerScaleHeight / h, 3) / rho;
            if (needed[i] > worst) { worst = needed[i]; worstRadius = r; }
        }
        return new ResolutionReport(profile.Units, name, count, cellsPerScaleHeight, massFraction, radius, scale, cells, needed, worst, worstRadius)
        {
            Spacing = spacings,
        };
    }

    private static double At(IRadialProfile profile, string name, double r, double g)
    {
        if (!(r > 0)) return double.NaN;
        double rho = profile.Density(r);
        if (!(rho > 0) || !profile.TryQuantity(name, r, out double p) || !(p > 0)) return double.NaN;
        double gravity = g * profile.GravitatingMass(r) / (r * r); // a softened core's gravity counts too
        return p / (rho * gravity);
    }
}
