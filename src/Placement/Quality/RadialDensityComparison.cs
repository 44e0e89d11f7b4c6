namespace Placement.Quality;

/// <summary>Voronoi density against the target in equal-mass radial bins (arrays for plotting).</summary>
/// <remarks>
/// Bin k spans [InnerRadius[k], OuterRadius[k]) with equal profile mass. Target[k] = ΔM/ΔV of the shell (exact,
/// from M(r)); Measured[k] = Σm_i / ΣV_i over the points whose generator lies in the bin; RelativeError[k] =
/// Measured/Target − 1. Densities in mass/length³.
/// </remarks>
/// <param name="InnerRadius">Inner bin edges, length units.</param>
/// <param name="OuterRadius">Outer bin edges, length units.</param>
/// <param name="Target">Shell-mean target density per bin.</param>
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
