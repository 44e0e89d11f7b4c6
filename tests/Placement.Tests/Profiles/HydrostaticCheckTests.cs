using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class HydrostaticCheckTests
{
    private static double[] Radii(double from, double to, int count)
    {
        var r = new double[count];
        for (int i = 0; i < count; i++) r[i] = from + (to - from) * (i + 0.5) / count;
        return r;
    }

    [Fact]
    public void Polytrope_IsInEquilibrium_AndAScaledPressureIsCaughtByItsFactor()
    {
        // A polytrope is hydrostatic by construction (Chandrasekhar 1939, ch. IV); five-point differences of its dense
        // output read below 1e-8. Its pressure scaled by 1.1 has dP/dr 10 % too steep: the residual must read 0.1.
        var star = new Polytrope(1.5, 1, 1, UnitSystem.Solar);
        var good = HydrostaticCheck.Evaluate(star, Radii(0.05, 0.9, 50));
        Assert.Equal(50, good.Samples);
        Assert.True(good.Max < 1e-8, good.ToString());

        var table = TabulatedProfile.FromProfile(star, 2000);
        var p = new double[table.RowCount];
        for (int i = 0; i < p.Length; i++) p[i] = 1.1 * star.Pressure(table.RowRadii[i]);
        var scaled = new TabulatedProfile(table.RowRadii.ToArray(), table.RowDensities.ToArray(), UnitSystem.Solar, null, null,
            [new TabulatedQuantity(new ProfileQuantity("P", PhysicalUnit.ForSystem(UnitSystem.Solar, -1, 1, -2)), p)]);
        var bad = HydrostaticCheck.Evaluate(scaled, Radii(0.05, 0.9, 50));
        // PCHIP of 2000 rows reproduces dP/dr to ~1e-6 here: 0.1 within 1e-4.
        Assert.Equal(0.1, bad.Max, 1e-4);
        Assert.Equal(0.1, bad.Rms, 1e-4);
    }

    [Fact]
    public void ReplacedGas_IsInEquilibriumOnlyWithTheCoresGravity()
    {
        var gas = CoreReplacement.Apply(new Polytrope(3, 1, 1, UnitSystem.Solar), new CoreReplacementOptions(0.2) { Index = 1.5 });
        var radii = Radii(0.01, 0.19, 40);
        Assert.True(HydrostaticCheck.Evaluate(gas, radii, gas.CoreMass, gas.SofteningLength).Max < 1e-7);
        // Leaving the core's gravity out must show: the core is ~8 % of M(r_c), far more than any numerical residual.
        Assert.True(HydrostaticCheck.Evaluate(gas, radii).Max > 1e-2);
    }

    [Fact]
    public void ProfileWithoutPressure_IsRejected()
    {
        Assert.Throws<ArgumentException>(() => HydrostaticCheck.Evaluate(new UniformSphere(1, 1, UnitSystem.Solar), [0.5]));
    }
}
