namespace Placement.Quality;

/// <summary>SPH kernel density against the target: bias and scatter of ρ_SPH/ρ_target per equal-mass radial bin.</summary>
/// <remarks>
/// ρ_SPH from <see cref="Sph.SphDensity.Compute"/> (self-consistent supports for the neighbour number). The "body" summary takes
/// every point whose kernel support lies inside the point distribution (|x| + H &lt; R_edge, with R_edge the smaller of the
/// profile radius and the outermost point's radius); the "surface" summary the rest, whose kernels are truncated by
/// the surface and therefore read low by construction. For a steep envelope that holds less than a layer of points the
/// outermost points lie well inside R; measured from R the surface would then hold none of them, and the outermost
/// layers of points (the "outermost shells"), whose kernels see vacuum beyond them, would count as body.
/// </remarks>
/// <param name="Kernel">Kernel name, e.g. <c>wendland-c2</c>.</param>
/// <param name="NeighbourNumber">N_H the supports were solved for.</param>
/// <param name="InnerRadius">Inner bin edges, length units.</param>
/// <param name="OuterRadius">Outer bin edges, length units.</param>
/// <param name="Bias">Mean of ρ_SPH/ρ_target − 1 per bin (NaN for an empty bin).</param>
/// <param name="Scatter">Standard deviation of ρ_SPH/ρ_target per bin.</param>
/// <param name="Points">Points per bin.</param>
/// <param name="BodyPoints">Points whose support lies inside the profile.</param>
/// <param name="BodyBias">Mean of ρ_SPH/ρ_target − 1 over the body points.</param>
/// <param name="BodyRmsError">rms of ρ_SPH/ρ_target − 1 over the body points.</param>
/// <param name="SurfacePoints">Points whose support crosses the surface.</param>
/// <param name="SurfaceBias">Mean of ρ_SPH/ρ_target − 1 over the surface points.</param>
/// <param name="SurfaceRmsError">rms of ρ_SPH/ρ_target − 1 over the surface points.</param>
/// <param name="SmoothedBias">Mean of ρ_SPH/ρ̃ − 1 per bin, ρ̃ the target seen through the same kernel and support
/// (<see cref="Sph.KernelSmoothedProfile"/>): the placement's own error without the kernel's smoothing bias; null when not computed.</param>
/// <param name="BodySmoothedBias">Mean of ρ_SPH/ρ̃ − 1 over the body points (NaN when not computed).</param>
/// <param name="BodySmoothedRmsError">rms of ρ_SPH/ρ̃ − 1 over the body points (NaN when not computed).</param>
/// <param name="SurfaceSmoothedRmsError">rms of ρ_SPH/ρ̃ − 1 over the surface points, whose kernels ρ̃ truncates the same way (NaN when not computed).</param>
/// <param name="EdgeRadius">R_edge of the body/surface split, length units (NaN when not recorded).</param>
/// <param name="ShellBodyPoints">For a set on shells (every point's layer a shell at one radius, at least three shells): the points
/// of all shells but the outermost two; 0 otherwise. The split by shells (the outermost two excluded and reported apart) is the
/// usual way to quote a shell placement's body; the kernel split above is the one every set has.</param>
/// <param name="ShellBodyRmsError">rms of ρ_SPH/ρ_target − 1 over <paramref name="ShellBodyPoints"/> (NaN when not a shell set).</param>
/// <param name="ShellBodySmoothedRmsError">rms of ρ_SPH/ρ̃ − 1 over the same points (NaN when not a shell set or ρ̃ not computed).</param>
/// <param name="OuterShellPoints">Points of the outermost two shells (0 when not a shell set).</param>
/// <param name="OuterShellRmsError">rms of ρ_SPH/ρ_target − 1 over the outermost two shells (NaN when not a shell set).</param>
public sealed record SphDensityComparison(
    string Kernel,
    double NeighbourNumber,
    double[] InnerRadius,
    double[] OuterRadius,
    double[] Bias,
    double[] Scatter,
    int[] Points,
    int BodyPoints,
    double BodyBias,
    double BodyRmsError,
    int SurfacePoints,
    double SurfaceBias,
    double SurfaceRmsError,
    double[]? SmoothedBias = null,
    double BodySmoothedBias = double.NaN,
    double BodySmoothedRmsError = double.NaN,
    double SurfaceSmoothedRmsError = double.NaN,
    double EdgeRadius = double.NaN,
    int ShellBodyPoints = 0,
    double ShellBodyRmsError = double.NaN,
    double ShellBodySmoothedRmsError = double.NaN,
    int OuterShellPoints = 0,
    double OuterShellRmsError = double.NaN);
