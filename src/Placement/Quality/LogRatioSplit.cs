namespace Placement.Quality;

/// <summary>
/// ln(V_i ρ_target(r_i) / m_i) summarised separately for the body and the surface layer, split the same way as the
/// SPH comparison: a cell belongs to the surface when the kernel support of its generator reaches the edge of the point
/// distribution (|x_i| + H_i ≥ R_edge, R_edge the smaller of the profile radius and the outermost point's radius).
/// </summary>
/// <remarks>
/// H_i is the SPH support solved by the SPH check when it ran; otherwise the target support
/// H_i = (3 N_H m_i / (4π ρ_target(r_i)))^{1/3} for <see cref="NeighbourNumber"/>. Surface cells are cut by the domain
/// or lie within a kernel radius of it: where the density falls steeply toward the surface, ρ_target at the generator
/// differs from the cell's mean density by a factor of order one, so their ln(Vρ/m) is large whatever the placement.
/// The overall figure (<see cref="QualityReport.LogRatio"/>) keeps both. Because the kernel criterion can miss the
/// outermost layer when it lies far inside the profile radius (a steep envelope holding little mass: the last shell's
/// cells then reach from it to R), the cells cut by the domain boundary are summarised apart as well.
/// </remarks>
/// <param name="SupportSource">"sph" when the SPH supports defined the split, "target" when the target supports did.</param>
/// <param name="NeighbourNumber">N_H of the supports.</param>
/// <param name="BodyCells">Cells in the body (|x| + H &lt; R_edge, ρ_target &gt; 0).</param>
/// <param name="BodyMean">Mean ln(Vρ/m) over the body cells (NaN when there is none).</param>
/// <param name="BodyStandardDeviation">Standard deviation (population form) of ln(Vρ/m) over the body cells.</param>
/// <param name="SurfaceCells">Cells in the surface layer (|x| + H ≥ R_edge, ρ_target &gt; 0).</param>
/// <param name="SurfaceMean">Mean ln(Vρ/m) over the surface cells.</param>
/// <param name="SurfaceStandardDeviation">Standard deviation of ln(Vρ/m) over the surface cells.</param>
/// <param name="CutCells">Cells cut by the domain boundary (the outermost layer).</param>
/// <param name="CutMean">Mean ln(Vρ/m) over the cut cells.</param>
/// <param name="CutStandardDeviation">Standard deviation of ln(Vρ/m) over the cut cells.</param>
/// <param name="UncutStandardDeviation">Standard deviation of ln(Vρ/m) over every other cell.</param>
/// <param name="EdgeRadius">R_edge of the split, length units (NaN when not recorded).</param>
public sealed record LogRatioSplit(
    string SupportSource,
    double NeighbourNumber,
    int BodyCells,
    double BodyMean,
    double BodyStandardDeviation,
    int SurfaceCells,
    double SurfaceMean,
    double SurfaceStandardDeviation,
    int CutCells,
    double CutMean,
    double CutStandardDeviation,
    double UncutStandardDeviation,
    double EdgeRadius = double.NaN);
