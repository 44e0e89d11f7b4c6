namespace Placement.Points;

/// <summary>Reserved values of <see cref="PointSet.Layer"/> that do not number a sampler's shell or layer.</summary>
/// <remarks>Samplers number their shells or layers from 0; negative values mark points that belong to no layer of the body.</remarks>
public static class PointLayers
{
    /// <summary>A body point from a sampler without layers.</summary>
    public const int None = -1;

    /// <summary>A point of the background medium around the body (not part of the body).</summary>
    public const int Background = -2;
}
