namespace Placement.Quality;

/// <summary>Distribution of ln(V_i ρ_target(r_i) / m_i) over the cells inside the profile.</summary>
/// <param name="Count">Cells with ρ_target &gt; 0 that entered the statistics.</param>
/// <param name="Mean">Mean of ln(Vρ/m).</param>
/// <param name="StandardDeviation">Standard deviation of ln(Vρ/m) (population form).</param>
/// <param name="RootMeanSquare">√⟨ln²⟩.</param>
/// <param name="Percentiles">Percentile levels (e.g. 1, 5, 25, 50, 75, 95, 99).</param>
/// <param name="PercentileValues">ln(Vρ/m) at those levels (nearest-rank on sorted values).</param>
/// <param name="MaxAbsolute">Largest |ln(Vρ/m)|.</param>
/// <param name="Worst">The cells with the largest |ln(Vρ/m)|, worst first.</param>
public sealed record LogRatioStatistics(
    int Count,
    double Mean,
    double StandardDeviation,
    double RootMeanSquare,
    double[] Percentiles,
    double[] PercentileValues,
    double MaxAbsolute,
    WorstCell[] Worst);
