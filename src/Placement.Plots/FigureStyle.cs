using ScottPlot;

namespace Placement.Plots;

/// <summary>The shared look of every Placement figure: bundled font, sizes readable on a slide, light grid, colour-blind-safe colours.</summary>
/// <remarks>
/// Colours are from the Okabe–Ito palette (Okabe &amp; Ito 2008, "Color Universal Design"), chosen to stay
/// distinguishable for the common forms of colour blindness.
/// </remarks>
internal static class FigureStyle
{
    public static readonly Color Black = Color.FromHex("#000000");
    public static readonly Color Blue = Color.FromHex("#0072B2");
    public static readonly Color Orange = Color.FromHex("#E69F00");
    public static readonly Color Vermillion = Color.FromHex("#D55E00");
    public static readonly Color SkyBlue = Color.FromHex("#56B4E9");
    public static readonly Color Grey = Color.FromHex("#7F7F7F");

    /// <summary>A new plot with the house style applied.</summary>
    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        PlotFont.Register();
        var plot = new Plot();
        plot.Font.Set(PlotFont.FamilyName);
        plot.Legend.FontName = PlotFont.FamilyName;
        plot.Legend.SetBestFontOnEachRender = false;
        plot.Title(title, 20);
        plot.Axes.Title.Label.Bold = false;
        plot.XLabel(xLabel, 18);
        plot.YLabel(yLabel, 18);
        plot.Axes.Bottom.Label.Bold = false;
        plot.Axes.Left.Label.Bold = false;
        plot.Axes.Bottom.TickLabelStyle.FontSize = 15;
        plot.Axes.Left.TickLabelStyle.FontSize = 15;
        plot.Grid.MajorLineColor = Color.FromHex("#000000").WithAlpha(0.09);
        plot.Grid.MinorLineColor = Color.FromHex("#000000").WithAlpha(0.03);
        plot.Grid.MinorLineWidth = 1;
        plot.Legend.FontSize = 14;
        plot.Legend.OutlineColor = Color.FromHex("#000000").WithAlpha(0.25);
        plot.Legend.ShadowColor = Colors.Transparent;
        return plot;
    }

    /// <summary>Shows the legend in a corner, with the house font.</summary>
    public static void ShowLegend(Plot plot, Alignment where)
    {
        plot.ShowLegend(where);
        plot.Legend.FontName = PlotFont.FamilyName;
        plot.Legend.SetBestFontOnEachRender = false;
    }
}
