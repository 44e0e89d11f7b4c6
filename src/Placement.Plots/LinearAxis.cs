using System.Globalization;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace Placement.Plots;

/// <summary>Tick labels for linear axes: compact invariant-culture numbers with a true minus sign (U+2212).</summary>
internal static class LinearAxis
{
    /// <summary>Uses <see cref="Format"/> for the tick labels of <paramref name="axis"/>.</summary>
    public static void Apply(IAxis axis) => axis.TickGenerator = new NumericAutomatic { LabelFormatter = Format };

    /// <summary>Shortest text for a tick value, after rounding away floating-point noise (12 significant digits).</summary>
    public static string Format(double value)
    {
        if (value == 0) return "0";
        double magnitude = Math.Pow(10, Math.Floor(Math.Log10(Math.Abs(value))) - 11);
        double clean = Math.Round(value / magnitude) * magnitude;
        return clean.ToString("G6", CultureInfo.InvariantCulture).Replace('-', '−');
    }
}
