using Placement.Profiles;
using Placement.Random;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class TabulatedProfileTests
{
    private static double[] Geometric(double a, double b, int n)
    {
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = a * Math.Pow(b / a, (double)i / (n - 1));
        return x;
    }

    [Fact]
    public void UniformTable_EnclosedMassAndInverse_MatchClosedForm()
    {
        // ρ = const: M = 4πρr³/3 exactly (definition). The centre segment and log-log PCHIP of a constant are exact,
        // so only quadrature and root-finding error remain: 1e-13 relative.
        double[] r = [0, 0.1, 0.3, 0.7, 1.0];
        double[] rho = [2, 2, 2, 2, 2];
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        p.CheckValidity();
        for (double x = 1e-6; x <= 1; x *= 1.3)
        {
            double exact = 4 * Math.PI * 2 * x * x * x / 3;
            Assert.True(Math.Abs(p.EnclosedMass(x) / exact - 1) < 1e-13, $"M at {x}");
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(exact) / x - 1) < 1e-13, $"r(M) at {x}");
        }
    }

    [Fact]
    public void PowerLawCusp_IsReproducedExactly_IncludingCoreExtrapolation()
    {
        // ρ = r^−2 (an isothermal cusp): PCHIP in ln ρ–ln r is exact for a power law and the core continues the slope,
        // so M = 4πr holds to quadrature accuracy (closed form of ∫4πs²s⁻²ds).
        double[] r = Geometric(1e-3, 1, 40);
        var rho = r.Select(x => 1 / (x * x)).ToArray();
        var p = new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
        p.CheckValidity();
        for (double x = 1e-6; x <= 1; x *= 1.7)
        {
            Assert.True(Math.Abs(p.EnclosedMass(x) / (4 * Math.PI * x) - 1) < 1e-12, $"M at {x}: {p.EnclosedMass(x)}");
            Assert.True(Math.Abs(p.Density(x) * x * x - 1) < 1e-12, $"ρ at {x}");
        }
    }

    [Theory]
    [InlineData(0.2, true)]
    [InlineData(0.05, false)]
    public void TableStartingOffCentre_ReportsTheMassItsCoreExtrapolationAdds(double r0, bool noted)
    {
        // ρ = 1/r tabulated from r0 to 1 (a cusp, slope −1, continued inward as the same power law): the mass inside r0 is
        // ∫0^r0 4πs² s⁻¹ ds = 2π r0² of a total 2π, so the share is r0² (closed form of the integral): 4 % (noted, above
        // the 1 % threshold) or 0.25 % (not).
        double[] r = Geometric(r0, 1, 60);
        var p = new TabulatedProfile(r, r.Select(x => 1 / x).ToArray(), UnitSystem.Dimensionless);
        Assert.Equal(2 * Math.PI * r0 * r0, p.ExtrapolatedCoreMass, 1e-12 * 2 * Math.PI);
        var summary = ProfileSummary.Of(p);
        Assert.Equal(r0, summary.FirstRowRadius);
        Assert.Equal(r0 * r0, summary.ExtrapolatedCoreFraction, 1e-12);
        Assert.Contains("below first row", summary.ToString());
        var notes = summary.Notes();
        Assert.Equal(noted, notes.Count == 1);
        if (noted) Assert.Contains("4.0 % of the mass lies inside the table's first row", notes[0]);
    }

    [Fact]
    public void TableStartingAtTheCentre_HasNoExtrapolatedCore()
    {
        double[] r = [0, 0.5, 1];
        var p = new TabulatedProfile(r, [2.0, 1.5, 1.0], UnitSystem.Dimensionless);
        Assert.Equal(0, p.ExtrapolatedCoreMass);
        var summary = ProfileSummary.Of(p);
        Assert.Equal(0, summary.ExtrapolatedCoreFraction);
        Assert.Empty(summary.Notes());
        Assert.DoesNotContain("below first row", summary.ToString());
    }

    [Fact]
    public void FlatCoreSampledOffCentre_KeepsAFiniteCentralDensity()
    {
        // Plummer sphere (Plummer 1911, MNRAS 71, 460): ρ = ρ_c (1 + r²/a²)^(−5/2), M(<r) = M r³/(r² + a²)^(3/2), with
        // ρ_c = 3M/(4πa³); M = a = 1. Rows start off centre at r0 = 0.01, as a stellar model's first zone does. Its log
        // slope there (−5e-4) marks a core: ρ(0) must be finite and near ρ_c (it was +∞ while every first slope
        // continued as a power law), and the mass inside r0 still follows the analytic M(r).
        double[] r = Geometric(0.01, 10, 200);
        double rhoC = 3 / (4 * Math.PI);
        var rho = r.Select(x => rhoC * Math.Pow(1 + x * x, -2.5)).ToArray();
        var p = new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
        p.CheckValidity();
        Assert.True(Math.Abs(p.Density(0) / rhoC - 1) < 1e-4, $"ρ(0) = {p.Density(0)} against ρ_c = {rhoC}");
        foreach (double x in new[] { 0.002, 0.005, 0.01, 0.05 })
        {
            double exact = x * x * x / Math.Pow(x * x + 1, 1.5);
            Assert.True(Math.Abs(p.EnclosedMass(x) / exact - 1) < 1e-4, $"M at {x}: {p.EnclosedMass(x)} against {exact}");
        }
    }

    [Fact]
    public void SteepEnvelope_OverTwelveDecades_MassAccurate_InverseRoundTripsTo1e13()
    {
        // Gaussian ρ = 100 exp(−r²/(2σ²)), σ = 0.14: density falls from 1e2 to 8e-10 at r = 1 (11 decades), with a
        // regular (even) centre. Closed form M = 4π·100·σ³[√(π/2) erf(r/(√2σ)) − (r/σ) exp(−r²/(2σ²))] (elementary
        // integral; erf from MathNet.Numerics 5.0). 400 equally spaced rows: worst relative M error measured 3.3e-5, in
        // the second interval (r ≈ 0.004) where equal steps in r are coarse in ln r; we require 1e-4. r(M(r)) = r is a property of our own inverse: 1e-13 plus conditioning.
        const double sg = 0.14;
        var r = Enumerable.Range(0, 400).Select(i => i / 399.0).ToArray();
        var rho = r.Select(x => 100 * Math.Exp(-x * x / (2 * sg * sg))).ToArray();
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        p.CheckValidity();
        double Exact(double x) => 4 * Math.PI * 100 * sg * sg * sg *
            (Math.Sqrt(Math.PI / 2) * MathNet.Numerics.SpecialFunctions.Erf(x / (Math.Sqrt(2) * sg)) - x / sg * Math.Exp(-x * x / (2 * sg * sg)));
        var rng = new KeyedRandom(7, 1);
        double worst = 0, worstX = 0;
        for (int i = 0; i < 20000; i++)
        {
            double x = rng.NextDouble();
            double m = p.EnclosedMass(x);
            if (Math.Abs(m / Exact(x) - 1) > worst) { worst = Math.Abs(m / Exact(x) - 1); worstX = x; }
            // Conditioning: a mass rounding error of ~1e-15 M_tot moves r by 1e-15 M_tot/(4πr³ρ) relative; far out in
            // the envelope that exceeds 1e-13, so the bound adds it.
            double cond = 1e-15 * p.TotalMass / (4 * Math.PI * x * x * x * p.Density(x));
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(m) / x - 1) < 1e-13 + cond, $"r(M(r)) at {x}");
        }
        Assert.True(worst < 1e-4, $"worst relative M error {worst} at r = {worstX}");
    }

    [Theory]
    [InlineData(100.0)]
    [InlineData(300.0)]
    [InlineData(700.0)]
    public void ExponentialAtmosphere_OverHundredsOfDecades_BuildsAndIntegratesExactly(double a)
    {
        // Invented: ρ = e^(−a r) on 2000 equal rows of [0, 1]; a = 700 spans 304 decades. Far out ln ρ is −700, and
        // e^(ln ρ) there carries a rounding of ~1e-14 relative, which once made every mass panel fail its 1e-14 check and
        // bisect without end (a = 140 already hung). M(r) must equal the integral of the interpolated density, here by an
        // independent adaptive Gauss–Legendre quadrature of 4πr²ρ(r) row interval by row interval (1e-13 relative), and
        // r(M) must invert it.
        var r = Enumerable.Range(0, 2000).Select(i => i / 1999.0).ToArray();
        var rho = r.Select(x => Math.Exp(-a * x)).ToArray();
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        p.CheckValidity();
        double sum = 0, worst = 0;
        for (int i = 0; i + 1 < r.Length; i++)
        {
            sum += Placement.Numerics.AdaptiveQuadrature.Integrate(x => 4 * Math.PI * x * x * p.Density(x), r[i], r[i + 1], 1e-14).Value;
            if (sum <= 0) continue;
            worst = Math.Max(worst, Math.Abs(p.EnclosedMass(r[i + 1]) / sum - 1));
            if (i % 50 == 49 && p.EnclosedMass(r[i + 1]) < p.TotalMass * (1 - 1e-9))
                Assert.True(Math.Abs(p.RadiusOfEnclosedMass(p.EnclosedMass(r[i + 1])) / r[i + 1] - 1) < 1e-10, $"r(M(r)) at {r[i + 1]}");
        }
        Assert.True(worst < 1e-12, $"a = {a}: worst relative M error {worst}");
    }

    [Theory]
    [InlineData(1e-20)]
    [InlineData(1e-60)]
    [InlineData(1e-200)]
    public void LastRowFallingByTensOfDecades_BuildsAndIntegratesExactly(double last)
    {
        // Invented: a thin envelope 0.02 (1 − (r − 6)/0.6)² + 1e-3 on 31 rows of [6, 6.6] over a centre row, with a tiny but
        // positive density on the last row (as a model's surface zone may carry). ln ρ falls by 40 to 455 within that one
        // row; the rounding of so steep a cubic once made every mass panel there fail its 1e-14 check, and the constructor
        // split panels to depth 30 without returning. M(r) must equal an independent adaptive Gauss–Legendre quadrature of
        // 4πr²ρ(r), row interval by row interval (1e-14 relative per interval).
        var r = new List<double> { 0 };
        var rho = new List<double> { 1.0 };
        for (int i = 0; i <= 30; i++)
        {
            double x = 6 + 0.6 * i / 30, u = 1 - (x - 6) / 0.6;
            r.Add(x);
            rho.Add(i == 30 ? last : 0.02 * u * u + 1e-3);
        }
        var p = new TabulatedProfile(r, rho, UnitSystem.Dimensionless);
        p.CheckValidity();
        double sum = 0, worst = 0;
        for (int i = 0; i + 1 < r.Count; i++)
        {
            sum += Placement.Numerics.AdaptiveQuadrature.Integrate(x => 4 * Math.PI * x * x * p.Density(x), r[i], r[i + 1], 1e-14).Value;
            worst = Math.Max(worst, Math.Abs(p.EnclosedMass(r[i + 1]) / sum - 1));
        }
        Assert.True(worst < 1e-12, $"last row {last}: worst relative M error {worst}");
        Assert.Equal(last, p.Density(6.6), last * 1e-9);
    }

    [Fact]
    public void DensityStep_RepeatedRadius_IsRightContinuousAndMassExact()
    {
        // Two uniform layers, ρ = 8 inside 0.5 and 1 outside: M = 4π[8r³/3] or 4π[8·0.5³/3 + (r³ − 0.5³)/3] (exact).
        double[] r = [0, 0.25, 0.5, 0.5, 0.75, 1];
        double[] rho = [8, 8, 8, 1, 1, 1];
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        p.CheckValidity();
        Assert.Equal(8, p.Density(0.4999999), 12);
        Assert.Equal(1, p.Density(0.5), 12);
        foreach (double x in new[] { 0.1, 0.3, 0.5, 0.6, 0.9, 1.0 })
        {
            double exact = x <= 0.5 ? 4 * Math.PI * 8 * x * x * x / 3 : 4 * Math.PI * (8 * 0.125 + x * x * x - 0.125) / 3;
            Assert.True(Math.Abs(p.EnclosedMass(x) / exact - 1) < 1e-13, $"M at {x}");
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(exact) / x - 1) < 1e-13, $"r at {x}");
        }
    }

    [Fact]
    public void Interpolant_NeverOvershootsNeighbouringRows()
    {
        // Shape preservation (Fritsch & Carlson 1980): between two rows ρ stays within their values, even for wild data.
        var rng = new KeyedRandom(3, 0);
        int n = 60;
        var r = new double[n];
        var rho = new double[n];
        double x = 0.01, lr = 5;
        for (int i = 0; i < n; i++)
        {
            r[i] = x;
            rho[i] = Math.Exp(lr);
            x *= 1 + 2 * rng.NextDouble();
            lr -= 4 * rng.NextDouble() * rng.NextDouble() * (rng.NextDouble() < 0.2 ? 5 : 1);
        }
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        for (int i = 0; i + 1 < n; i++)
        {
            for (int j = 1; j < 20; j++)
            {
                double s = r[i] + (r[i + 1] - r[i]) * j / 20.0;
                double v = p.Density(s);
                Assert.InRange(v, rho[i + 1] * (1 - 1e-12), rho[i] * (1 + 1e-12));
            }
        }
    }

    [Fact]
    public void TwelveDecadeDropInOneInterval_AndDensityInversion_StayMonotoneAndInvertible()
    {
        // Rows with a 1e12 fall between two neighbouring rows and a density inversion (ρ rising outward once): the
        // interpolant stays within each interval's end values (shape preservation), M increases, and r(M(r)) = r
        // (1e-13 plus the conditioning 1e-15 M/(4πr³ρ)) on a fine grid. Properties of our own construction.
        double[] r = [0, 0.1, 0.2, 0.3, 0.35, 0.5, 0.7, 1.0];
        double[] rho = [50, 40, 30, 3e-11, 2e-11, 5e-11, 1e-11, 1e-12];
        var p = new TabulatedProfile(r, rho, UnitSystem.Cgs);
        p.CheckValidity();
        Assert.True(p.PanelCount > r.Length, "the steep interval must be split into several panels");
        double previous = 0;
        for (int i = 1; i <= 2000; i++)
        {
            double x = i / 2000.0;
            int k = Array.FindLastIndex(r, v => v <= x);
            if (k < r.Length - 1)
            {
                double a = Math.Min(rho[k], rho[k + 1]), b = Math.Max(rho[k], rho[k + 1]);
                Assert.InRange(p.Density(x), a * (1 - 1e-12), b * (1 + 1e-12));
            }
            double m = p.EnclosedMass(x);
            Assert.True(m >= previous, $"M decreases at {x}");
            previous = m;
            double cond = 1e-15 * p.TotalMass / (4 * Math.PI * x * x * x * p.Density(x));
            Assert.True(Math.Abs(p.RadiusOfEnclosedMass(m) / x - 1) < 1e-13 + cond, $"r(M(r)) at {x}");
        }
    }

    [Fact]
    public void TabulatedMasses_ConsistencyIsReported_AndTabulatedSourceReproducesThem()
    {
        // Rows from ρ = 1 (exact M = 4πr³/3) with one mass perturbed by +1 %: the report must find 1 % at that row.
        double[] r = [0, 0.2, 0.4, 0.6, 0.8, 1.0];
        var rho = r.Select(_ => 1.0).ToArray();
        var m = r.Select(x => 4 * Math.PI * x * x * x / 3).ToArray();
        m[3] *= 1.01;
        var trustDensity = new TabulatedProfile(r, rho, UnitSystem.Cgs, enclosedMass: m);
        Assert.NotNull(trustDensity.Consistency);
        Assert.Equal(3, trustDensity.Consistency!.RowOfMaxRelativeDifference);
        Assert.Equal(0.01 / 1.01, trustDensity.Consistency.MaxRelativeDifference, 1e-12);
        Assert.Equal(MassSource.IntegratedDensity, trustDensity.Consistency.Source);
        Assert.Equal(m[3] / 1.01, trustDensity.EnclosedMass(0.6), 1e-13);

        var trustMass = new TabulatedProfile(r, rho, UnitSystem.Cgs, new TabulatedProfileOptions { MassSource = MassSource.Tabulated }, m);
        trustMass.CheckValidity();
        for (int i = 0; i < r.Length; i++) Assert.Equal(m[i], trustMass.EnclosedMass(r[i]), 1e-13 * m[^1]);
    }

    [Fact]
    public void MassCoordinateTable_ConvertsToRadius()
    {
        // Uniform density in mass coordinate: r = (3m/(4πρ))^(1/3) exactly (definition of M(r)).
        double[] m = [0, 0.5, 1, 2, 4];
        double[] rho = [3, 3, 3, 3, 3];
        var p = TabulatedProfile.FromMassCoordinate(m, rho, UnitSystem.Cgs);
        p.CheckValidity();
        for (int i = 0; i < m.Length; i++)
            Assert.Equal(Math.Cbrt(3 * m[i] / (4 * Math.PI * 3)), p.RowRadii[i], 1e-13);
        Assert.Equal(4, p.TotalMass, 1e-13);
    }

    [Fact]
    public void MassCoordinateTable_WithDensityStep_ConvertsEachLayer()
    {
        // Two uniform layers in mass coordinate: r³ = 3m/(4π·8) inside m = 1, then r³ = r1³ + 3(m − 1)/(4π·1) (exact).
        double[] m = [0, 0.5, 1, 1, 2, 3];
        double[] rho = [8, 8, 8, 1, 1, 1];
        var p = TabulatedProfile.FromMassCoordinate(m, rho, UnitSystem.Cgs);
        p.CheckValidity();
        double r1 = Math.Cbrt(3 / (4 * Math.PI * 8));
        Assert.Equal(r1, p.RowRadii[2], 1e-14);
        Assert.Equal(r1, p.RowRadii[3], 1e-14);
        Assert.Equal(Math.Cbrt(r1 * r1 * r1 + 3 * 2 / (4 * Math.PI)), p.OuterRadius, 1e-14);
        Assert.Equal(8, p.Density(0.99 * r1), 12);
        Assert.Equal(1, p.Density(1.01 * r1), 12);
    }

    [Fact]
    public void MassCoordinateTable_OfPolytrope_RecoversRadii()
    {
        // n = 1.5 polytrope written in mass coordinate (rows at equal mass steps, zero density at the surface) and
        // converted back: radii must match the polytrope's r(M). 200 rows: measured agreement better than 1e-4
        // relative inside and 3e-3 for the surface row (the linear-in-r surface shell is an approximation); tolerances 3x.
        var poly = new Polytrope(1.5, 1, 1);
        int n = 200;
        var m = new double[n];
        var rho = new double[n];
        for (int i = 0; i < n; i++)
        {
            m[i] = poly.TotalMass * i / (n - 1.0);
            rho[i] = i == n - 1 ? 0 : poly.Density(poly.RadiusOfEnclosedMass(m[i]));
        }
        var p = TabulatedProfile.FromMassCoordinate(m, rho, UnitSystem.Dimensionless);
        p.CheckValidity();
        for (int i = 1; i < n - 1; i++)
            Assert.True(Math.Abs(p.RowRadii[i] / poly.RadiusOfEnclosedMass(m[i]) - 1) < 3e-4, $"row {i}: {p.RowRadii[i]} vs {poly.RadiusOfEnclosedMass(m[i])}");
        Assert.True(Math.Abs(p.OuterRadius - 1) < 1e-2, $"R = {p.OuterRadius}");
    }

    [Theory]
    [InlineData(new[] { 0.0 }, new[] { 1.0 })]
    [InlineData(new[] { 0.0, 1.0, 0.5 }, new[] { 1.0, 1.0, 1.0 })]
    [InlineData(new[] { 0.0, 1.0, 2.0 }, new[] { 1.0, -1.0, 1.0 })]
    [InlineData(new[] { 0.0, 1.0, 2.0 }, new[] { 1.0, 0.0, 1.0 })]
    [InlineData(new[] { 0.0, 1.0, 1.0, 2.0 }, new[] { 1.0, 0.5, 0.5, 0.1 })]
    [InlineData(new[] { 0.0, 1.0, double.NaN }, new[] { 1.0, 1.0, 1.0 })]
    public void Constructor_RejectsInvalidRows(double[] r, double[] rho)
    {
        Assert.Throws<ArgumentException>(() => new TabulatedProfile(r, rho, UnitSystem.Cgs));
    }

    [Fact]
    public void Constructor_RejectsZeroSurface_WhenDisallowed_AndStep_WhenDisabled()
    {
        Assert.Throws<ArgumentException>(() => new TabulatedProfile([0, 1, 2], [1, 1, 0], UnitSystem.Cgs, new TabulatedProfileOptions { AllowZeroOuterDensity = false }));
        Assert.Throws<ArgumentException>(() => new TabulatedProfile([0, 1, 1, 2], [2, 2, 1, 1], UnitSystem.Cgs, new TabulatedProfileOptions { AllowDensitySteps = false }));
    }
}
