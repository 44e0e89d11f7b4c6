namespace Placement.Relaxation;

/// <summary>How <see cref="VoronoiRelaxation"/> and <see cref="KernelRelaxation"/> keep the radial mass distribution exact while points move.</summary>
public enum RadialConstraint
{
    /// <summary>
    /// Every generator keeps its starting radius and moves only tangentially (steps projected on the sphere through it):
    /// the enclosed mass stays exactly that of the start, and shell starts keep their exact shell masses.
    /// </summary>
    KeepRadii,

    /// <summary>
    /// Generators move freely, then <see cref="Samplers.RadialRankStretch"/> puts the k-th nearest at the radius
    /// enclosing (k + ½)/N of the mass (equal masses): exact to half a point for any start, but a shell start loses its
    /// shells (their points spread over each shell's thickness).
    /// </summary>
    RankStretch,
}
