using ScottPlot;

namespace Placement.Plots;

/// <summary>Figure (a): target versus measured density against radius on log–log axes.</summary>
/// <remarks>
/// The target is a black line; the measurement is blue markers with asymmetric error bars (from
/// <see cref="DensityProfileData.MeasuredLower"/>/<see cref="DensityProfileData.MeasuredUpper"/>), or a shaded
/// band when there are more than <see cref="MaxErrorBars"/> bins. Non-positive values cannot be shown on a
/// log axis and are left out.
/// </remarks>
public static class DensityProfileFigure
{
    /// <summary>Above this many measured bins the uncertainty is drawn as a band instead of error bars.</summary>
    public const int MaxErrorBars = 60;

    /// <summary>Builds the figure.</summary>
    /// <param name="data">Curves and bins.</param>
    /// <returns>A ScottPlot plot; save it with <see cref="FigureFile.Save"/>.</returns>
    /// <exception cref="ArgumentException">Paired arrays differ in length, or there is nothing positive to plot.</exception>
    public static Plot Create(DensityProfileData data)
    {
        ArgumentNullException.ThrowIfNull(data);
        PlotGuards.SameLength(data.TargetRadius, nameof(data.TargetRadius), data.TargetDensity, nameof(data.TargetDensity));
        PlotGuards.SameLength(data.MeasuredRadius, nameof(data.MeasuredRadius), data.MeasuredDensity, nameof(data.MeasuredDensity));
        bool hasRange = data.MeasuredLower is not null || data.MeasuredUpper is not null;
        if (hasRange)
        {
            PlotGuards.SameLength(data.MeasuredDensity, nameof(data.MeasuredDensity), data.MeasuredLower, nameof(data.MeasuredLower));
            PlotGuards.SameLength(data.MeasuredDensity, nameof(data.MeasuredDensity), data.MeasuredUpper, nameof(data.MeasuredUpper));
        }

        var u = data.Units;
        var plot = FigureStyle.NewPlot(data.Title, UnitLabel.Axis("Radius r", u.LengthUnitName), UnitLabel.Axis("Density ρ", u.DensityUnitName));
        var (tx, ty, _) = PlotGuards.FinitePairs(LogAxis.Log10(data.TargetRadius), LogAxis.Log10(data.TargetDensity));
        var (mx, my, index) = PlotGuards.FinitePairs(LogAxis.Log10(data.MeasuredRadius), LogAxis.Log10(data.MeasuredDensity));
        if (tx.Length == 0 && mx.Length == 0)
            throw new ArgumentException("Nothing to plot: no target or measured point has a positive radius and density.", nameof(data));

        if (hasRange && mx.Length > 0)
        {
            var lower = LogAxis.Log10(data.MeasuredLower);
            var upper = LogAxis.Log10(data.MeasuredUpper);
            var below = new double[mx.Length];
            var above = new double[mx.Length];
            for (int k = 0; k < mx.Length; k++)
            {
                int i = index[k];
                // A non-positive lower bound reaches off the log axis: draw it to the bottom of the bin's own value range.
                below[k] = double.IsFinite(lower[i]) ? Math.Max(0, my[k] - lower[i]) : 0;
                above[k] = double.IsFinite(upper[i]) ? Math.Max(0, upper[i] - my[k]) : 0;
            }
            if (mx.Length <= MaxErrorBars)
            {
                var bars = plot.Add.ErrorBar(mx, my, above);
                bars.YErrorNegative = below;
                bars.YErrorPositive = above;
                bars.Color = FigureStyle.Blue;
                bars.LineWidth = 1.5f;
                bars.CapSize = 4;
            }
            else
            {
                var low = new double[mx.Length];
                var high = new double[mx.Length];
                for (int k = 0; k < mx.Length; k++) { low[k] = my[k] - below[k]; high[k] = my[k] + above[k]; }
                var band = plot.Add.FillY(mx, low, high);
                band.FillColor = FigureStyle.Blue.WithAlpha(0.25);
                band.LineWidth = 0;
                band.LegendText = data.MeasuredLabel + " spread";
            }
        }

        if (tx.Length > 0)
        {
            var target = plot.Add.ScatterLine(tx, ty, FigureStyle.Black);
            target.LineWidth = 2.5f;
            target.LegendText = data.TargetLabel;
        }
        if (mx.Length > 0)
        {
            var measured = plot.Add.ScatterPoints(mx, my, FigureStyle.Blue);
            measured.MarkerSize = mx.Length <= MaxErrorBars ? 8 : 5;
            measured.MarkerShape = MarkerShape.FilledCircle;
            measured.LegendText = data.MeasuredLabel;
        }

        plot.Axes.AutoScale();
        plot.Axes.Margins(0.04, 0.06);
        var limits = plot.Axes.GetLimits();
        LogAxis.Apply(plot.Axes.Bottom, limits.Left, limits.Right);
        LogAxis.Apply(plot.Axes.Left, limits.Bottom, limits.Top);
        FigureStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }
}
