using Placement.Units;

namespace Placement.Plots;

/// <summary>Input of <see cref="DensityProfileFigure"/>: the target ρ(r) as a curve and the measured density in radial bins.</summary>
/// <param name="TargetRadius">Radii of the target curve, length units, &gt; 0 (non-positive values are skipped).</param>
/// <param name="TargetDensity">Target density at <paramref name="TargetRadius"/>, mass/length³.</param>
/// <param name="MeasuredRadius">Bin radii of the measurement (e.g. mass-weighted bin centres), length units.</param>
/// <param name="MeasuredDensity">Measured density per bin (e.g. bin mass / summed cell volume), mass/length³.</param>
/// <param name="MeasuredLower">Lower end of each bin's uncertainty (e.g. 16th percentile), or null for none.</param>
/// <param name="MeasuredUpper">Upper end of each bin's uncertainty (e.g. 84th percentile), or null for none.</param>
/// <param name="Units">Units of radii and densities (for the axis labels).</param>
public sealed record DensityProfileData(
    double[] TargetRadius,
    double[] TargetDensity,
    double[] MeasuredRadius,
    double[] MeasuredDensity,
    double[]? MeasuredLower,
    double[]? MeasuredUpper,
    UnitSystem Units)
{
    /// <summary>Figure title.</summary>
    public string Title { get; init; } = "Density profile";

    /// <summary>Legend text of the target curve.</summary>
    public string TargetLabel { get; init; } = "target ρ(r)";

    /// <summary>Legend text of the measured points.</summary>
    public string MeasuredLabel { get; init; } = "measured";
}
