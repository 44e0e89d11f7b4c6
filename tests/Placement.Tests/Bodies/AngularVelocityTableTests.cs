using Placement.Bodies;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Bodies;

public class AngularVelocityTableTests
{
    private static AngularVelocityTable Parse(string text, UnitSystem? units = null) =>
        AngularVelocityTable.Parse(new StringReader(text), "omega.txt", units ?? UnitSystem.Solar);

    [Fact]
    public void Table_HitsItsRows_StaysMonotoneBetweenThem_AndIsConstantBeyondTheEnds()
    {
        // An invented, decreasing rotation law.
        var table = Parse("# invented differential rotation\n\nradius [R_sun], omega [1/t_dyn_sun]\n0.1, 0.5\n0.3 0.45\n0.6\t0.2\n1.0 0.05\n");
        Assert.Equal(0.5, table.Evaluate(0.1));
        Assert.Equal(0.2, table.Evaluate(0.6));
        Assert.Equal(0.5, table.Evaluate(0.0));   // constant below the first row
        Assert.Equal(0.05, table.Evaluate(3.0));  // constant beyond the last row
        double previous = double.PositiveInfinity;
        for (double r = 0.1; r <= 1.0; r += 0.001)
        {
            double w = table.Evaluate(r);
            // PCHIP never overshoots and keeps monotone data monotone (Fritsch & Carlson 1980).
            Assert.True(w <= previous + 1e-15 && w >= 0.05 - 1e-15 && w <= 0.5 + 1e-15, $"Omega({r}) = {w}");
            previous = w;
        }
        Assert.False(table.Covers(1.0));
        Assert.True(Parse("r [R_sun] omega [1/t_dyn_sun]\n0 1\n2 1\n").Covers(1.0));
    }

    [Fact]
    public void Table_ConvertsItsUnitsToTheBodysUnitSystem()
    {
        // 1 R_sun = 6.957e10 cm (IAU 2015 B3, as in UnitSystem); 1/yr = 1/(365.25 × 86400 s) (Julian year).
        var table = Parse("radius [R_sun] omega [1/yr]\n0 1\n2 3\n", UnitSystem.Cgs);
        Assert.Equal(2 * UnitSystem.SolarRadiusCm, table.Radius[1], 1e-3);
        Assert.Equal(3 / (365.25 * 86400), table.Omega[1], 1e-22);
    }

    [Theory]
    [InlineData("radius [R_sun] omega [1/t_dyn_sun]\n0 1\n0.5 abc\n", 3, "omega", "abc")]
    [InlineData("radius [R_sun] omega [1/t_dyn_sun]\n0 1\n0.5 2\n0.5 3\n", 4, "radius", "0.5")]
    [InlineData("radius [R_sun] omega [1/t_dyn_sun]\n-1 1\n0.5 2\n", 2, "radius", "-1")]
    [InlineData("# c\nradius [R_sun] omega [g]\n0 1\n1 2\n", 2, "omega", "g")]
    [InlineData("radius [R_sun] spin [1/s]\n0 1\n1 2\n", 1, "header", "spin")]
    [InlineData("radius omega\n0 1\n1 2\n", 1, "header", "radius omega")]
    [InlineData("radius [R_sun] omega [1/s]\n0 1 2\n", 2, "#3", "2")]
    [InlineData("radius [R_sun] omega [1/s]\n0 1\n5\n", 3, "omega", "5")]
    [InlineData("radius [R_sun] omega [1/s]\n0 1\n", 2, "radius", "1")]
    public void Table_BadInput_NamesFileLineColumnAndValue(string text, int line, string column, string value)
    {
        var ex = Assert.Throws<ProfileFormatException>(() => Parse(text));
        Assert.Equal("omega.txt", ex.SourceName);
        Assert.Equal(line, ex.Line);
        Assert.Equal(column, ex.Column);
        Assert.Equal(value, ex.Value);
    }
}
