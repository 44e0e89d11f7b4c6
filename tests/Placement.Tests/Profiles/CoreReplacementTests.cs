using Placement.Numerics;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class CoreReplacementTests
{
    /// <summary>
    /// An INVENTED giant-like body (not a real star model): a dense core of scale 0.01 R holding ~63 % of the mass inside a
    /// steep envelope falling over ~11 decades of density, with a composition-like density step (factor 3) at 0.5 R and a
    /// zero-density surface; pressure from hydrostatic equilibrium of the table itself.
    /// </summary>
    internal static TabulatedProfile InventedGiant(UnitSystem units, double lengthScale = 1, double densityScale = 1)
    {
        var r = new List<double>();
        var rho = new List<double>();
        double Rho(double x) => 2e4 * Math.Exp(-(x / 0.01) * (x / 0.01)) + 40 / (1 + (x / 0.02) * (x / 0.02)) * Math.Pow(1 - x, 1.5) / (x < 0.5 ? 1 : 3);
        r.Add(0); rho.Add(Rho(0));
        for (int i = 0; i <= 600; i++)
        {
            double x = 1e-4 * Math.Pow(0.5 / 1e-4, i / 600.0);
            r.Add(x); rho.Add(Rho(x - 1e-15));
        }
        for (int i = 0; i <= 400; i++)
        {
            double x = 0.5 + 0.5 * i / 400.0;
            r.Add(x); rho.Add(i == 400 ? 0 : Rho(x));
        }
        for (int i = 0; i < r.Count; i++) { r[i] *= lengthScale; rho[i] *= densityScale; }
        return new TabulatedProfile(r, rho, units).WithHydrostaticPressure();
    }

    [Theory]
    [InlineData(0.1, 1.5)]
    [InlineData(0.2, 1.5)]
    [InlineData(0.2, 2.0)]
    public void PolytropeThree_StifferReplacement_MatchesAtTheCut_IsInEquilibrium_AndConservesMass(double cut, double index)
    {
        var star = new Polytrope(3, 1, 1, UnitSystem.Solar);
        var gas = CoreReplacement.Apply(star, new CoreReplacementOptions(cut) { Index = index });
        var rep = gas.Report;
        gas.CheckValidity();
        // Shooting tolerances are 1e-15 relative on the unknowns and the integrator runs at 1e-12: the match at the cut is
        // measured at ≤ 3e-15; 1e-10 leaves room for other machines.
        Assert.True(rep.DensityMismatch < 1e-10 && rep.PressureMismatch < 1e-10 && rep.MassMismatch < 1e-10, rep.ToString());
        // A stiffer gas holds less mass inside the cut: a core is needed and the centre gets less dense.
        Assert.True(rep.CoreMass > 1e-4 && rep.CentralDensity < star.CentralDensity, rep.ToString());
        Assert.NotNull(gas.Core);
        Assert.Equal(rep.CoreMass, gas.Core!.Mass);
        Assert.Equal(cut, gas.Core.SofteningLength); // default h = r_c
        // Hydrostatic residual from 5-point differences of the dense output: measured ≤ 4e-8 (the innermost samples,
        // where dP/dr → 0 and rounding over the stencil dominates) and rms ≤ 3e-9; bounds 1e-6 / 1e-7.
        Assert.True(rep.HydrostaticInside.Max < 1e-6 && rep.HydrostaticInside.Rms < 1e-7, rep.HydrostaticInside.ToString());
        Assert.True(rep.HydrostaticOutside.Max < 1e-8, rep.HydrostaticOutside.ToString());
        Assert.Equal(200, rep.HydrostaticInside.Samples);
        // Mass: gas + core is the original mass, and the gas mass inside the cut is the integral of the new density
        // (adaptive Gauss–Legendre over the profile's own ρ, independent of the integrated mass it stores).
        Assert.Equal(star.TotalMass, gas.TotalMass + rep.CoreMass, 1e-12);
        double gasInside = AdaptiveQuadrature.Integrate(r => 4 * Math.PI * r * r * gas.Density(r), 0, cut, 1e-13).Value;
        Assert.True(Math.Abs(gasInside + rep.CoreMass - star.EnclosedMass(cut)) < 1e-9 * star.EnclosedMass(cut));
        for (double r = 0.01 * cut; r < 1; r *= 1.7)
        {
            Assert.True(Math.Abs(gas.EnclosedMass(r) + (r >= cut ? rep.CoreMass : 0) - (r >= cut ? star.EnclosedMass(r) : gas.EnclosedMass(r))) < 1e-14);
            Assert.True(Math.Abs(gas.RadiusOfEnclosedMass(gas.EnclosedMass(r)) / r - 1) < 1e-10, $"r(M(r)) at {r}");
        }
        // P = Kρ^(1+1/n) inside, the original outside.
        Assert.True(gas.TryQuantity("P", 0.5 * cut, out double p));
        Assert.Equal(rep.PolytropicConstant * Math.Pow(gas.Density(0.5 * cut), 1 + 1 / index), p, 1e-12 * p);
        Assert.Equal(star.Pressure(0.7), gas.TryQuantity("P", 0.7, out double po) ? po : double.NaN);
    }

    [Theory]
    [InlineData(0.1)]
    [InlineData(0.2)]
    [InlineData(0.3)] // just inside the peak of ξθ(ξ) at 0.313 R: both branches lie within one scan step
    [InlineData(0.4)] // beyond the peak of ξθ(ξ): found on the second branch
    public void PolytropeThree_SameIndex_ReproducesTheOriginalWithoutCore(double cut)
    {
        var star = new Polytrope(3, 1, 1, UnitSystem.Solar);
        var gas = CoreReplacement.Apply(star, new CoreReplacementOptions(cut) { Index = 3 });
        Assert.Equal(0.0, gas.CoreMass);
        Assert.Null(gas.Core);
        // ρ_c/ρ̄ = 54.18248 for n = 3 (Lane–Emden reference values, methods notes §8, computed from ξ1 and μ1 of
        // Poisson & Will 2014, Table 2.1; 7 digits, hence 1e-6).
        double mean = 3 / (4 * Math.PI);
        Assert.True(Math.Abs(gas.Report.CentralDensity / (54.18248 * mean) - 1) < 1e-6, $"{gas.Report.CentralDensity}");
        Assert.True(Math.Abs(gas.Report.CentralDensity / star.CentralDensity - 1) < 1e-9);
        for (double r = 0.02 * cut; r < cut; r += 0.07 * cut)
        {
            Assert.True(Math.Abs(gas.Density(r) / star.Density(r) - 1) < 1e-9, $"ρ at {r}");
            Assert.True(Math.Abs(gas.EnclosedMass(r) / star.EnclosedMass(r) - 1) < 1e-9, $"M at {r}");
        }
    }

    [Fact]
    public void LocalIndex_OfAPolytrope_IsItsIndex_AndReplacingWithItNeedsNoCore()
    {
        var star = new Polytrope(1.5, 2, 3, UnitSystem.Solar);
        double n = CoreReplacement.LocalIndex(star, 0.6);
        // Central differences over ±1e-3 r: error ~1e-7 relative.
        Assert.Equal(1.5, n, 1e-6);
        var gas = CoreReplacement.Apply(star, new CoreReplacementOptions(0.6) { Index = 1.5 });
        Assert.Equal(0.0, gas.CoreMass);
    }

    [Fact]
    public void LocalIndex_WhereTheStructureGivesNoIndex_IsRejectedNamingTheExponent()
    {
        // Outside the body ρ = P = 0: the exponent is undefined and the message says so instead of returning NaN.
        var ex = Assert.Throws<ArgumentException>(() => CoreReplacement.LocalIndex(new Polytrope(3, 1, 1, UnitSystem.Solar), 1.5));
        Assert.Contains("d ln P/d ln ρ", ex.Message);
    }

    [Theory]
    [InlineData(3.0)]
    [InlineData(1.5)]
    public void InventedGiant_CoreIsReplaced_OuterTableAndItsDensityStepUntouched(double index)
    {
        var giant = InventedGiant(UnitSystem.Solar);
        var gas = CoreReplacement.Apply(giant, new CoreReplacementOptions(0.1) { Index = index });
        var rep = gas.Report;
        gas.CheckValidity();
        Assert.True(rep.DensityMismatch < 1e-10 && rep.PressureMismatch < 1e-10 && rep.MassMismatch < 1e-10, rep.ToString());
        // The dense core (0.113 of the 0.125 inside the cut, measured) goes into the point mass; the gas centre is far less dense.
        Assert.True(rep.CoreMass > 0.5 * giant.EnclosedMass(0.1), rep.ToString());
        Assert.True(rep.CentralDensity < 1e-2 * rep.OriginalCentralDensity, rep.ToString());
        Assert.True(rep.HydrostaticInside.Max < 1e-6, rep.HydrostaticInside.ToString());
        // Outside: the table's own equilibrium (its pressure is integrated from its M(r), then PCHIP-interpolated between
        // rows ~1.4 % apart): measured max 6.7e-3 just inside the density step, rms 5.7e-4.
        Assert.True(rep.HydrostaticOutside.Max < 2e-2, rep.HydrostaticOutside.ToString());
        Assert.Equal(giant.Density(0.5 - 1e-9), gas.Density(0.5 - 1e-9));
        Assert.Equal(giant.Density(0.5), gas.Density(0.5));
        Assert.True(gas.Density(0.5 - 1e-9) > 2.9 * gas.Density(0.5));
        Assert.Equal(giant.TotalMass - rep.CoreMass, gas.TotalMass, 1e-14);
    }

    [Fact]
    public void CentralCusp_IsReplacedByAFiniteCentre()
    {
        // Hernquist sphere (ρ ∝ 1/r at the centre) tabulated, with the table's own hydrostatic pressure.
        var cusp = TabulatedProfile.FromProfile(new HernquistSphere(1, 0.1, 5, UnitSystem.Solar), 1500).WithHydrostaticPressure();
        var gas = CoreReplacement.Apply(cusp, new CoreReplacementOptions(0.05) { Index = 3 });
        var rep = gas.Report;
        gas.CheckValidity();
        Assert.True(double.IsPositiveInfinity(rep.OriginalCentralDensity) || rep.OriginalCentralDensity > 1e3 * rep.CentralDensity);
        Assert.True(double.IsFinite(rep.CentralDensity) && rep.CentralDensity > rep.DensityAtCut);
        // Measured: m_c = 0.29 M(r_c), residuals ≤ 1e-15 at the cut, hydrostatic inside 2e-9.
        Assert.InRange(rep.CoreMass / rep.OriginalMassInsideCut, 0.05, 0.95);
        Assert.True(rep.DensityMismatch < 1e-10 && rep.MassMismatch < 1e-10 && rep.HydrostaticInside.Max < 1e-6, rep.ToString());
    }

    [Fact]
    public void InventedGiant_SameBodyInCgs_GivesTheSameCoreFraction()
    {
        // The solver must not depend on the size of the numbers: the same invented body in cm and g/cm^3.
        var solar = InventedGiant(UnitSystem.Solar);
        var cgs = InventedGiant(UnitSystem.Cgs, UnitSystem.SolarRadiusCm, UnitSystem.Solar.DensityInGramsPerCm3);
        var a = CoreReplacement.Apply(solar, new CoreReplacementOptions(0.1)).Report;
        var b = CoreReplacement.Apply(cgs, new CoreReplacementOptions(0.1 * UnitSystem.SolarRadiusCm)).Report;
        // Same body up to the rounding of the scaled rows (~1e-15) and the solver tolerance: 1e-8.
        Assert.Equal(a.CoreMass / solar.TotalMass, b.CoreMass / cgs.TotalMass, 1e-8);
        Assert.Equal(a.CentralDensity, b.CentralDensity / UnitSystem.Solar.DensityInGramsPerCm3, 1e-8 * a.CentralDensity);
    }

    [Fact]
    public void SofteningRatio_SetsTheCoreSoftening()
    {
        var star = new Polytrope(3, 1, 1, UnitSystem.Solar);
        var gas = CoreReplacement.Apply(star, new CoreReplacementOptions(0.2) { Index = 1.5, SofteningRatio = 0.5 });
        Assert.Equal(0.1, gas.SofteningLength, 1e-15);
        Assert.Equal(0.1, gas.Core!.SofteningLength, 1e-15);
        Assert.True(gas.Report.HydrostaticInside.Max < 1e-6, gas.Report.HydrostaticInside.ToString());
    }

    [Theory]
    [InlineData(1.0, "outside the body")]
    [InlineData(0.0, "outside the body")]
    [InlineData(-0.1, "outside the body")]
    [InlineData(double.NaN, "outside the body")]
    public void CutOutsideTheBody_IsRejectedNamingTheValue(double cut, string phrase)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => CoreReplacement.Apply(new Polytrope(3, 1, 1), new CoreReplacementOptions(cut)));
        Assert.Contains(phrase, ex.Message);
    }

    [Fact]
    public void CutInsideTheInnermostRow_IsRejectedNamingBothRadii()
    {
        // Invented table starting at r = 0.05 (below it the profile is extrapolated).
        var table = new TabulatedProfile([0.05, 0.2, 0.6, 1.0], [10.0, 3.0, 0.5, 0.0], UnitSystem.Solar).WithHydrostaticPressure();
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => CoreReplacement.Apply(table, new CoreReplacementOptions(0.03)));
        Assert.Contains("0.03", ex.Message);
        Assert.Contains("0.05", ex.Message);
        Assert.Contains("innermost", ex.Message);
    }

    [Fact]
    public void ProfileWithoutPressure_IsRejected()
    {
        var ex = Assert.Throws<ArgumentException>(() => CoreReplacement.Apply(new PlummerSphere(1, 0.2, 2, UnitSystem.Solar), new CoreReplacementOptions(0.2)));
        Assert.Contains("no pressure", ex.Message);
    }

    [Fact]
    public void SofterIndexThanTheBody_HasNoSolution_AndSaysWhy()
    {
        // An n = 4 gas through ρ and P at 0.2 R of an n = 3 polytrope holds more than M(0.2 R) without any core.
        var ex = Assert.Throws<ArgumentException>(() => CoreReplacement.Apply(new Polytrope(3, 1, 1), new CoreReplacementOptions(0.2) { Index = 4 }));
        Assert.Contains("n = 4", ex.Message);
        Assert.Contains("smaller (stiffer) index", ex.Message);
    }

    [Theory]
    [InlineData(0.0, 1.0)]
    [InlineData(11.0, 1.0)]
    [InlineData(3.0, 1.5)]
    [InlineData(3.0, 0.0)]
    public void IndexOrSofteningOutOfRange_IsRejectedNamingTheValue(double index, double ratio)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() =>
            CoreReplacement.Apply(new Polytrope(3, 1, 1), new CoreReplacementOptions(0.2) { Index = index, SofteningRatio = ratio }));
        Assert.Contains(ratio is > 1 or <= 0 ? (ratio * 0.2).ToString(System.Globalization.CultureInfo.InvariantCulture) : index.ToString(System.Globalization.CultureInfo.InvariantCulture), ex.Message);
    }
}
