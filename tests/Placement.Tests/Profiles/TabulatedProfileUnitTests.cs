using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class TabulatedProfileUnitTests
{
    [Fact]
    public void SameBody_InCgsAndSolarUnits_GivesSameRelativeMassProfile()
    {
        // Units must not change accuracy: the n = 3 polytrope of 1 M_sun, 1 R_sun sampled in cgs (radii ~1e10 cm) and in
        // solar units must agree in M(r)/M to 1e-12 at equal r/R (both carry ~1e-14 quadrature error).
        var cgs = TabulatedProfile.FromProfile(new Polytrope(3, UnitSystem.SolarMassGrams, UnitSystem.SolarRadiusCm, UnitSystem.Cgs), 300);
        var sol = TabulatedProfile.FromProfile(new Polytrope(3, 1, 1, UnitSystem.Solar), 300);
        cgs.CheckValidity();
        for (double f = 1e-4; f < 1; f *= 1.4)
        {
            double a = cgs.EnclosedMass(f * cgs.OuterRadius) / cgs.TotalMass, b = sol.EnclosedMass(f * sol.OuterRadius) / sol.TotalMass;
            Assert.True(Math.Abs(a / b - 1) < 1e-12, $"at r/R = {f}: {a} vs {b}");
            Assert.True(Math.Abs(cgs.RadiusOfEnclosedMass(a * cgs.TotalMass) / (f * cgs.OuterRadius) - 1) < 1e-12);
        }
    }
}
