using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Profiles;

public class ProfileTableReaderTests
{
    private static string Fixture(string name) => Path.Combine(AppContext.BaseDirectory, "Fixtures", "Profiles", name);

    private static TabulatedProfile ReadText(string text, ProfileTableOptions? options = null) =>
        ProfileTableReader.Read(new StringReader(text), "inline.txt", options);

    private static ProfileFormatException Fails(string text, ProfileTableOptions? options = null) =>
        Assert.Throws<ProfileFormatException>(() => ReadText(text, options));

    [Fact]
    public void LayeredCsv_WithColumnMapUnits_ReadsStepQuantitiesAndConsistentMasses()
    {
        var options = new ProfileTableOptions
        {
            Columns = new ProfileColumnMap { Radius = "r:km", Density = "rho:g/cm^3", EnclosedMass = "M:kg", Quantities = ["T:K", "X:1"] },
            TargetUnits = UnitSystem.Cgs,
        };
        var p = ProfileTableReader.Read(Fixture("layered-body.csv"), options);
        p.CheckValidity();
        // Exact layered mass (fixture comment): 4π/3 (8 · 0.5e5³ + 1e5³ − 0.5e5³) g.
        double total = 4 * Math.PI / 3 * (8 * Math.Pow(0.5e5, 3) + Math.Pow(1e5, 3) - Math.Pow(0.5e5, 3));
        Assert.Equal(1e5, p.OuterRadius, 1e-9);
        Assert.Equal(total, p.TotalMass, 1e-12 * total);
        Assert.Equal(8.0, p.Density(0.4e5), 12);
        Assert.Equal(1.0, p.Density(0.6e5), 12);
        Assert.True(p.Consistency!.MaxRelativeDifference < 1e-13, $"consistency {p.Consistency.MaxRelativeDifference}");
        Assert.Equal(0.7, p.Quantity("X", 0.6e5), 12);
        Assert.Equal(0.0, p.Quantity("X", 0.4e5), 12);
        Assert.InRange(p.Quantity("T", 0.6e5), 6.0e3, 8.0e3);
        Assert.Equal("K", p.Quantities[0].Unit.Name);
    }

    [Fact]
    public void WhitespaceTable_WithHeaderUnits_ConvertsToSolarUnits()
    {
        const string text = "# invented two-row test\nr[R_sun] rho[g/cm^3] P[dyn/cm^2]\n0 1.0 10 # centre\n1 1.0 5\n";
        var p = ReadText(text, new ProfileTableOptions { TargetUnits = UnitSystem.Solar });
        // 1 g/cm^3 in M_sun/R_sun^3: R_sun³/M_sun with the IAU 2015 B3 nominal values used by UnitSystem.
        double rhoSolar = Math.Pow(UnitSystem.SolarRadiusCm, 3) / UnitSystem.SolarMassGrams;
        Assert.Equal(rhoSolar, p.Density(0.5), 1e-12 * rhoSolar);
        Assert.Equal(4 * Math.PI / 3 * rhoSolar, p.TotalMass, 1e-12);
        // Pressure converted to M_sun R_sun^-1 t_dyn_sun^-2: factor from the unit system's cgs sizes.
        var u = UnitSystem.Solar;
        double pUnit = u.MassInGrams / (u.LengthInCm * u.TimeInSeconds * u.TimeInSeconds);
        Assert.Equal(10 / pUnit, p.Quantity("P", 0), 1e-12 * 10 / pUnit);
    }

    [Fact]
    public void MassCoordinateTable_IsConvertedToRadius()
    {
        const string text = "m[g] rho[g/cm^3]\n0 2\n1 2\n3 2\n";
        var p = ReadText(text, new ProfileTableOptions { Columns = new ProfileColumnMap { Radius = null, MassCoordinate = "m" } });
        Assert.Equal(Math.Cbrt(3 * 3 / (4 * Math.PI * 2)), p.OuterRadius, 1e-14);
    }

