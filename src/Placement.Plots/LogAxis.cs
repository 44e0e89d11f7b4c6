using ScottPlot;
using ScottPlot.TickGenerators;

namespace Placement.Plots;

/// <summary>Makes an axis that shows log10 of the data look logarithmic: labels 10ⁿ at whole decades and minor ticks at 2…9 × 10ⁿ.</summary>
/// <remarks>ScottPlot 5 has no logarithmic axis type; the documented approach is to plot log10(values) and relabel the ticks.</remarks>
internal static class LogAxis
{
    /// <summary>Configures <paramref name="axis"/> for log10 data spanning [<paramref name="min"/>, <paramref name="max"/>] (in log10 units).</summary>
    public static void Apply(IAxis axis, double min, double max)
    {
        var ticks = new NumericAutomatic
        {
            MinorTickGenerator = new LogMinorTickGenerator(),
            // Whole decades only when the data span at least two; otherwise label intermediate values in full.
            IntegerTicksOnly = max - min >= 2,
            LabelFormatter = Format,
        };
        axis.TickGenerator = ticks;
    }

    /// <summary>log10 of each value, NaN for values ≤ 0 or non-finite (they are then left out of the plot).</summary>
    public static double[] Log10(ReadOnlySpan<double> values)
    {
        var result = new double[values.Length];
        for (int i = 0; i < values.Length; i++)
            result[i] = values[i] > 0 && double.IsFinite(values[i]) ? Math.Log10(values[i]) : double.NaN;
        return result;
    }

    private static string Format(double log10)
    {
        double rounded = Math.Round(log10);
        if (Math.Abs(log10 - rounded) < 1e-9) return UnitLabel.PowerOfTen((int)rounded);
        return Math.Pow(10, log10).ToString("G3", System.Globalization.CultureInfo.InvariantCulture);
    }
}
