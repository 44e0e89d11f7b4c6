using Placement.Units;

namespace Placement.Profiles;

/// <summary>Pressure scale heights against radius and the points needed to resolve them (see <see cref="ScaleHeights"/>).</summary>
/// <param name="Units">Units of radii and scale heights (length units).</param>
/// <param name="PressureQuantity">Name of the carried quantity used as pressure.</param>
/// <param name="Count">The point count the <paramref name="CellsPerScaleHeight"/> column was evaluated for.</param>
/// <param name="WantedCellsPerScaleHeight">Cells per H_P the requirement was computed for.</param>
/// <param name="MassFraction">Mass fraction inside which the requirement counts.</param>
/// <param name="Radius">Radii enclosing equal steps of mass, length units.</param>
/// <param name="ScaleHeight">H_P at each radius, length units.</param>
/// <param name="CellsPerScaleHeight">Cells per H_P that <paramref name="Count"/> equal-mass points give.</param>
/// <param name="PointsNeeded">Points needed for the wanted cells per H_P at each radius.</param>
/// <param name="MaxPointsNeeded">The largest of <paramref name="PointsNeeded"/>: the count that resolves H_P everywhere inside the mass fraction.</param>
/// <param name="LimitingRadius">Where that maximum occurs, length units.</param>
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
    double LimitingRadius);
