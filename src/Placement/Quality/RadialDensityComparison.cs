namespace Placement.Quality;

/// <summary>Voronoi density against the target in equal-mass radial bins (arrays for plotting).</summary>
/// <remarks>
/// Bin k spans [InnerRadius[k], OuterRadius[k]) with equal profile mass and holds the cells whose generator lies
/// in it. Measured[k] = Σm_i / ΣV_i over those cells; Target[k] = Σ ∫_i ρ dV / ΣV_i, the target density averaged
/// over exactly the same cells (cell masses by the tessellation's quadrature), so the comparison does not
/// depend on where the bin edges fall between the layers of a shell placement; RelativeError[k] =
/// Measured/Target − 1. Densities in mass/length³.
/// </remarks>
/// <param name="InnerRadius">Inner bin edges, length units.</param>
/// <param name="OuterRadius">Outer bin edges, length units.</param>
/// <param name="Target">Target density averaged over the bin's cells.</param>
/// <param name="Measured">Voronoi density per bin (NaN for an empty bin).</param>
/// <param name="RelativeError">Measured / Target − 1 per bin.</param>
/// <param name="Points">Points per bin.</param>
/// <param name="RmsError">Root mean square of the relative errors over non-empty bins.</param>
/// <param name="MaxError">Largest |relative error| over non-empty bins.</param>
public sealed record RadialDensityComparison(
    double[] InnerRadius,
    double[] OuterRadius,
    double[] Target,
    double[] Measured,
    double[] RelativeError,
    int[] Points,
    double RmsError,
    double MaxError);
