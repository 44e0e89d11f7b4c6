namespace Placement.Samplers;

/// <summary>
/// A plan whose positions were computed whole in <see cref="IPointSampler.Plan"/> (samplers whose work is global:
/// selection, sorting, relaxation); <see cref="IPointSampler.Fill"/> only copies each batch out of it.
/// </summary>
/// <remarks>Holds the positions (24 bytes per point) until the point set is filled; batches of 65,536 points.</remarks>
public class PrecomputedPlan : SamplingPlan
{
    private const int BatchSize = 65_536;

    /// <summary>Wraps positions of equal-mass points (each <paramref name="massPerPoint"/>), in the profile's length units.</summary>
    /// <exception cref="ArgumentException">The arrays differ in length.</exception>
    protected PrecomputedPlan(double[] x, double[] y, double[] z, double massPerPoint)
        : base(x.Length, EqualBatches(x.Length, massPerPoint))
    {
        if (y.Length != x.Length || z.Length != x.Length) throw new ArgumentException("x, y and z must have the same length.", nameof(y));
        X = x;
        Y = y;
        Z = z;
    }

    internal double[] X { get; }

    internal double[] Y { get; }

    internal double[] Z { get; }

    /// <summary>Copies batch <paramref name="batch"/> into <paramref name="output"/>.</summary>
    public void CopyBatch(int batch, PointSpans output)
    {
        var b = Batches[batch];
        X.AsSpan(b.Start, b.Count).CopyTo(output.X);
        Y.AsSpan(b.Start, b.Count).CopyTo(output.Y);
        Z.AsSpan(b.Start, b.Count).CopyTo(output.Z);
    }

    private static List<PlannedBatch> EqualBatches(int n, double mass)
    {
        var batches = new List<PlannedBatch>();
        for (int s = 0; s < n; s += BatchSize) batches.Add(new PlannedBatch(s, Math.Min(BatchSize, n - s), -1, mass, double.NaN));
        return batches;
    }
}
