using Placement.Parallelism;
using Placement.Profiles;

namespace Placement.Tessellation;

/// <summary>Settings of <see cref="VoronoiTessellation.Compute(Placement.Points.PointSet, TessellationDomain, TessellationOptions?)"/>.</summary>
public sealed record TessellationOptions
{
    /// <summary>Keep each cell's face list (neighbour id and area per face): about 12 bytes × 15.5 faces ≈ 190 bytes per cell more.</summary>
    public bool KeepFaces { get; init; }

    /// <summary>
    /// Faces smaller than this fraction of V^{2/3} are not counted (face counts, face lists, face-angle ratio); their
    /// volume still is. Default 1e-9: lattice-degenerate faces (exactly zero, or of size ~ noise²) drop out while a
    /// genuine face of a random cell is this small with negligible probability.
    /// </summary>
    public double FaceAreaTolerance { get; init; } = 1e-9;

    /// <summary>
    /// Distance, relative to the generator's nearest-neighbour distance, within which a vertex counts as lying on a
    /// clipping plane (so co-spherical neighbours add no face). Default 1e-12.
    /// </summary>
    public double ClipTolerance { get; init; } = 1e-12;

    /// <summary>
    /// Ball domains: the relative excess radius δ allowed for the tangent-plane approximation (every vertex of a cut
    /// cell within R(1 + δ) of the centre). Default 1e-4; smaller costs more planes per surface cell (about 1/√(8δ)
    /// per radian of surface the cell spans, in each direction). With fewer than about 1000 points the tessellation raises
    /// δ to 1.4e-3 N^(−2/3), so a single cell (N = 1) is not cut by tens of thousands of planes.
    /// </summary>
    public double SphereTolerance { get; init; } = 1e-4;

    /// <summary>
    /// Two generators closer than this fraction of the mean spacing (V/N)^{1/3}, or of the generator's distance from the
    /// coordinate origin where that is smaller (the finer scale of a cusp at the origin), are an error; coincident ones
    /// always. Default 1e-10.
    /// </summary>
    public double DuplicateTolerance { get; init; } = 1e-10;

    /// <summary>Mean points per cell of the search grid. Default 1.5 (measured fastest for uniform points).</summary>
    public double PointsPerGridCell { get; init; } = 1.5;

    /// <summary>Spatial index for gathering neighbours. Default <see cref="NeighbourIndexKind.Automatic"/>.</summary>
    public NeighbourIndexKind NeighbourIndex { get; init; } = NeighbourIndexKind.Automatic;

    /// <summary>
    /// With <see cref="NeighbourIndexKind.Automatic"/>: the crowding C = Σ_c n_c² / N of the uniform grid (n_c points
    /// in grid cell c; the mean number of points sharing a point's cell) above which the k-d tree is used. Uniform
    /// random points at the default 1.5 points per cell give C ≈ 2.5. Default 200: measured on 1e5 points in a ball on
    /// the development machine, a set with C ≈ 17 (density ∝ (1 − r²)⁶) ran 1.5× faster on the grid, a Hernquist cusp
    /// with C ≈ 3e4 about 10× faster on the tree. Since grid cells in crowded regions hand over to a k-d tree of their
    /// own, the two agree within about 20 % on crowded sets (eleven bodies, 1e5 points) and the grid stays 2× faster on
    /// even ones, so this limit only decides which index serves the crowded majority.
    /// </summary>
    public double GridCrowdingLimit { get; init; } = 200;

    /// <summary>When set, each cell's mass ∫ρ dV is integrated for this profile (centred at the origin) during the pass.</summary>
    public IRadialProfile? MassProfile { get; init; }

    /// <summary>Mass quadrature: largest angular size (edge / distance to the profile centre) of a quadrature triangle before it is split. Default 0.1.</summary>
    public double MassQuadratureAngle { get; init; } = 0.1;

    /// <summary>Parallelism; <see cref="ParallelSettings.Default"/> when null. Results are identical for any thread count.</summary>
    public ParallelSettings? Parallel { get; init; }

    /// <summary>Defaults.</summary>
    public static TessellationOptions Default { get; } = new();
}
