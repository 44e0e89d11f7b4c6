using ScottPlot;

namespace Placement.Plots;

/// <summary>A colour map over a fixed value range, the source ScottPlot's colour bar reads.</summary>
internal sealed class ColorScale(IColormap colormap, double min, double max) : IHasColorAxis
{
    public IColormap Colormap { get; set; } = colormap;

    public double Min { get; } = min;

    public double Max { get; } = max;

    public ScottPlot.Range GetRange() => new(Min, Max);

    /// <summary>Position of <paramref name="value"/> in [0, 1] (clamped).</summary>
    public double Fraction(double value) => Math.Clamp((value - Min) / (Max - Min), 0, 1);
}
