using ScottPlot;

namespace Placement.Plots;

/// <summary>Figure (b): relative error of the enclosed mass, in percent, against radius on a log axis.</summary>
/// <remarks>A dashed line marks zero error; an optional tolerance is shaded. Non-finite values are left out.</remarks>
public static class EnclosedMassErrorFigure
{
    /// <summary>Builds the figure.</summary>
    /// <param name="data">Radii and relative errors.</param>
    /// <returns>A ScottPlot plot; save it with <see cref="FigureFile.Save"/>.</returns>
    /// <exception cref="ArgumentException">The arrays differ in length, nothing is finite, or the tolerance is not positive.</exception>
    public static Plot Create(EnclosedMassErrorData data)
    {
        ArgumentNullException.ThrowIfNull(data);
        PlotGuards.SameLength(data.Radius, nameof(data.Radius), data.RelativeError, nameof(data.RelativeError));
        if (data.Tolerance is { } t && !(t > 0 && double.IsFinite(t)))
            throw new ArgumentException($"Tolerance is {t}; expected a positive number (e.g. 0.01 for 1 %).", nameof(data));

        var percent = new double[data.RelativeError.Length];
        for (int i = 0; i < percent.Length; i++) percent[i] = 100 * data.RelativeError[i];
        var (x, y, _) = PlotGuards.FinitePairs(LogAxis.Log10(data.Radius), percent);
        if (x.Length == 0) throw new ArgumentException("Nothing to plot: no radius is positive with a finite error.", nameof(data));

        var plot = FigureStyle.NewPlot(data.Title, UnitLabel.Axis("Radius r", data.Units.LengthUnitName), data.YLabel);
        double xMin = x.Min(), xMax = x.Max();
        if (data.Tolerance is { } tol)
        {
            var band = plot.Add.FillY([xMin, xMax], [-100 * tol, -100 * tol], [100 * tol, 100 * tol]);
            band.FillColor = FigureStyle.Grey.WithAlpha(0.15);
            band.LineWidth = 0;
            band.LegendText = $"±{(100 * tol).ToString("G3", System.Globalization.CultureInfo.InvariantCulture)} % tolerance";
        }
        var zero = plot.Add.HorizontalLine(0, 1.5f, FigureStyle.Grey, LinePattern.Dashed);
        zero.LegendText = "";
        var curve = plot.Add.Scatter(x, y, FigureStyle.Blue);
        curve.LineWidth = 2;
        curve.MarkerSize = x.Length <= 80 ? 6 : 0;
        curve.LegendText = data.Label;

        plot.Axes.AutoScale();
        plot.Axes.Margins(0.03, 0.12);
        var limits = plot.Axes.GetLimits();
        LogAxis.Apply(plot.Axes.Bottom, limits.Left, limits.Right);
        LinearAxis.Apply(plot.Axes.Left);
        FigureStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }
}
