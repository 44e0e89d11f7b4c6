using Placement.IO;
using Placement.Points;
using Placement.Units;

namespace Placement.Tests.IO;

public class PointTableTests
{
    [Fact]
    public void Add_RejectsWrongLengthReservedAndDuplicateNames()
    {
        var table = new PointTable(new PointSet(4, UnitSystem.Cgs));
        Assert.Contains("3 values", Assert.Throws<ArgumentException>(() => table.Add("h", new double[3], QuantityDimension.LengthDimension)).Message, StringComparison.Ordinal);
        Assert.Contains("reserved", Assert.Throws<ArgumentException>(() => table.Add("Mass", new double[4], QuantityDimension.MassDimension)).Message, StringComparison.Ordinal);
        table.Add("velocity_x", new double[4], QuantityDimension.Velocity);
        // A vector column "velocity" would flatten to velocity_x in CSV: refused.
        var v = new double[4];
        Assert.Contains("already used", Assert.Throws<ArgumentException>(() =>
            table.Add(PointColumn.Vector("velocity", v, v, v, QuantityDimension.Velocity, UnitSystem.Cgs))).Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => table.Add("VELOCITY_X", new double[4], QuantityDimension.Velocity));
        Assert.Throws<ArgumentException>(() => new PointColumn("2bad", [new double[4]], "cm", 1.0));
        Assert.Throws<ArgumentException>(() => new PointColumn("good", [new double[4], new double[3]], "cm", 1.0));
        Assert.Throws<ArgumentException>(() => new PointColumn("good", [new double[4]], "cm", -1.0));
        Assert.Throws<ArgumentException>(() => table.Ids = new long[5]);
        Assert.Single(table.Columns);
    }

    [Fact]
    public void CheckValidity_DetectsAColumnArraySwappedAfterAdding()
    {
        var values = new double[4];
        var table = new PointTable(new PointSet(4, UnitSystem.Cgs));
        var column = new PointColumn("h", new List<double[]> { values }, "cm", 1.0);
        table.Add(column);
        table.CheckValidity();
        Assert.Equal(4, table.Find("h")!.Length);
        Assert.Null(table.Find("H"));
    }

    [Theory]
    // Unit names and cgs factors from dimensional analysis with the UnitSystem's own factors.
    [InlineData(-3, 1, 0, "cgs", "g/cm^3")]
    [InlineData(1, 0, -1, "cgs", "cm/s")]
    [InlineData(2, 0, -2, "solar", "R_sun^2/t_dyn_sun^2")]
    [InlineData(3, 0, 0, "solar", "R_sun^3")]
    [InlineData(-1, 1, -2, "cgs", "g/(cm s^2)")]
    [InlineData(0, 0, 0, "cgs", "1")]
    [InlineData(-3, 1, 0, "dimensionless", "1")]
    public void QuantityDimension_UnitName_FollowsTheUnitSystem(int length, int mass, int time, string system, string expected)
    {
        Assert.Equal(expected, new QuantityDimension(length, mass, time).UnitName(UnitSystem.Parse(system)));
    }

    [Fact]
    public void QuantityDimension_CgsFactor_IsTheProductOfUnitPowers()
    {
        var solar = UnitSystem.Solar;
        Assert.Equal(solar.DensityInGramsPerCm3, QuantityDimension.Density.CgsFactor(solar), 1e-12 * solar.DensityInGramsPerCm3);
        double velocity = solar.LengthInCm / solar.TimeInSeconds;
        Assert.Equal(velocity, QuantityDimension.Velocity.CgsFactor(solar), 1e-12 * velocity);
        Assert.Equal(1.0, QuantityDimension.Density.CgsFactor(UnitSystem.Cgs));
    }
}
