namespace Placement.Tessellation;

/// <summary>The shape of the region a tessellation fills.</summary>
public enum DomainKind
{
    /// <summary>An axis-aligned box with solid walls: cells touching a wall are cut by it.</summary>
    Box,

    /// <summary>An axis-aligned box that repeats periodically in all three axes: no cell is cut.</summary>
    PeriodicBox,

    /// <summary>A ball (an isolated body): cells reaching the surface are cut by tangent planes.</summary>
    Sphere,
}
