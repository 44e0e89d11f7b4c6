using Placement.Points;
using Placement.Tessellation;

namespace Placement.Bodies.Background;

/// <summary>The placed background medium: its points, their Voronoi cell volumes, the box and the spacing it used.</summary>
/// <remarks>
/// Coordinates are relative to the body's centre (the origin of the body's points) until the caller moves everything
/// into a common frame. Points: layer <see cref="PointLayers.Background"/>, target density ρ_bg, mass ∫ρ dV over the
/// part of their Voronoi cell (body and background tessellated together in the box) that lies outside the body radius.
/// </remarks>
public sealed class BackgroundPoints
{
    internal BackgroundPoints(PointSet points, double[] cellVolume, TessellationDomain domain, BackgroundSettings settings,
        double bodyRadius, double surfaceSpacing, double innerRadius, double outerSpacing, int shellCount)
    {
        Points = points;
        CellVolume = cellVolume;
        Domain = domain;
        Settings = settings;
        BodyRadius = bodyRadius;
        SurfaceSpacing = surfaceSpacing;
        InnerRadius = innerRadius;
        OuterSpacing = outerSpacing;
        ShellCount = shellCount;
    }

    /// <summary>The background points (layer −2, target density ρ_bg, masses from their cells).</summary>
    public PointSet Points { get; }

    /// <summary>Volume of each background point's Voronoi cell (body and background tessellated together in the box), length³.</summary>
    public double[] CellVolume { get; }

    /// <summary>The box (solid or periodic) the medium fills, relative to the body's centre.</summary>
    public TessellationDomain Domain { get; }

    /// <summary>The settings it was placed with.</summary>
    public BackgroundSettings Settings { get; }

    /// <summary>Radius R of the body (the hole), length units.</summary>
    public double BodyRadius { get; }

    /// <summary>Spacing of the first shell (measured from the body's outermost points unless given), length units.</summary>
    public double SurfaceSpacing { get; }

    /// <summary>Radius of the first background shell, length units (always &gt; <see cref="BodyRadius"/>).</summary>
    public double InnerRadius { get; }

    /// <summary>Spacing of the last shell that still has points in the box, length units.</summary>
    public double OuterSpacing { get; }

    /// <summary>Number of shells that contributed points.</summary>
    public int ShellCount { get; }

    /// <summary>Volume of each body point's cell in the same joint tessellation, length³ (indexed like the body's points).</summary>
    public double[] BodyCellVolume { get; init; } = [];

    /// <summary>Mass ∫ρ dV of each body point's cell over body profile plus medium (mesh generators), or null when not asked for.</summary>
    public double[]? BodyCellMass { get; init; }

    /// <summary>ρ_bg (V_box − (4π/3) R³): the mass the medium should hold, mass units.</summary>
    public double ExpectedMass => Settings.Density * (Domain.Volume - 4.0 / 3.0 * Math.PI * BodyRadius * BodyRadius * BodyRadius);
}
