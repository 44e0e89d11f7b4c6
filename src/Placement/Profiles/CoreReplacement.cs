using System.Globalization;
using Placement.Numerics;

namespace Placement.Profiles;

/// <summary>
/// Replaces the inner part of a body (e.g. the dense core of a giant) by a softened point mass and a polytropic gas
/// continued inward in hydrostatic equilibrium with it, matching density, pressure and enclosed mass at the cut.
/// </summary>
/// <remarks>
/// <para>Method after Ohlmann et al. 2017 (A&amp;A 599, A5; the abstract is our confirmed source, the formulation below is
/// our own): inside the cut r_c the gas obeys P = Kρ^(1+1/n) and dP/dr = −G (m_gas(r) + m_c g(r/h)) ρ/r², with g the
/// spline softening kernel's mass fraction (<see cref="Bodies.SplineSoftening"/>). Matching ρ and P at r_c fixes
/// K = P(r_c)/ρ(r_c)^(1+1/n). The two remaining unknowns, the central gas density ρ0 and the core mass m_c, are found by
/// shooting outward from the regular centre (m_gas(0) = 0) with <see cref="DormandPrince45"/>: for a trial m_c, the
/// central density is found by scanning upward in ρ0 from ρ(r_c) by factors of 1.5 for the solutions that end at ρ(r_c)
/// at the cut, refined by Brent's method (<see cref="BracketedRoot"/>); then m_c is adjusted by Brent's method until
/// m_gas(r_c) + m_c = M(r_c).</para>
/// <para>Choice of solution: at fixed K a polytrope with n &gt; 1 shrinks as its central density grows, so for each m_c
/// there are usually two central densities that reach ρ(r_c) at the cut, a less and a more condensed one. The less
/// condensed branch is tried first (a replacement is meant to lower the central density), then the other. For a
/// polytrope of the same index n the original is recovered with m_c = 0: on the first branch when the cut lies inside
/// the radius where ξθ(ξ) peaks (ξ ≈ 2.16 for n = 3, i.e. 0.31 R, measured with our Lane–Emden solver), on the second
/// beyond it.</para>
/// <para>When even without a core the gas continued inward holds M(r_c) to within 1e-10 (relative), m_c = 0 and no core
/// is made. Finally m_c is set to M(r_c) − m_gas(r_c), so mass is continuous at the cut; the shooting's own mass
/// mismatch is reported (<see cref="CoreReplacementReport.MassMismatch"/>), measured below 1e-12 in the tests.</para>
/// <para>Errors name the value: a cut outside the body or inside the innermost tabulated row, a softening length outside
/// (0, r_c], an index outside (0, 10], no pressure carried, or no solution for the chosen n (the gas alone would hold
/// more than M(r_c) — choose a smaller, stiffer index — or no polytrope of that index reaches the cut's density).</para>
/// </remarks>
public static class CoreReplacement
{
    private const double ScanFactor = 1.5;
    private const double MaxDensityContrast = 1e18;
    private const double NoCoreTolerance = 1e-10;

