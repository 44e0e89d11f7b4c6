namespace Placement.Bodies;

/// <summary>Root-mean-square and largest absolute relative deviation x_i / x_ref,i − 1 over a set of points (dimensionless).</summary>
/// <param name="Rms">√(Σ δ_i² / n); NaN when <paramref name="Count"/> is 0.</param>
/// <param name="Max">max |δ_i|; NaN when <paramref name="Count"/> is 0.</param>
/// <param name="Count">Number of points the statistics cover (points with a defined reference value).</param>
public sealed record RelativeDeviation(double Rms, double Max, int Count)
{
    /// <summary>No points: both statistics NaN.</summary>
    public static RelativeDeviation None { get; } = new(double.NaN, double.NaN, 0);
}
