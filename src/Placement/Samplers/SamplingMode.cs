namespace Placement.Samplers;

/// <summary>What the placed points are for, which decides what their masses mean.</summary>
/// <remarks>
/// Both modes place points whose number density follows the profile density ρ (each point stands for the
/// same mass m = M/N), and both give every point a mass so the set's total is exactly M. They differ only in
/// the meaning of <see cref="Points.PointSet.Mass"/>: final masses for SPH, provisional masses for a moving
/// mesh (to be replaced by ρ·V of each point's Voronoi cell once the tessellation exists). The mode is written
/// into the provenance parameters under the key <c>mode</c>.
/// </remarks>
public enum SamplingMode
{
    /// <summary>Equal-mass SPH particles: every point's mass is final and equals M/N.</summary>
    EqualMassParticles = 0,

    /// <summary>
    /// Mesh-generating points for moving-mesh codes: masses are provisional (M/N each, so the total is exact) and
    /// are meant to be recomputed from the points' cells.
    /// </summary>
    MeshGenerators = 1,
}
