using System.Globalization;
using ScottPlot;

namespace Placement.Plots;

/// <summary>Figure (c): histogram (as probability density) of ln(Vρ/m) for the point set against the Poisson baseline.</summary>
/// <remarks>
/// Both samples share one set of bins spanning the 0.2nd to 99.8th percentile of the pooled values (so a few
/// extreme cells do not squash the plot; values outside fall off the ends and the legend gives the full
/// standard deviation). Each histogram is normalised to unit area. The point set is a filled blue histogram,
/// the baseline an orange outline; a vertical line marks the ideal value 0.
/// </remarks>
public static class CellVolumeHistogramFigure
{
    /// <summary>Builds the figure.</summary>
    /// <param name="data">The two samples.</param>
    /// <returns>A ScottPlot plot; save it with <see cref="FigureFile.Save"/>.</returns>
    /// <exception cref="ArgumentException">The point-set sample has no finite value, or the bin count is out of range.</exception>
    public static Plot Create(CellVolumeHistogramData data)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(data.LogRatio);
        ArgumentNullException.ThrowIfNull(data.PoissonBaseline);
        if (data.Bins is < 5 or > 400) throw new ArgumentException($"Bins is {data.Bins}; expected 5 to 400.", nameof(data));
        double[] sample = Finite(data.LogRatio);
        double[] baseline = Finite(data.PoissonBaseline);
        if (sample.Length == 0) throw new ArgumentException("Nothing to plot: LogRatio has no finite value.", nameof(data));

        var pooled = sample.Concat(baseline).ToArray();
        Array.Sort(pooled);
        double lo = Quantile(pooled, 0.002), hi = Quantile(pooled, 0.998);
        lo = Math.Min(lo, -1e-3);
        hi = Math.Max(hi, 1e-3);
        double width = (hi - lo) / data.Bins;

        var plot = FigureStyle.NewPlot(data.Title, "ln(V ρ / m)", "Probability density");
        if (baseline.Length > 0)
        {
            var (bx, by) = Outline(Density(baseline, lo, width, data.Bins), lo, width);
            var line = plot.Add.ScatterLine(bx, by, FigureStyle.Orange);
            line.LineWidth = 2.5f;
            line.LegendText = $"{data.BaselineLabel} (σ = {Std(baseline).ToString("0.000", CultureInfo.InvariantCulture)})";
        }
        var density = Density(sample, lo, width, data.Bins);
        var bars = new List<Bar>(data.Bins);
        for (int b = 0; b < data.Bins; b++)
            bars.Add(new Bar
            {
                Position = lo + (b + 0.5) * width,
                Value = density[b],
                Size = width,
                FillColor = FigureStyle.Blue.WithAlpha(0.55),
                LineWidth = 0,
            });
        var barPlot = plot.Add.Bars(bars);
        barPlot.LegendText = $"{data.Label} (σ = {Std(sample).ToString("0.000", CultureInfo.InvariantCulture)}, N = {sample.Length.ToString(CultureInfo.InvariantCulture)})";
        plot.MoveToBack(barPlot);
        var ideal = plot.Add.VerticalLine(0, 1.5f, FigureStyle.Black, LinePattern.Dashed);
        ideal.LegendText = "ideal: V ρ = m";

        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(lo, hi);
        plot.Axes.SetLimitsY(0, plot.Axes.GetLimits().Top * 1.18);
        LinearAxis.Apply(plot.Axes.Bottom);
        LinearAxis.Apply(plot.Axes.Left);
        FigureStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }

    private static double[] Finite(double[] values) => values.Where(double.IsFinite).ToArray();

    /// <summary>Linear-interpolated quantile of sorted values.</summary>
    private static double Quantile(double[] sorted, double q)
    {
        double at = q * (sorted.Length - 1);
        int i = (int)Math.Floor(at);
        if (i >= sorted.Length - 1) return sorted[^1];
        return sorted[i] + (at - i) * (sorted[i + 1] - sorted[i]);
    }

    /// <summary>Histogram normalised to unit area over all values (values outside the range count in the area but in no bin).</summary>
    internal static double[] Density(double[] values, double lo, double width, int bins)
    {
        var counts = new double[bins];
        foreach (double v in values)
        {
            int b = (int)Math.Floor((v - lo) / width);
            if (b >= 0 && b < bins) counts[b]++;
        }
        for (int b = 0; b < bins; b++) counts[b] /= values.Length * width;
        return counts;
    }

    /// <summary>Step outline of a histogram, closed to zero at both ends.</summary>
    internal static (double[] X, double[] Y) Outline(double[] density, double lo, double width)
    {
        int bins = density.Length;
        var x = new double[2 * bins + 2];
        var y = new double[2 * bins + 2];
        x[0] = lo;
        for (int b = 0; b < bins; b++)
        {
            x[2 * b + 1] = lo + b * width;
            y[2 * b + 1] = density[b];
            x[2 * b + 2] = lo + (b + 1) * width;
            y[2 * b + 2] = density[b];
        }
        x[^1] = lo + bins * width;
        return (x, y);
    }

    private static double Std(double[] values)
    {
        double mean = values.Average();
        double sum = 0;
        foreach (double v in values) sum += (v - mean) * (v - mean);
        return values.Length > 1 ? Math.Sqrt(sum / (values.Length - 1)) : 0;
    }
}
