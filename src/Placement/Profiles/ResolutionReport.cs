using Placement.Units;

namespace Placement.Profiles;

/// <summary>Pressure scale heights against radius and the points needed to resolve them (see <see cref="ScaleHeights"/>).</summary>
/// <remarks>Made either from the profile alone for a planned count (<see cref="ScaleHeights.Resolution"/>, spacing
/// (M/(Nρ))^(1/3)) or from placed points' own volumes (<see cref="ScaleHeights.PlacedResolution"/>, one row per radial bin).</remarks>
/// <param name="Units">Units of radii and scale heights (length units).</param>
/// <param name="PressureQuantity">Name of the carried quantity used as pressure.</param>
/// <param name="Count">The point count the <paramref name="CellsPerScaleHeight"/> column was evaluated for.</param>
/// <param name="WantedCellsPerScaleHeight">Cells per H_P the requirement was computed for (NaN when no threshold was set).</param>
/// <param name="MassFraction">Mass fraction inside which the requirement counts.</param>
/// <param name="Radius">Radii enclosing equal steps of mass, length units.</param>
/// <param name="ScaleHeight">H_P at each radius, length units.</param>
/// <param name="CellsPerScaleHeight">Cells per H_P that <paramref name="Count"/> equal-mass points give.</param>
/// <param name="PointsNeeded">Points needed for the wanted cells per H_P at each radius (NaN without a threshold).</param>
/// <param name="MaxPointsNeeded">The largest of <paramref name="PointsNeeded"/>: the count that resolves H_P everywhere inside the mass fraction (and outside <see cref="InnerRadius"/>).</param>
/// <param name="LimitingRadius">Where the fewest cells per H_P (hence the largest need) occur, length units.</param>
public sealed record ResolutionReport(
    UnitSystem Units,
    string PressureQuantity,
    long Count,
    double WantedCellsPerScaleHeight,
    double MassFraction,
    double[] Radius,
    double[] ScaleHeight,
    double[] CellsPerScaleHeight,
    double[] PointsNeeded,
    double MaxPointsNeeded,
    double LimitingRadius)
{
    /// <summary>Radius inside which the requirement does not count (e.g. a softened core), length units; 0 by default.</summary>
    public double InnerRadius { get; init; }

    /// <summary>Local point spacing Δ at each row (edge of a cube of the volume per point), length units; null when not recorded.</summary>
    public double[]? Spacing { get; init; }

    /// <summary>The fewest cells per H_P over the rows (NaN rows ignored; NaN when there are none).</summary>
    public double MinimumCellsPerScaleHeight
    {
        get
        {
            double min = double.NaN;
            foreach (double c in CellsPerScaleHeight)
                if (!double.IsNaN(c) && !(c >= min)) min = c;
            return min;
        }
    }
}
