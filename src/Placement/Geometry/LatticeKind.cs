namespace Placement.Geometry;

/// <summary>The regular point lattices the library can generate.</summary>
public enum LatticeKind
{
    /// <summary>Simple cubic: one point per cubic cell.</summary>
    SimpleCubic,

    /// <summary>Body-centred cubic: corners and cube centre, two points per cubic cell.</summary>
    BodyCentredCubic,

    /// <summary>Face-centred cubic: corners and face centres, four points per cubic cell (cubic close packing).</summary>
    FaceCentredCubic,

    /// <summary>Ideal hexagonal close packing (ABAB stacking, c/a = √(8/3)), four points per orthorhombic cell.</summary>
    HexagonalClosePacked,
}
