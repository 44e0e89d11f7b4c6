namespace Placement.Samplers.Lattices;

/// <summary>How a stretch mapping distorts cells at one radius: radial and tangential stretch and their ratio.</summary>
/// <param name="MassFraction">Enclosed mass fraction M(r')/M at this row.</param>
/// <param name="UniformRadius">Radius r in the uniform ball scaled to the profile's outer radius, length units.</param>
/// <param name="Radius">Mapped radius r' with M(r')/M = (r/R)³, length units.</param>
/// <param name="RadialStretch">dr'/dr = 3 M r² / (R³ 4π r'² ρ(r')) (dimensionless; +∞ where ρ = 0).</param>
/// <param name="TangentialStretch">r'/r (dimensionless).</param>
public readonly record struct StretchAnisotropyRow(
    double MassFraction, double UniformRadius, double Radius, double RadialStretch, double TangentialStretch)
{
    /// <summary>Radial over tangential stretch: 1 for undistorted cells, &gt; 1 for radially elongated ones.</summary>
    public double Anisotropy => RadialStretch / TangentialStretch;
}
