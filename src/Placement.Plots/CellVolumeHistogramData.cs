namespace Placement.Plots;

/// <summary>Input of <see cref="CellVolumeHistogramFigure"/>: ln(Vρ/m) per point for the point set and for a Poisson (uniform random) baseline.</summary>
/// <remarks>
/// For a perfect placement every cell holds exactly its mass, V ρ = m, so ln(Vρ/m) = 0; the spread measures the
/// cell-volume noise. The baseline is the same statistic for Poisson points (e.g. a measured sample), which
/// for 3-D Poisson–Voronoi cells has std(V/⟨V⟩) ≈ 0.42 (see the project's reference notes, section 9).
/// </remarks>
/// <param name="LogRatio">ln(V_i ρ(x_i) / m_i) for each point of the set (non-finite values are skipped).</param>
/// <param name="PoissonBaseline">The same statistic for a Poisson point set, or an empty array for none.</param>
public sealed record CellVolumeHistogramData(double[] LogRatio, double[] PoissonBaseline)
{
    /// <summary>Figure title.</summary>
    public string Title { get; init; } = "Cell-volume scatter";

    /// <summary>Legend text of the point set.</summary>
    public string Label { get; init; } = "this point set";

    /// <summary>Legend text of the baseline.</summary>
    public string BaselineLabel { get; init; } = "Poisson baseline";

    /// <summary>Number of histogram bins, 5 to 400.</summary>
    public int Bins { get; init; } = 60;
}
