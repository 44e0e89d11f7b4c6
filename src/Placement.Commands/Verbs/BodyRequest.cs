using Placement.Bodies;

namespace Placement.Commands.Verbs;

/// <summary>What the body options of <c>place</c> asked for, checked against the profile.</summary>
/// <param name="Thermodynamics">γ, energy source and match, or null for no thermodynamic fields.</param>
/// <param name="Resolution">Report cells per pressure scale height of the placed points.</param>
/// <param name="Threshold">Wanted cells per H_P, or null for none.</param>
/// <param name="InnerRadius">Inner edge of the resolution window, length units.</param>
/// <param name="Energy">Report the energy budget.</param>
/// <param name="OpeningAngle">Octree opening angle (0 = pairwise).</param>
/// <param name="PointDensity">'sph' or 'voronoi'.</param>
internal sealed record BodyRequest(
    ThermodynamicOptions? Thermodynamics, bool Resolution, double? Threshold, double InnerRadius, bool Energy, double OpeningAngle, string PointDensity)
{
    /// <summary>True when the points' own density (or volume) is needed.</summary>
    public bool NeedsPointDensity => Thermodynamics is not null || Resolution;
}
