namespace Placement.Quality;

/// <summary>One badly matched cell.</summary>
/// <param name="Index">Point index.</param>
/// <param name="X">Generator x, length units.</param>
/// <param name="Y">Generator y, length units.</param>
/// <param name="Z">Generator z, length units.</param>
/// <param name="Radius">Distance from the profile centre, length units.</param>
/// <param name="LogRatio">ln(V ρ_target / m).</param>
/// <param name="Volume">Cell volume, length³.</param>
/// <param name="CutByDomain">True when the cell touches the domain boundary.</param>
public sealed record WorstCell(int Index, double X, double Y, double Z, double Radius, double LogRatio, double Volume, bool CutByDomain);
