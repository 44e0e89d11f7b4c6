using Placement.Bodies;
using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;
using Placement.Samplers;
using Placement.Sph;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class ThermodynamicFieldsTests
{
    private static PointSet Shells(IRadialProfile body, int n, ulong seed = 5) =>
        PointSampling.Place(SamplerCatalog.CreateDefault().Create("healpix-shells"), new SamplingRequest(body, n) { Seed = seed }).Points;

    /// <summary>A deterministic, invented per-point density: the target times 1 + 0.2 sin(i), so every ratio is known.</summary>
    private static double[] Perturbed(PointSet points, IRadialProfile body)
    {
        var rho = new double[points.Count];
        for (int i = 0; i < rho.Length; i++) rho[i] = body.Density(points.Radius(i)) * (1 + 0.2 * Math.Sin(i));
        return rho;
    }

    [Fact]
    public void DensityPressure_OnAnAdiabaticPolytrope_GivesTheIdealGasEnergy_AndReportsThePressureCost()
    {
        // n = 1.5 with γ = 5/3: P = K ρ^(1+1/n) = K ρ^γ, so u = P/((γ − 1)ρ) = 1.5 K ρ^(2/3) (ideal gas, standard).
        var body = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        var points = Shells(body, 3000);
        var own = Perturbed(points, body);
        var state = ThermodynamicFields.Compute(points, body, new ThermodynamicOptions { Gamma = 5.0 / 3.0 }, own);
        Assert.Equal("P", state.PressureQuantity);
        var pressure = Assert.Single(state.Carried);
        double sumSq = 0, max = 0;
        for (int i = 0; i < points.Count; i++)
        {
            double r = points.Radius(i), rho = body.Density(r);
            Assert.Equal(1.5 * body.PolytropicConstant * Math.Pow(rho, 2.0 / 3.0), state.InternalEnergy[i], 1e-10 * state.InternalEnergy[i] + 1e-300);
            Assert.Equal(body.Pressure(r), pressure.Values[i]);
            // Implied pressure (γ − 1) ρ_pt u against P(r): exactly ρ_pt/ρ(r) − 1 = 0.2 sin(i).
            double d = 0.2 * Math.Sin(i);
            sumSq += d * d;
            max = Math.Max(max, Math.Abs(d));
        }
        Assert.Equal(Math.Sqrt(sumSq / points.Count), state.PressureDeviation.Rms, 1e-9);
        Assert.Equal(max, state.PressureDeviation.Max, 1e-9);
        Assert.Equal(state.PressureDeviation.Rms, state.DensityDeviation.Rms, 1e-9);
        Assert.True(state.EntropyDeviation.Rms > 0.05, "density+pressure must leave the adiabat off by (ρ_pt/ρ)^(1−γ)");
        Assert.Equal(0, state.UndefinedCount);
    }

    [Fact]
    public void DensityEntropy_KeepsTheProfileAdiabatAtTheSphDensity()
    {
        // K = P/ρ^γ is matched: u = K ρ_pt^(γ−1)/(γ−1) for every point, and the implied adiabat deviates by rounding only.
        var body = new Polytrope(3.0, 1.0, 1.0, UnitSystem.Solar);
        var points = Shells(body, 4000);
        var sph = SphDensity.Compute(points, SphKernel.WendlandC2, 64);
        const double gamma = 1.4;
        var state = ThermodynamicFields.Compute(points, body, new ThermodynamicOptions { Gamma = gamma, Match = ThermodynamicMatch.DensityEntropy }, sph.Density);
        for (int i = 0; i < points.Count; i += 7)
        {
            double r = points.Radius(i);
            double k = body.Pressure(r) / Math.Pow(body.Density(r), gamma);
            Assert.Equal(k * Math.Pow(sph.Density[i], gamma - 1) / (gamma - 1), state.InternalEnergy[i], 1e-9 * state.InternalEnergy[i]);
        }
        Assert.True(state.EntropyDeviation.Max < 1e-12, $"entropy deviation {state.EntropyDeviation.Max}");
        // The pressure then follows (ρ_pt/ρ)^γ; shells give SPH densities within a few per cent of the target, more at the surface.
        Assert.True(state.PressureDeviation.Rms > 1e-4 && state.PressureDeviation.Rms > state.DensityDeviation.Rms,
            $"pressure {state.PressureDeviation.Rms} density {state.DensityDeviation.Rms}");
        Assert.Equal(points.Count, state.PressureDeviation.Count);
    }

    [Fact]
    public void ProfileEnergySource_UsesTheTablesOwnColumn_AndCarriesComposition()
    {
        // An invented table made from a polytrope with u = 1.1 P/((γ−1)ρ) (a non-ideal offset) and a composition column.
        var poly = new Polytrope(1.0, 1.0, 1.0, UnitSystem.Solar);
        int rows = 400;
        var r = new double[rows];
        var rho = new double[rows];
        var e = new double[rows];
        var x = new double[rows];
        for (int i = 0; i < rows; i++)
        {
            r[i] = i / (rows - 1.0);
            rho[i] = poly.Density(r[i]);
            e[i] = rho[i] > 0 ? 1.1 * poly.Pressure(r[i]) / (rho[i] * 0.4) : 0;
            x[i] = 0.7 - 0.2 * r[i];
        }
        var table = new TabulatedProfile(r, rho, UnitSystem.Solar, quantities:
        [
            new TabulatedQuantity(new ProfileQuantity("eint", PhysicalUnit.ForSystem(UnitSystem.Solar, 2, 0, -2)), e),
            new TabulatedQuantity(new ProfileQuantity("X", PhysicalUnit.One), x),
        ]);
        Assert.Equal("eint", ThermodynamicFields.InternalEnergyQuantity(table));
        var points = Shells(table, 2000);
        var state = ThermodynamicFields.Compute(points, table, new ThermodynamicOptions { Gamma = 1.4, Source = InternalEnergySource.Profile });
        Assert.Equal("eint", state.InternalEnergyQuantity);
        Assert.Null(state.PressureQuantity);
        Assert.Equal(2, state.Carried.Count);
        for (int i = 0; i < points.Count; i += 11)
        {
            double ri = points.Radius(i);
            table.TryQuantity("eint", ri, out double expected);
            Assert.Equal(expected, state.InternalEnergy[i]);
            Assert.Equal(table.Quantity("X", ri), state.Carried[1].Values[i]);
        }
        Assert.Equal(0, state.PressureDeviation.Count); // no point density given: nothing to compare
        // U = ∫ u dm of the table equals 1.1 × the ideal-gas value of the polytrope (quadrature and table interpolation, 1e-3).
        double u = ThermalEnergy.OfProfile(table, new ThermodynamicOptions { Gamma = 1.4, Source = InternalEnergySource.Profile });
        Assert.Equal(1.1 * ThermalEnergy.OfProfile(poly, 1.4), u, 1e-3 * u);
    }

    [Fact]
    public void BadInputs_AreRefusedWithClearErrors()
    {
        var poly = new Polytrope(1.5, 1.0, 1.0, UnitSystem.Solar);
        var points = Shells(poly, 200);
        Assert.Throws<InvalidOperationException>(() => ThermodynamicFields.Compute(Shells(new UniformSphere(1, 1), 200), new UniformSphere(1, 1)));
        Assert.Throws<InvalidOperationException>(() => ThermodynamicFields.Compute(points, poly, new ThermodynamicOptions { Source = InternalEnergySource.Profile }));
        Assert.Throws<ArgumentOutOfRangeException>(() => ThermodynamicFields.Compute(points, poly, new ThermodynamicOptions { Gamma = 1.0 }));
        var entropy = new ThermodynamicOptions { Match = ThermodynamicMatch.DensityEntropy };
        Assert.Contains("density estimate", Assert.Throws<ArgumentException>(() => ThermodynamicFields.Compute(points, poly, entropy)).Message);
        var bad = Perturbed(points, poly);
        bad[17] = 0;
        Assert.Contains("Point 17", Assert.Throws<ArgumentException>(() => ThermodynamicFields.Compute(points, poly, entropy, bad)).Message);
    }

    [Fact]
    public void Result_IsIdenticalOnOneAndTwoThreads()
    {
        var body = DemoBodies.TwoZoneStar();
        var points = Shells(body, 20_000);
        var own = Perturbed(points, body);
        var options = new ThermodynamicOptions { Match = ThermodynamicMatch.DensityEntropy };
        var one = ThermodynamicFields.Compute(points, body, options, own, new ParallelSettings { MaxDegreeOfParallelism = 1, MinimumChunk = 64 });
        var two = ThermodynamicFields.Compute(points, body, options, own, new ParallelSettings { MaxDegreeOfParallelism = 2, MinimumChunk = 64 });
        Assert.Equal(one.InternalEnergy, two.InternalEnergy);
        Assert.Equal(one.PressureDeviation, two.PressureDeviation);
        Assert.Equal("X_H", one.Carried[0].Quantity.Name);
    }
}