    [Fact]
    public void NonNumericCell_NamesFileLineColumnAndValue()
    {
        var e = Fails("r[cm] rho[g/cm^3]\n0 1\n1 abc\n");
        Assert.Equal("inline.txt", e.SourceName);
        Assert.Equal(3, e.Line);
        Assert.Equal("rho", e.Column);
        Assert.Equal("abc", e.Value);
        Assert.Contains("inline.txt:3", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("NaN")]
    [InlineData("Infinity")]
    [InlineData("-Infinity")]
    public void NonFiniteCell_IsRejected(string cell)
    {
        var e = Fails($"r[cm] rho[g/cm^3]\n0 1\n1 {cell}\n");
        Assert.Equal(3, e.Line);
        Assert.Equal(cell, e.Value);
        Assert.Contains("finite", e.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void NegativeDensity_InFixtureFile_NamesFileAndLine()
    {
        var e = Assert.Throws<ProfileFormatException>(() => ProfileTableReader.Read(Fixture("bad-density.txt")));
        Assert.Equal("bad-density.txt", e.SourceName);
        Assert.Equal(5, e.Line);
        Assert.Equal("rho", e.Column);
        Assert.Equal("-0.1", e.Value);
    }

    [Fact]
    public void ZeroDensity_AllowedOnlyAtOuterEdgeAndOnlyWhenAllowed()
    {
        var inner = Fails("r[cm] rho[g/cm^3]\n0 1\n1 0\n2 1\n");
        Assert.Equal(3, inner.Line);
        Assert.Contains("outer edge", inner.Reason, StringComparison.Ordinal);
        const string surface = "r[cm] rho[g/cm^3]\n0 1\n1 0.5\n2 0\n";
        Assert.Equal(2, ReadText(surface).OuterRadius);
        var off = Fails(surface, new ProfileTableOptions { Profile = new TabulatedProfileOptions { AllowZeroOuterDensity = false } });
        Assert.Equal(4, off.Line);
    }

    [Fact]
    public void DecreasingRadius_IsRejected()
    {
        var e = Fails("r[cm] rho[g/cm^3]\n0 1\n2 1\n1 1\n");
        Assert.Equal(4, e.Line);
        Assert.Equal("r", e.Column);
        Assert.Equal("1", e.Value);
    }

    [Fact]
    public void DuplicatedRadius_IsRejected_UnlessItIsADensityStep()
    {
        var same = Fails("r[cm] rho[g/cm^3]\n0 1\n1 1\n1 1\n2 1\n");
        Assert.Equal(4, same.Line);
        Assert.Contains("duplicated", same.Reason, StringComparison.Ordinal);
        const string step = "r[cm] rho[g/cm^3]\n0 2\n1 2\n1 1\n2 1\n";
        Assert.Equal(1, ReadText(step).Density(1.5), 12);
        var noSteps = Fails(step, new ProfileTableOptions { Profile = new TabulatedProfileOptions { AllowDensitySteps = false } });
        Assert.Equal(4, noSteps.Line);
        var triple = Fails("r[cm] rho[g/cm^3]\n0 3\n1 3\n1 2\n1 1\n2 1\n");
        Assert.Equal(5, triple.Line); // the third row with r = 1
    }

    [Fact]
    public void FewerThanTwoRows_IsRejected()
    {
        var e = Fails("# only one row\nr[cm] rho[g/cm^3]\n0 1\n");
        Assert.Equal(3, e.Line);
        Assert.Contains("at least two rows", e.Reason, StringComparison.Ordinal);
        Assert.Contains("at least two rows", Fails("r[cm] rho[g/cm^3]\n").Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void UnknownColumnName_ListsTheHeader()
    {
        var e = Fails("r[cm] rho[g/cm^3]\n0 1\n1 1\n", new ProfileTableOptions { Columns = new ProfileColumnMap { Density = "density" } });
        Assert.Equal(1, e.Line);
        Assert.Equal("density", e.Column);
        Assert.Contains("r, rho", e.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void MissingUnknownOrWrongUnits_AreRejected()
    {
        var missing = Fails("r rho[g/cm^3]\n0 1\n1 1\n");
        Assert.Equal("r", missing.Column);
        Assert.Contains("missing unit", missing.Reason, StringComparison.Ordinal);
        var unknown = Fails("r[furlong] rho[g/cm^3]\n0 1\n1 1\n");
        Assert.Equal("furlong", unknown.Value);
        var wrong = Fails("r[g] rho[g/cm^3]\n0 1\n1 1\n");
        Assert.Contains("wrong dimension", wrong.Reason, StringComparison.Ordinal);
        var extraMissing = Fails("r[cm] rho[g/cm^3] T\n0 1 5\n1 1 4\n");
        Assert.Equal("T", extraMissing.Column);
    }

    [Fact]
    public void RowWithWrongCellCount_IsRejected()
    {
        var e = Fails("r[cm] rho[g/cm^3]\n0 1\n1 1 7\n");
        Assert.Equal(3, e.Line);
    }

    [Fact]
    public void EnclosedMassColumn_NonMonotone_IsRejected()
    {
        var e = Fails("r[cm] rho[g/cm^3] m[g]\n0 1 0\n1 1 4\n2 1 3\n", new ProfileTableOptions { Columns = new ProfileColumnMap { EnclosedMass = "m" } });
        Assert.Equal(4, e.Line);
        Assert.Equal("m", e.Column);
    }
}
