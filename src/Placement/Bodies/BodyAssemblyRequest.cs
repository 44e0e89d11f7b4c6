using Placement.Bodies.Background;
using Placement.IO;
using Placement.Parallelism;

namespace Placement.Bodies;

/// <summary>What to add to a placed body: companions on two-body orbits and a background medium.</summary>
public sealed record BodyAssemblyRequest
{
    /// <summary>Companions, each on its own two-body orbit about the primary (gas plus existing point masses).</summary>
    public IReadOnlyList<CompanionOrbit> Companions { get; init; } = [];

    /// <summary>The background medium, or null for none.</summary>
    public BackgroundSettings? Background { get; init; }

    /// <summary>
    /// Mesh generators: with a background, every point's mass becomes ∫ρ dV of its cell in the joint tessellation (body
    /// profile inside R, ρ_bg outside) and the cell volumes replace the body's; without one the body's masses are kept.
    /// </summary>
    public bool MeshGenerators { get; init; }

    /// <summary>Random seed (background shell rotations).</summary>
    public ulong Seed { get; init; }

    /// <summary>Parallelism; results do not depend on it.</summary>
    public ParallelSettings? Parallel { get; init; }

    /// <summary>
    /// Specific internal energy of the background, length²/time² (e.g. P_bg/((γ − 1) ρ_bg) for an ideal gas): the value of
    /// the <c>internal_energy</c> column at background points. NaN (default): not given, so a table with that column
    /// needs <see cref="BackgroundColumn"/>.
    /// </summary>
    public double BackgroundInternalEnergy { get; init; } = double.NaN;

    /// <summary>
    /// Values of extra per-point columns for the background points, for columns this class does not know (it knows
    /// <c>velocity</c>: at rest; <c>cell_volume</c>; <c>pressure</c>: the background pressure). Return null for an unknown
    /// column to make the assembly fail with a message naming it.
    /// </summary>
    public Func<PointColumn, BackgroundPoints, IReadOnlyList<double[]>?>? BackgroundColumn { get; init; }
}