    /// <summary>Cuts <paramref name="profile"/> at <c>options.CutRadius</c> and replaces the inside; see the class remarks.</summary>
    /// <param name="profile">A profile that carries pressure (e.g. <see cref="Polytrope"/>, or a table with a pressure column).</param>
    /// <param name="options">Cut radius, softening and index.</param>
    /// <returns>The gas profile (with <see cref="CoreReplacedProfile.Core"/> and <see cref="CoreReplacedProfile.Report"/>).</returns>
    /// <exception cref="ArgumentNullException">An argument is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The cut radius, softening length or index is out of range (the message names the value).</exception>
    /// <exception cref="ArgumentException">The profile carries no pressure, its density or pressure at the cut is not positive, or no solution exists.</exception>
    public static CoreReplacedProfile Apply(IRadialProfile profile, CoreReplacementOptions options)
    {
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(options);
        var inv = CultureInfo.InvariantCulture;
        double rc = options.CutRadius, big = profile.OuterRadius;
        string lu = profile.Units.LengthUnitName;
        if (!(rc > 0 && rc < big) || !double.IsFinite(rc))
            throw new ArgumentOutOfRangeException(nameof(options), rc, string.Create(inv, $"Cut radius {rc:G6} {lu} lies outside the body: it must lie strictly between 0 and the outer radius {big:G6} {lu}."));
        if (profile is TabulatedProfile table)
        {
            var rows = table.RowRadii;
            double first = rows[0] > 0 ? rows[0] : rows[1];
            if (rc <= first)
                throw new ArgumentOutOfRangeException(nameof(options), rc, string.Create(inv,
                    $"Cut radius {rc:G6} {lu} lies inside the innermost tabulated row (r = {first:G6} {lu}); the profile there is extrapolated, not data. Cut further out."));
        }
        double h = options.ResolvedSofteningLength;
        if (!(h > 0 && h <= rc) || !double.IsFinite(h))
            throw new ArgumentOutOfRangeException(nameof(options), h, string.Create(inv,
                $"Softening length {h:G6} {lu} must lie in (0, r_c = {rc:G6} {lu}]: beyond the cut the core's gravity must be Newtonian so the envelope keeps its equilibrium."));
        double n = options.Index;
        if (!(n > 0 && n <= 10))
            throw new ArgumentOutOfRangeException(nameof(options), n, string.Create(inv, $"Polytropic index {n:G6} must lie in (0, 10]."));
        string pressure = HydrostaticCheck.PressureName(profile)
            ?? throw new ArgumentException("The profile carries no pressure (no quantity with the dimension of pressure), and core replacement matches pressure at the cut; add a pressure column (e.g. TabulatedProfile.WithHydrostaticPressure).", nameof(profile));
        double rhoT = profile.Density(rc), mT = profile.EnclosedMass(rc);
        double pT = PressureAt(profile, pressure, rc);
        if (!(rhoT > 0) || !(pT > 0) || !double.IsFinite(rhoT) || !double.IsFinite(pT))
            throw new ArgumentException(string.Create(inv, $"At the cut r_c = {rc:G6} {lu} the density ({rhoT:G6}) and pressure ({pT:G6}) must be positive and finite."), nameof(profile));

        double g = profile.Units.GravitationalConstant;
        double k = pT / Math.Pow(rhoT, 1 + 1 / n);
        double wT = Math.Pow(rhoT, 1 / n);
        var shooter = new Shooter(n, k, g, h, rc, wT, mT);

        (double CoreMass, double W0, double Mismatch)? found = null;
        string why = "";
        for (int branch = 0; branch < 2 && found is null; branch++)
        {
            var (ok0, w00, r0) = shooter.Residual(0, branch);
            if (!ok0)
            {
                if (branch == 0)
                    why = string.Create(inv, $"no polytrope of that index through ρ = {rhoT:G6} and P = {pT:G6} at r_c = {rc:G6} {lu} reaches the cut with a central density below {MaxDensityContrast:G0} ρ(r_c)");
                continue;
            }
            if (Math.Abs(r0) <= NoCoreTolerance * mT) found = (0, w00, Math.Abs(r0) / mT);
            else if (r0 < 0) found = shooter.SolveCoreMass(r0, branch);
            else if (branch == 0)
                why = string.Create(inv, $"without any core the gas continued inward from r_c = {rc:G6} {lu} already holds {(r0 + mT):G6}, more than M(r_c) = {mT:G6}");
            if (found is null && branch == 0 && why.Length == 0)
                why = string.Create(inv, $"no core mass in [0, M(r_c) = {mT:G6}] balances the mass at r_c = {rc:G6} {lu}");
        }
        if (found is not { } solved)
            throw new ArgumentException(string.Create(inv, $"No solution for index n = {n:G6}: {why}. Choose a smaller (stiffer) index or another cut."), nameof(options));
        var (coreMass, w0, mismatch) = solved;
        var parameters = shooter.With(coreMass, w0);
        var (_, gasAtCut, solution) = SoftenedCorePolytrope.Integrate(parameters, mT, dense: true);
        if (coreMass > 0) coreMass = mT - gasAtCut;
        if (!(coreMass >= 0)) coreMass = 0;
        var inner = solution!;
        double rhoNew = inner.Density(rc), pNew = inner.Pressure(rc);
        var partial = new CoreReplacementReport(profile.Units, pressure, rc, h, n, k, coreMass, mT, Math.Min(gasAtCut, mT - coreMass),
            profile.Density(0), inner.Density(0), rhoT, pT, Math.Abs(rhoNew - rhoT) / rhoT, Math.Abs(pNew - pT) / pT, mismatch,
            HydrostaticResidual.None, HydrostaticResidual.None, inner.NodeCount);
        var replaced = new CoreReplacedProfile(profile, inner, pressure, coreMass, partial);
        var (inside, outside) = SampleRadii(profile, rc);
        var report = partial with
        {
            HydrostaticInside = HydrostaticCheck.Evaluate(replaced, inside, coreMass, h),
            HydrostaticOutside = HydrostaticCheck.Evaluate(replaced, outside, coreMass, h),
        };
        return new CoreReplacedProfile(profile, inner, pressure, coreMass, report);
    }

