using System.Globalization;

namespace Placement.Tessellation;

/// <summary>The region a Voronoi tessellation fills: a box (solid or periodic) or a ball.</summary>
/// <remarks>
/// All lengths are in the length units of the points. Boxes are exact: cut cells are clipped by the wall planes.
/// A ball is approximated by tangent planes added where a cell pokes out (see <see cref="TessellationOptions.SphereTolerance"/>):
/// every cut cell then contains its exact part of the ball and lies inside the ball of radius R(1 + δ), so the
/// volumes sum to between (4/3)πR³ and (4/3)πR³(1 + δ)³.
/// </remarks>
public sealed class TessellationDomain
{
    private TessellationDomain(DomainKind kind, double x0, double y0, double z0, double x1, double y1, double z1, double radius)
    {
        Kind = kind;
        MinX = x0; MinY = y0; MinZ = z0; MaxX = x1; MaxY = y1; MaxZ = z1;
        Radius = radius;
    }

    /// <summary>Which shape this is.</summary>
    public DomainKind Kind { get; }

    /// <summary>Lower x of the box, or of the ball's bounding cube; length units.</summary>
    public double MinX { get; }

    /// <summary>Lower y, length units.</summary>
    public double MinY { get; }

    /// <summary>Lower z, length units.</summary>
    public double MinZ { get; }

    /// <summary>Upper x, length units.</summary>
    public double MaxX { get; }

    /// <summary>Upper y, length units.</summary>
    public double MaxY { get; }

    /// <summary>Upper z, length units.</summary>
    public double MaxZ { get; }

    /// <summary>Ball radius (0 for boxes), length units.</summary>
    public double Radius { get; }

    /// <summary>Ball centre x (box centre for boxes).</summary>
    public double CenterX => 0.5 * (MinX + MaxX);

    /// <summary>Ball centre y.</summary>
    public double CenterY => 0.5 * (MinY + MaxY);

    /// <summary>Ball centre z.</summary>
    public double CenterZ => 0.5 * (MinZ + MaxZ);

    /// <summary>Exact volume of the region, length³ (for a ball (4/3)πR³, not its polyhedral approximation).</summary>
    public double Volume => Kind == DomainKind.Sphere
        ? 4.0 / 3.0 * Math.PI * Radius * Radius * Radius
        : (MaxX - MinX) * (MaxY - MinY) * (MaxZ - MinZ);

    /// <summary>A box with solid walls.</summary>
    /// <exception cref="ArgumentException">The box is empty or not finite.</exception>
    public static TessellationDomain Box(double minX, double minY, double minZ, double maxX, double maxY, double maxZ)
    {
        CheckBox(minX, minY, minZ, maxX, maxY, maxZ);
        return new TessellationDomain(DomainKind.Box, minX, minY, minZ, maxX, maxY, maxZ, 0);
    }

    /// <summary>A box periodic in x, y and z (points must lie in [min, max)).</summary>
    /// <exception cref="ArgumentException">The box is empty or not finite.</exception>
    public static TessellationDomain PeriodicBox(double minX, double minY, double minZ, double maxX, double maxY, double maxZ)
    {
        CheckBox(minX, minY, minZ, maxX, maxY, maxZ);
        return new TessellationDomain(DomainKind.PeriodicBox, minX, minY, minZ, maxX, maxY, maxZ, 0);
    }

    /// <summary>The unit cube [0, 1]³, solid or periodic.</summary>
    public static TessellationDomain UnitCube(bool periodic = false) =>
        periodic ? PeriodicBox(0, 0, 0, 1, 1, 1) : Box(0, 0, 0, 1, 1, 1);

    /// <summary>A ball of the given centre and radius (points must lie strictly inside).</summary>
    /// <exception cref="ArgumentException">The radius is not finite and positive or the centre is not finite.</exception>
    public static TessellationDomain Sphere(double centerX, double centerY, double centerZ, double radius)
    {
        if (!(radius > 0) || !double.IsFinite(radius) || !double.IsFinite(centerX) || !double.IsFinite(centerY) || !double.IsFinite(centerZ))
            throw new ArgumentException($"Sphere centre ({centerX}, {centerY}, {centerZ}) must be finite and radius {radius} finite and > 0.", nameof(radius));
        return new TessellationDomain(DomainKind.Sphere, centerX - radius, centerY - radius, centerZ - radius,
            centerX + radius, centerY + radius, centerZ + radius, radius);
    }

    /// <summary>True when (x, y, z) is a valid generator position for this domain.</summary>
    public bool Contains(double x, double y, double z) => Kind switch
    {
        DomainKind.Sphere => Square(x - CenterX) + Square(y - CenterY) + Square(z - CenterZ) < Radius * Radius,
        DomainKind.PeriodicBox => x >= MinX && x < MaxX && y >= MinY && y < MaxY && z >= MinZ && z < MaxZ,
        _ => x >= MinX && x <= MaxX && y >= MinY && y <= MaxY && z >= MinZ && z <= MaxZ,
    };

    /// <inheritdoc />
    public override string ToString() => Kind == DomainKind.Sphere
        ? string.Create(CultureInfo.InvariantCulture, $"sphere(centre=({CenterX}, {CenterY}, {CenterZ}), R={Radius})")
        : string.Create(CultureInfo.InvariantCulture, $"{(Kind == DomainKind.Box ? "box" : "periodic box")}([{MinX}, {MaxX}]×[{MinY}, {MaxY}]×[{MinZ}, {MaxZ}])");

    private static double Square(double v) => v * v;

    private static void CheckBox(double minX, double minY, double minZ, double maxX, double maxY, double maxZ)
    {
        if (!(maxX > minX && maxY > minY && maxZ > minZ) || !double.IsFinite(maxX - minX) || !double.IsFinite(maxY - minY) || !double.IsFinite(maxZ - minZ))
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Box [{minX}, {maxX}]×[{minY}, {maxY}]×[{minZ}, {maxZ}] must be finite with max > min in every axis."));
    }
}
