using System.Globalization;
using ScottPlot;

namespace Placement.Plots;

/// <summary>Figure (d): points of a thin slab |z| &lt; h seen from +z, coloured by a per-point value, with a colour bar.</summary>
/// <remarks>
/// Values are quantised into <see cref="ColorLevels"/> levels and each level is drawn as one marker layer
/// (cost linear in the number of shown points). For diverging maps the levels nearest zero are drawn first so
/// that the large errors are on top. Both axes use the same scale so the body keeps its shape. Values beyond
/// the colour range take the end colours.
/// </remarks>
public static class SliceScatterFigure
{
    /// <summary>Number of colour levels.</summary>
    public const int ColorLevels = 64;

    /// <summary>Builds the figure.</summary>
    /// <param name="data">Positions, values and slab half-width.</param>
    /// <returns>A ScottPlot plot; save it with <see cref="FigureFile.Save"/>.</returns>
    /// <exception cref="ArgumentException">Arrays differ in length, the slab half-width or colour limit is not positive, or no point lies in the slab.</exception>
    public static Plot Create(SliceScatterData data)
    {
        ArgumentNullException.ThrowIfNull(data);
        PlotGuards.SameLength(data.X, nameof(data.X), data.Y, nameof(data.Y));
        PlotGuards.SameLength(data.X, nameof(data.X), data.Z, nameof(data.Z));
        PlotGuards.SameLength(data.X, nameof(data.X), data.Value, nameof(data.Value));
        if (!(data.SlabHalfWidth > 0 && double.IsFinite(data.SlabHalfWidth)))
            throw new ArgumentException($"SlabHalfWidth is {data.SlabHalfWidth}; expected a positive length.", nameof(data));
        if (data.ColorLimit is { } cl && !(cl > 0 && double.IsFinite(cl)))
            throw new ArgumentException($"ColorLimit is {cl}; expected a positive number.", nameof(data));

        var shown = new List<int>();
        for (int i = 0; i < data.X.Length; i++)
            if (Math.Abs(data.Z[i]) < data.SlabHalfWidth && double.IsFinite(data.Value[i]) && double.IsFinite(data.X[i]) && double.IsFinite(data.Y[i]))
                shown.Add(i);
        if (shown.Count == 0)
            throw new ArgumentException($"No point lies in the slab |z| < {data.SlabHalfWidth.ToString(CultureInfo.InvariantCulture)}; widen it.", nameof(data));

        var scale = Scale(data, shown);
        string length = UnitLabel.Pretty(data.Units.LengthUnitName);
        string title = data.Title ?? $"Slice |z| < {data.SlabHalfWidth.ToString("G3", CultureInfo.InvariantCulture)} {length} ({shown.Count.ToString(CultureInfo.InvariantCulture)} points)";
        var plot = FigureStyle.NewPlot(title, UnitLabel.Axis("x", data.Units.LengthUnitName), UnitLabel.Axis("y", data.Units.LengthUnitName));

        var levelX = new List<double>[ColorLevels];
        var levelY = new List<double>[ColorLevels];
        for (int l = 0; l < ColorLevels; l++) { levelX[l] = []; levelY[l] = []; }
        foreach (int i in shown)
        {
            int level = Math.Min(ColorLevels - 1, (int)(scale.Fraction(data.Value[i]) * ColorLevels));
            levelX[level].Add(data.X[i]);
            levelY[level].Add(data.Y[i]);
        }
        float size = shown.Count <= 500 ? 7 : shown.Count <= 5_000 ? 4.5f : shown.Count <= 50_000 ? 2.5f : 1.5f;
        foreach (int level in DrawOrder(data.Diverging))
        {
            if (levelX[level].Count == 0) continue;
            var color = scale.Colormap.GetColor((level + 0.5) / ColorLevels);
            var markers = plot.Add.Markers(levelX[level].ToArray(), levelY[level].ToArray(), MarkerShape.FilledCircle, size, color);
            markers.LegendText = "";
        }

        var bar = plot.Add.ColorBar(scale, Edge.Right);
        bar.Label = UnitLabel.Axis(data.ValueLabel, data.ValueUnit);
        bar.LabelStyle.FontName = PlotFont.FamilyName;
        bar.LabelStyle.FontSize = 16;
        bar.LabelStyle.Bold = false;
        bar.Axis.TickLabelStyle.FontName = PlotFont.FamilyName;
        bar.Axis.TickLabelStyle.FontSize = 14;
        bar.Width = 22;
        LinearAxis.Apply(bar.Axis);
        LinearAxis.Apply(plot.Axes.Bottom);
        LinearAxis.Apply(plot.Axes.Left);

        plot.Axes.AutoScale();
        plot.Axes.Margins(0.04, 0.04);
        plot.Axes.SquareUnits();
        return plot;
    }

    private static ColorScale Scale(SliceScatterData data, List<int> shown)
    {
        var magnitudes = new double[shown.Count];
        for (int k = 0; k < shown.Count; k++)
            magnitudes[k] = data.Diverging ? Math.Abs(data.Value[shown[k]]) : data.Value[shown[k]];
        Array.Sort(magnitudes);
        double limit = data.ColorLimit ?? magnitudes[(int)Math.Floor(0.98 * (magnitudes.Length - 1))];
        if (data.Diverging)
        {
            if (!(limit > 0)) limit = 1e-3;
            return new ColorScale(new DivergingColormap(), -limit, limit);
        }
        double low = data.ColorLimit is null ? magnitudes[(int)Math.Floor(0.02 * (magnitudes.Length - 1))] : 0;
        if (!(limit > low)) limit = low + Math.Max(1e-12, Math.Abs(low) * 1e-3);
        return new ColorScale(new ScottPlot.Colormaps.Viridis(), low, limit);
    }

    /// <summary>Diverging: from the centre outwards (extremes drawn last, on top); sequential: low to high.</summary>
    private static IEnumerable<int> DrawOrder(bool diverging)
    {
        if (!diverging)
        {
            for (int l = 0; l < ColorLevels; l++) yield return l;
            yield break;
        }
        for (int d = 0; d < ColorLevels / 2; d++)
        {
            yield return ColorLevels / 2 - 1 - d;
            yield return ColorLevels / 2 + d;
        }
    }
}
