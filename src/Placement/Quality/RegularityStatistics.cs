namespace Placement.Quality;

/// <summary>
/// Cell regularity as a moving-mesh code sees it, over the cells not cut by the domain boundary.
/// </summary>
/// <param name="Cells">Cells counted (not cut by the domain).</param>
/// <param name="OffsetMean">Mean of d/R (generator–centroid distance over cell radius (3V/4π)^{1/3}).</param>
/// <param name="OffsetP95">95th percentile of d/R.</param>
/// <param name="OffsetMax">Largest d/R.</param>
/// <param name="FaceAngleMean">Mean of the per-cell largest √(A_f/π)/h_f.</param>
/// <param name="FaceAngleP95">95th percentile of it.</param>
/// <param name="FaceAngleMax">Largest value.</param>
/// <param name="OffsetThreshold">Threshold used for d/R.</param>
/// <param name="FaceAngleThreshold">Threshold used for the face-angle ratio.</param>
/// <param name="FractionOffset">Fraction of cells above the offset threshold.</param>
/// <param name="FractionFaceAngle">Fraction above the face-angle threshold.</param>
/// <param name="FractionCorrected">Fraction above either: the cells a moving-mesh code would start correcting.</param>
/// <param name="MeanFaces">Mean number of faces.</param>
public sealed record RegularityStatistics(
    int Cells,
    double OffsetMean,
    double OffsetP95,
    double OffsetMax,
    double FaceAngleMean,
    double FaceAngleP95,
    double FaceAngleMax,
    double OffsetThreshold,
    double FaceAngleThreshold,
    double FractionOffset,
    double FractionFaceAngle,
    double FractionCorrected,
    double MeanFaces);