    /// <summary>
    /// The polytropic index of the profile's own structure at radius r: n = 1/(Γ − 1) with Γ = d ln P / d ln ρ by central
    /// differences over ±1e-3 r (a polytrope of index n returns n).
    /// </summary>
    /// <param name="profile">A profile that carries pressure.</param>
    /// <param name="r">Radius, length units, inside (0, R).</param>
    /// <exception cref="ArgumentException">No pressure, or the local exponent gives no index in (0, 10] (the message names it).</exception>
    public static double LocalIndex(IRadialProfile profile, double r)
    {
        ArgumentNullException.ThrowIfNull(profile);
        string pressure = HydrostaticCheck.PressureName(profile)
            ?? throw new ArgumentException("The profile carries no pressure, so its local polytropic index is undefined.", nameof(profile));
        double d = 1e-3 * r;
        double gamma = Math.Log(PressureAt(profile, pressure, r + d) / PressureAt(profile, pressure, r - d))
            / Math.Log(profile.Density(r + d) / profile.Density(r - d));
        double n = 1 / (gamma - 1);
        if (!(n > 0 && n <= 10))
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"The structure at r = {r:G6} has d ln P/d ln ρ = {gamma:G6}, which gives no polytropic index in (0, 10]; give the index explicitly."), nameof(r));
        return n;
    }

    private static double PressureAt(IRadialProfile profile, string name, double r)
    {
        profile.TryQuantity(name, r, out double p);
        var unit = profile.Quantities.First(q => q.Name == name).Unit;
        return p * unit.FactorTo(PhysicalUnit.ForSystem(profile.Units, -1, 1, -2));
    }

    /// <summary>Radii for the hydrostatic residual: 200 uniform in (0, r_c) and 200 at equal mass steps from the cut to 99 % of the mass, dropping stencils across a density step.</summary>
    private static (double[] Inside, double[] Outside) SampleRadii(IRadialProfile profile, double rc)
    {
        const int count = 200;
        var inside = new double[count];
        for (int i = 0; i < count; i++) inside[i] = rc * (i + 0.5) / count;
        var steps = new List<double>();
        if (profile is TabulatedProfile t)
        {
            var rows = t.RowRadii;
            for (int i = 1; i < rows.Length; i++) if (rows[i] == rows[i - 1]) steps.Add(rows[i]);
        }
        double mc = profile.EnclosedMass(rc), top = 0.99 * profile.TotalMass;
        var outside = new List<double>(count);
        double reach = 2 * HydrostaticCheck.StencilStep;
        for (int i = 0; i < count && top > mc; i++)
        {
            double r = profile.RadiusOfEnclosedMass(mc + (top - mc) * (i + 0.5) / count);
            bool crosses = r * (1 - reach) <= rc;
            foreach (double s in steps) crosses |= Math.Abs(s - r) <= reach * r * 1.01;
            if (!crosses) outside.Add(r);
        }
        return (inside, [.. outside]);
    }

    /// <summary>The shooting problem of one replacement (fixed n, K, h, r_c and the target at the cut).</summary>
    private sealed class Shooter(double n, double k, double g, double h, double rc, double wT, double mT)
    {
        public SoftenedCorePolytrope.Parameters With(double coreMass, double w0) => new(n, k, g, coreMass, h, w0, rc);

        private double WAtCut(double coreMass, double w0) => SoftenedCorePolytrope.Integrate(With(coreMass, w0), mT, dense: false).W - wT;

        /// <summary>
        /// The w0 ≥ w(r_c) of the given branch whose solution reaches w(r_c) at the cut: branch 0 is the smallest such w0
        /// (f = w(r_c) − w_target turns from negative to positive), branch 1 the next, where f turns negative again (for
        /// n &gt; 1 a polytrope of fixed K shrinks as its central density grows). False when none below the density limit.
        /// </summary>
        public (bool Found, double W0) CentralW(double coreMass, int branch)
        {
            double step = Math.Pow(ScanFactor, 1 / n), limit = wT * Math.Pow(MaxDensityContrast, 1 / n);
            double lo = wT, flo = WAtCut(coreMass, lo), prev = double.NaN, fprev = double.NaN;
            bool above = false;
            Func<double, double> f = w => WAtCut(coreMass, w);
            while (lo < limit)
            {
                double hi = lo * step, fhi = f(hi);
                if (!above && fhi >= 0)
                {
                    if (branch == 0) return (true, BracketedRoot.Solve(f, lo, hi, flo, fhi, 1e-15 * hi));
                    above = true;
                }
                else if (above && fhi < 0)
                {
                    return (true, BracketedRoot.Solve(f, lo, hi, flo, fhi, 1e-15 * hi));
                }
                else if (!above && flo > fprev && flo > fhi)
                {
                    // f peaked between two scan points while still negative: the positive stretch may be narrower than
                    // one scan step (a cut close to where ξθ(ξ) peaks). Find the maximum; if it reaches 0, both roots
                    // lie on either side of it.
                    var (wm, fm) = Maximum(f, prev, hi);
                    if (fm >= 0)
                        return branch == 0
                            ? (true, BracketedRoot.Solve(f, prev, wm, fprev, fm, 1e-15 * wm))
                            : (true, BracketedRoot.Solve(f, wm, hi, fm, fhi, 1e-15 * hi));
                }
                // For n > 1 a gas whose surface already lies inside the cut (w(r_c) < 0) and that shrinks as w0 grows
                // never reaches the cut again: stop the scan there.
                if (n > 1 && fhi + wT < 0 && fhi < flo) break;
                prev = lo; fprev = flo;
                lo = hi; flo = fhi;
            }
            return (false, double.NaN);
        }

        /// <summary>Golden-section search for the maximum of f on [a, b] (f unimodal there).</summary>
        private static (double X, double F) Maximum(Func<double, double> f, double a, double b)
        {
            double ratio = 0.5 * (Math.Sqrt(5) - 1);
            double c = b - ratio * (b - a), d = a + ratio * (b - a), fc = f(c), fd = f(d);
            for (int i = 0; i < 80 && b - a > 1e-14 * b; i++)
            {
                if (fc > fd) { b = d; d = c; fd = fc; c = b - ratio * (b - a); fc = f(c); }
                else { a = c; c = d; fc = fd; d = a + ratio * (b - a); fd = f(d); }
            }
            return fc > fd ? (c, fc) : (d, fd);
        }

        /// <summary>m_gas(r_c) + m_c − M(r_c) on the given branch; false when the branch has no solution for this m_c.</summary>
        public (bool Found, double W0, double Residual) Residual(double coreMass, int branch)
        {
            var (found, w0) = CentralW(coreMass, branch);
            if (!found) return (false, double.NaN, double.NaN);
            double m = SoftenedCorePolytrope.Integrate(With(coreMass, w0), mT, dense: false).Mass;
            return (true, w0, m + coreMass - mT);
        }

        /// <summary>m_c in (0, M(r_c)) with zero residual, given the (negative) residual at m_c = 0.</summary>
        public (double CoreMass, double W0, double Mismatch)? SolveCoreMass(double residualAtZero, int branch)
        {
            double lo = 0, flo = residualAtZero, hi = mT, top = mT, fhi = double.NaN;
            // Where the branch has no solution the gas needed is too heavy: treat that as a positive residual and bisect
            // until the upper end of the bracket has a finite value.
            for (int i = 0; i < 45; i++)
            {
                var (found, _, res) = Residual(hi, branch);
                if (found && res > 0) { fhi = res; break; }
                if (found) { lo = hi; flo = res; hi = 0.5 * (hi + top); }
                else { top = hi; hi = 0.5 * (lo + hi); }
            }
            if (!(fhi > 0)) return null;
            double mc = BracketedRoot.Solve(m => Residual(m, branch).Residual is var r && double.IsNaN(r) ? mT : r, lo, hi, flo, fhi, 1e-15 * mT);
            var (ok, w0, final) = Residual(mc, branch);
            if (!ok || Math.Abs(final) > 1e-9 * mT) return null;
            return (mc, w0, Math.Abs(final) / mT);
        }
    }
}
