using Placement.Geometry;

namespace Placement.Samplers.Lattices;

/// <summary>A stretched-lattice sampling plan: one batch per lattice plane (basis point b, plane k) inside the ball.</summary>
public sealed class LatticePlan : SamplingPlan
{
    internal LatticePlan(int count, IReadOnlyList<PlannedBatch> batches, LatticeBall ball, (int Basis, int Plane)[] planes,
        Rotation3 orientation, double mappingRadius, IReadOnlyList<StretchAnisotropyRow> anisotropy)
        : base(count, batches)
    {
        Ball = ball;
        Planes = planes;
        Orientation = orientation;
        MappingRadius = mappingRadius;
        Anisotropy = anisotropy;
    }

    /// <summary>The lattice kind.</summary>
    public LatticeKind Kind => Ball.Lattice.Kind;

    /// <summary>Rotation applied to the lattice (after the offset) before the stretch.</summary>
    public Rotation3 Orientation { get; }

    /// <summary>
    /// Radius R0 of the uniform ball that is mapped onto the profile, in lattice units (cube edge 1, or HCP
    /// neighbour distance 1): the larger of the clipping radius and the radius of the ball whose volume is N/n.
    /// </summary>
    public double MappingRadius { get; }

    /// <summary>Radius inside which lattice points were kept, lattice units.</summary>
    public double ClipRadius => Ball.Radius;

    /// <summary>The radial and tangential stretch the mapping applies, per radius (see <see cref="StretchAnisotropy"/>).</summary>
    public IReadOnlyList<StretchAnisotropyRow> Anisotropy { get; }

    internal LatticeBall Ball { get; }

    internal (int Basis, int Plane)[] Planes { get; }
}
