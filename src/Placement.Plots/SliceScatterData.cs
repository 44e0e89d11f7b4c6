using Placement.Units;

namespace Placement.Plots;

/// <summary>Input of <see cref="SliceScatterFigure"/>: point positions and one value per point, of which a thin slab |z| &lt; h is shown.</summary>
/// <param name="X">x coordinates, length units.</param>
/// <param name="Y">y coordinates, length units.</param>
/// <param name="Z">z coordinates, length units.</param>
/// <param name="Value">The value that colours each point (e.g. cell-volume error ln(Vρ/m)).</param>
/// <param name="SlabHalfWidth">h: points with |z| &lt; h are shown, length units, &gt; 0.</param>
/// <param name="Units">Units of the coordinates (for labels).</param>
public sealed record SliceScatterData(double[] X, double[] Y, double[] Z, double[] Value, double SlabHalfWidth, Placement.Units.UnitSystem Units)
{
    /// <summary>Figure title; null for an automatic "Slice |z| &lt; h (N points)".</summary>
    public string? Title { get; init; }

    /// <summary>Colour-bar label (quantity name).</summary>
    public string ValueLabel { get; init; } = "Cell-volume error ln(V ρ / m)";

    /// <summary>Unit of the value (as written to files; <c>1</c> for pure numbers).</summary>
    public string ValueUnit { get; init; } = "1";

    /// <summary>True for signed values centred on zero (blue–grey–red, symmetric range); false for a sequential map.</summary>
    public bool Diverging { get; init; } = true;

    /// <summary>Colour range limit: ±limit when diverging, else [0, limit]; null to use the 98th percentile of the shown values.</summary>
    public double? ColorLimit { get; init; }
}
