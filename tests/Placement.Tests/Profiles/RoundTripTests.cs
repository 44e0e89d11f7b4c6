using Placement.Profiles;
using Placement.Random;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class RoundTripTests
{
    public static TheoryData<string, int, double> Bodies => new()
    {
        // body, rows, required worst relative M(r) error over 1e-5 R ≤ r ≤ R. This is our stated interpolation
        // accuracy for tables sampled by ProfileSampling.Radii; measured worst errors (this machine): Plummer 2.1e-9,
        // Hernquist 2.5e-7 (near the innermost row, where the r^-1 cusp is continued below 1e-6 R by the core power
        // law), polytrope n = 3 4.7e-10, n = 1.5 with only 500 rows 2.5e-8. Limits are 3-4x the measurements.
        { "plummer", 2000, 6e-9 },
        { "hernquist", 2000, 1e-6 },
        { "polytrope3", 2000, 1.5e-9 },
        { "polytrope1.5", 500, 1e-7 },
    };

    private static IRadialProfile Make(string body) => body switch
    {
        // Plummer and Hernquist closed forms (Binney & Tremaine 2008, eqs. 2.44b and 2.64); polytrope from our
        // Lane–Emden solver, itself checked against Poisson & Will 2014 Table 2.1 in LaneEmdenTests.
        "plummer" => new PlummerSphere(1.0, 0.2, 3.0, UnitSystem.Solar),
        "hernquist" => new HernquistSphere(1.0, 0.1, 5.0, UnitSystem.Solar),
        "polytrope3" => new Polytrope(3, 1.0, 1.0, UnitSystem.Solar),
        _ => new Polytrope(1.5, 2.0e33, 7e10, UnitSystem.Cgs),
    };

    [Theory]
    [MemberData(nameof(Bodies))]
    public void AnalyticBody_WrittenAndReadBack_ReproducesEnclosedMass(string body, int rows, double limit)
    {
        var exact = Make(body);
        using var text = new StringWriter();
        ProfileTableWriter.Write(text, exact, ProfileSampling.Radii(exact, rows), $"round-trip test of {body}");
        // Density only (the m column is ignored): M(r) is the integral of the interpolated density.
        var read = ProfileTableReader.Read(new StringReader(text.ToString()), body,
            new ProfileTableOptions { TargetUnits = exact.Units, Columns = new ProfileColumnMap { Quantities = [] } });
        read.CheckValidity();
        double worst = 0, at = 0;
        var rng = new KeyedRandom(11, 0);
        for (int i = 0; i < 5000; i++)
        {
            double r = exact.OuterRadius * Math.Pow(1e-5, rng.NextDouble());
            double e = Math.Abs(read.EnclosedMass(r) / exact.EnclosedMass(r) - 1);
            if (e > worst) { worst = e; at = r; }
        }
        Assert.True(worst < limit, $"{body}: worst relative M error {worst:E2} at r = {at:G4} (limit {limit:E0})");
        Assert.True(Math.Abs(read.TotalMass / exact.TotalMass - 1) < limit);
    }

    [Fact]
    public void Polytrope_WrittenWithMassColumn_TrustingTableMasses_IsExactAtRowsAndCarriesPressure()
    {
        var exact = new Polytrope(3, 1.0, 1.0, UnitSystem.Solar);
        using var text = new StringWriter();
        double[] radii = ProfileSampling.Radii(exact, 400);
        ProfileTableWriter.Write(text, exact, radii);
        var read = ProfileTableReader.Read(new StringReader(text.ToString()), "poly3", new ProfileTableOptions
        {
            TargetUnits = UnitSystem.Solar,
            Columns = new ProfileColumnMap { EnclosedMass = "m" },
            Profile = new TabulatedProfileOptions { MassSource = MassSource.Tabulated },
        });
        Assert.NotNull(read.Consistency);
        foreach (double r in radii) Assert.Equal(exact.EnclosedMass(r), read.EnclosedMass(r), 1e-13);
        // Pressure is carried: at rows it is the written value (round-trip formatting is exact).
        foreach (double r in radii) Assert.Equal(exact.Pressure(r), read.Quantity("P", r), 1e-15 * exact.CentralPressure);
    }
}
