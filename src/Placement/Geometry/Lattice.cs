namespace Placement.Geometry;

/// <summary>
/// A lattice as an orthorhombic cell (edges <see cref="CellX"/>, <see cref="CellY"/>, <see cref="CellZ"/>) with a
/// basis of points at fractional positions; point (i, j, k, b) lies at (CellX (i + bₓ), CellY (j + b_y), CellZ (k + b_z)).
/// </summary>
/// <remarks>
/// Scales: cubic lattices have cube edge 1; HCP has nearest-neighbour distance 1, cell 1 × √3 × √(8/3) with basis
/// A = (0,0,0), (½,½,0) and B = (½,⅙,½), (0,⅔,½) (B atoms over the centroids of A triangles; standard crystallography).
/// </remarks>
public sealed class Lattice
{
    private readonly double[] _basis;

    private Lattice(LatticeKind kind, double cx, double cy, double cz, double[] basis)
    {
        Kind = kind;
        CellX = cx;
        CellY = cy;
        CellZ = cz;
        _basis = basis;
    }

    /// <summary>Which lattice this is.</summary>
    public LatticeKind Kind { get; }

    /// <summary>Cell edge along x.</summary>
    public double CellX { get; }

    /// <summary>Cell edge along y.</summary>
    public double CellY { get; }

    /// <summary>Cell edge along z.</summary>
    public double CellZ { get; }

    /// <summary>Number of basis points per cell.</summary>
    public int BasisCount => _basis.Length / 3;

    /// <summary>Points per unit volume, basis count / cell volume.</summary>
    public double NumberDensity => BasisCount / (CellX * CellY * CellZ);

    /// <summary>Fractional position of basis point <paramref name="b"/>.</summary>
    public (double X, double Y, double Z) Basis(int b) => (_basis[3 * b], _basis[3 * b + 1], _basis[3 * b + 2]);

    /// <summary>The lattice of the given kind at the scale stated in the type remarks.</summary>
    /// <exception cref="ArgumentOutOfRangeException">Unknown kind.</exception>
    public static Lattice Create(LatticeKind kind) => kind switch
    {
        LatticeKind.SimpleCubic => new Lattice(kind, 1, 1, 1, [0, 0, 0]),
        LatticeKind.BodyCentredCubic => new Lattice(kind, 1, 1, 1, [0, 0, 0, 0.5, 0.5, 0.5]),
        LatticeKind.FaceCentredCubic => new Lattice(kind, 1, 1, 1, [0, 0, 0, 0.5, 0.5, 0, 0.5, 0, 0.5, 0, 0.5, 0.5]),
        LatticeKind.HexagonalClosePacked => new Lattice(kind, 1, Math.Sqrt(3), Math.Sqrt(8.0 / 3.0),
            [0, 0, 0, 0.5, 0.5, 0, 0.5, 1.0 / 6.0, 0.5, 0, 2.0 / 3.0, 0.5]),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown lattice kind."),
    };
}
