namespace Placement.Statistics;

/// <summary>A binned power spectrum S(k) of a point set in a periodic cube.</summary>
/// <param name="WaveNumbers">Bin centres k = 2π b / L, in 1/length.</param>
/// <param name="Power">Mean S(k) over the modes of each bin (1 for a Poisson set; NaN for an empty bin).</param>
/// <param name="ModeCounts">Independent modes averaged in each bin (half of ±k pairs).</param>
/// <param name="PointCount">Number of points measured.</param>
/// <param name="BoxSize">Side of the periodic cube, length units.</param>
public sealed record PowerSpectrumResult(double[] WaveNumbers, double[] Power, int[] ModeCounts, int PointCount, double BoxSize);
