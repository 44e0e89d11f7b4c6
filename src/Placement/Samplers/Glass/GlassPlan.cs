namespace Placement.Samplers.Glass;

/// <summary>The plan of a <see cref="GlassSampler"/>: the final positions, selected and stretched once, handed out per batch.</summary>
public sealed class GlassPlan : PrecomputedPlan
{
    internal GlassPlan(double[] x, double[] y, double[] z, double massPerPoint, int tilePoints)
        : base(x, y, z, massPerPoint) => TilePoints = tilePoints;

    /// <summary>Points in the glass tile that was repeated.</summary>
    public int TilePoints { get; }
}
