namespace Placement.Tessellation;

/// <summary>
/// Neighbour codes of faces that are not shared with another generator: the domain's walls. Faces shared with a
/// generator carry its index (≥ 0; in a periodic box possibly the cell's own index, for its own image).
/// </summary>
public static class CellFaceCodes
{
    /// <summary>The box wall x = min.</summary>
    public const int WallMinX = -1;

    /// <summary>The box wall x = max.</summary>
    public const int WallMaxX = -2;

    /// <summary>The box wall y = min.</summary>
    public const int WallMinY = -3;

    /// <summary>The box wall y = max.</summary>
    public const int WallMaxY = -4;

    /// <summary>The box wall z = min.</summary>
    public const int WallMinZ = -5;

    /// <summary>The box wall z = max.</summary>
    public const int WallMaxZ = -6;

    /// <summary>A tangent plane of a ball domain's surface.</summary>
    public const int SphereSurface = -7;
}
