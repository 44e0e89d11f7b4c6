namespace Placement.Samplers.Glass;

/// <summary>The plan of a <see cref="GlassSampler"/>: the final positions, computed once, handed out per batch.</summary>
/// <remarks>The selection of the N points nearest the centre and the rank stretch are global operations, so the
/// plan holds the positions (24 bytes per point) and <see cref="GlassSampler.Fill"/> copies each batch.</remarks>
public sealed class GlassPlan : SamplingPlan
{
    internal GlassPlan(int count, IReadOnlyList<PlannedBatch> batches, double[] x, double[] y, double[] z, int tilePoints)
        : base(count, batches)
    {
        X = x;
        Y = y;
        Z = z;
        TilePoints = tilePoints;
    }

    internal double[] X { get; }

    internal double[] Y { get; }

    internal double[] Z { get; }

    /// <summary>Points in the glass tile that was repeated.</summary>
    public int TilePoints { get; }
}
