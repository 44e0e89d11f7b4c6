namespace Placement.Tessellation;

/// <summary>Which spatial index a tessellation gathers each cell's neighbours from.</summary>
public enum NeighbourIndexKind
{
    /// <summary>
    /// The uniform grid unless the points crowd it (the mean number of points sharing a point's grid cell exceeds
    /// <see cref="TessellationOptions.GridCrowdingLimit"/>) in a solid box or ball; then the k-d tree.
    /// </summary>
    Automatic,

    /// <summary>A uniform grid scanned row by row: fastest for roughly even sets (density within a few decades).</summary>
    UniformGrid,

    /// <summary>
    /// A k-d tree queried in growing shells like the grid: cost per cell independent of how the density varies
    /// (cusps), about 1.3–1.5× the grid's on even sets. Not available for periodic boxes, which always use the grid.
    /// </summary>
    KdTree,
}
