using System.Text.Json;
using Placement.IO;
using Placement.IO.Hdf5;
using Placement.Units;

namespace Placement.Tests.IO;

public class BodyValuesTests
{
    private static PointTable WithBody(int n)
    {
        var table = TestTables.Make(n);
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.Gamma, 5.0 / 3.0, QuantityDimension.Dimensionless, UnitSystem.Solar, "adiabatic index"));
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.PointsGravitationalEnergy, -0.75, new QuantityDimension(2, 1, -2), UnitSystem.Solar, "W of the points"));
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.PointsKineticEnergy, double.NaN, new QuantityDimension(2, 1, -2), UnitSystem.Solar, "not computed"));
        table.BodyLabels[BodyNames.Match] = "density+entropy";
        table.BodyLabels[BodyNames.EnergySource] = "ideal-gas";
        return table;
    }

    [Fact]
    public void BodyScalarsAndLabels_RoundTripThroughHdf5_WithUnits()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("body.h5");
        var table = WithBody(40);
        Hdf5PointWriter.Write(table, path);
        var back = Hdf5PointReader.Read(path);
        Assert.Equal(3, back.BodyScalars.Count);
        var energy = back.BodyScalars.Single(s => s.Name == BodyNames.PointsGravitationalEnergy);
        Assert.Equal(-0.75, energy.Value);
        Assert.Equal("M_sun R_sun^2/t_dyn_sun^2", energy.Unit);
        // erg = g cm² s⁻²: the factor is M_sun R_sun² / t_dyn² in cgs (dimensional analysis).
        double expected = UnitSystem.SolarMassGrams * UnitSystem.SolarRadiusCm * UnitSystem.SolarRadiusCm / (UnitSystem.Solar.TimeInSeconds * UnitSystem.Solar.TimeInSeconds);
        Assert.Equal(expected, energy.CgsFactor, expected * 1e-14);
        Assert.True(double.IsNaN(back.BodyScalars.Single(s => s.Name == BodyNames.PointsKineticEnergy).Value));
        Assert.Equal("density+entropy", back.BodyLabels[BodyNames.Match]);
        Assert.Equal("ideal-gas", back.BodyLabels[BodyNames.EnergySource]);
        // A table without body values writes no /body group and reads back empty.
        string plain = dir.File("plain.h5");
        Hdf5PointWriter.Write(TestTables.Make(5), plain);
        var none = Hdf5PointReader.Read(plain);
        Assert.Empty(none.BodyScalars);
        Assert.Empty(none.BodyLabels);
    }

    [Fact]
    public void InvalidBodyValues_AreRefusedBeforeWriting()
    {
        using var dir = TestTables.TempDir();
        var table = WithBody(4);
        table.BodyScalars.Add(new BodyScalar(BodyNames.Gamma, 1.4, "1", 1));
        Assert.Contains("twice", Assert.Throws<InvalidOperationException>(() => Hdf5PointWriter.Write(table, dir.File("a.h5"))).Message);
        var bad = TestTables.Make(4);
        bad.BodyScalars.Add(new BodyScalar("2bad", 1, "1", 1));
        Assert.Throws<InvalidOperationException>(() => Hdf5PointWriter.Write(bad, dir.File("b.h5")));
        Assert.False(File.Exists(dir.File("a.h5")) || File.Exists(dir.File("b.h5")));
    }

    [H5pyFact]
    public void BodyGroup_ReadByH5py_HasScalarDatasetsWithUnitsAndStringAttributes()
    {
        ExternalTools.Require(ExternalTools.HasH5py, "h5py (" + ExternalTools.Python + ")");
        using var dir = TestTables.TempDir();
        string path = dir.File("body-h5py.h5");
        Hdf5PointWriter.Write(WithBody(10), path);
        // Reference reader: h5py (Debian python3-h5py), on top of the HDF5 C library.
        const string script = """
import h5py, json, sys
b = h5py.File(sys.argv[1], 'r')['body']
out = {'attrs': {k: (v.decode() if isinstance(v, bytes) else v) for k, v in b.attrs.items()}}
for name in b:
    d = b[name]
    out[name] = {'shape': list(d.shape), 'value': repr(float(d[()])), 'units': d.attrs['units'], 'cgs_factor': float(d.attrs['cgs_factor'])}
print(json.dumps(out))
""";
        var (code, stdout, stderr) = ExternalTools.Run(ExternalTools.Python, ["-c", script, path]);
        Assert.True(code == 0, "h5py failed: " + stderr);
        using var json = JsonDocument.Parse(stdout);
        var root = json.RootElement;
        Assert.Equal("density+entropy", root.GetProperty("attrs").GetProperty("match").GetString());
        var gamma = root.GetProperty("gamma");
        Assert.Empty(gamma.GetProperty("shape").EnumerateArray());
        Assert.Equal(5.0 / 3.0, double.Parse(gamma.GetProperty("value").GetString()!, System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal("1", gamma.GetProperty("units").GetString());
        Assert.Equal("nan", root.GetProperty("points_kinetic_energy").GetProperty("value").GetString());
    }
}
