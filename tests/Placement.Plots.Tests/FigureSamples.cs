using Placement.Plots;
using Placement.Random;
using Placement.Units;

namespace Placement.Plots.Tests;

/// <summary>Invented, seeded inputs for each figure (a toy profile ρ = (1 + r²)^−5/2; nothing physical is implied).</summary>
internal static class FigureSamples
{
    public static DensityProfileData Density(int bins = 25)
    {
        var rng = new KeyedRandom(11, 1);
        var tr = new double[100];
        var td = new double[100];
        for (int i = 0; i < tr.Length; i++)
        {
            tr[i] = Math.Pow(10, -2 + 2.5 * i / 99.0);
            td[i] = Math.Pow(1 + tr[i] * tr[i], -2.5);
        }
        var mr = new double[bins];
        var md = new double[bins];
        var lo = new double[bins];
        var hi = new double[bins];
        for (int i = 0; i < bins; i++)
        {
            mr[i] = Math.Pow(10, -1.8 + 2.2 * i / (bins - 1));
            md[i] = Math.Pow(1 + mr[i] * mr[i], -2.5) * (1 + 0.05 * (rng.NextDouble() - 0.5));
            lo[i] = md[i] * 0.9;
            hi[i] = md[i] * 1.1;
        }
        return new DensityProfileData(tr, td, mr, md, lo, hi, UnitSystem.Solar);
    }

    public static EnclosedMassErrorData MassError()
    {
        var rng = new KeyedRandom(12, 1);
        var r = new double[40];
        var e = new double[40];
        for (int i = 0; i < r.Length; i++)
        {
            r[i] = Math.Pow(10, -1.5 + 2 * i / 39.0);
            e[i] = 0.02 * Math.Exp(-3 * r[i]) * (rng.NextDouble() - 0.5);
        }
        return new EnclosedMassErrorData(r, e, UnitSystem.Solar) { Tolerance = 0.01 };
    }

    public static CellVolumeHistogramData Histogram()
    {
        var rng = new KeyedRandom(13, 1);
        var s = new double[5000];
        var b = new double[5000];
        for (int i = 0; i < s.Length; i++)
        {
            s[i] = 0.1 * (rng.NextDouble() + rng.NextDouble() + rng.NextDouble() - 1.5);
            b[i] = Math.Log(-Math.Log(1 - rng.NextDouble()) + 0.2);
        }
        return new CellVolumeHistogramData(s, b);
    }

    public static SliceScatterData Slice(int n = 20000)
    {
        var rng = new KeyedRandom(14, 1);
        var x = new double[n];
        var y = new double[n];
        var z = new double[n];
        var v = new double[n];
        for (int i = 0; i < n; i++)
        {
            x[i] = 2 * rng.NextDouble() - 1;
            y[i] = 2 * rng.NextDouble() - 1;
            z[i] = 2 * rng.NextDouble() - 1;
            v[i] = 0.3 * x[i] + 0.05 * (rng.NextDouble() - 0.5);
        }
        return new SliceScatterData(x, y, z, v, 0.1, UnitSystem.Solar);
    }
}
