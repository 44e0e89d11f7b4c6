using Placement.Units;

namespace Placement.Plots;

/// <summary>Input of <see cref="EnclosedMassErrorFigure"/>: the relative error of the enclosed mass at a set of radii.</summary>
/// <param name="Radius">Radii, length units, &gt; 0 (non-positive values are skipped).</param>
/// <param name="RelativeError">(M_points(&lt; r) − M_target(&lt; r)) / M_target(&lt; r) at each radius, a pure number (not percent).</param>
/// <param name="Units">Units of the radii (for the axis label).</param>
public sealed record EnclosedMassErrorData(double[] Radius, double[] RelativeError, UnitSystem Units)
{
    /// <summary>Figure title.</summary>
    public string Title { get; init; } = "Enclosed-mass error";

    /// <summary>Y-axis label (the plotted quantity is always shown in percent).</summary>
    public string YLabel { get; init; } = "Enclosed-mass error ΔM/M [%]";

    /// <summary>Optional tolerance (a pure number, e.g. 0.01) drawn as a shaded ±band; null for none.</summary>
    public double? Tolerance { get; init; }

    /// <summary>Legend text of the error curve.</summary>
    public string Label { get; init; } = "points vs target";
}
