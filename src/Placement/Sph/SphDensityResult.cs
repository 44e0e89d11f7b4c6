namespace Placement.Sph;

/// <summary>SPH density estimates for every point of a set.</summary>
/// <param name="Density">ρ_i = Σ_j m_j W(r_ij, H_i) (self term included, Wendland self-contribution corrected), mass/length³.</param>
/// <param name="Support">Kernel support H_i, length units.</param>
/// <param name="NeighbourCount">Number of points (self included) inside the support.</param>
/// <param name="Kernel">The kernel used.</param>
/// <param name="NeighbourNumber">The neighbour number N_H = (4π/3) H³ n the supports were solved for (or implied by a fixed H).</param>
public sealed record SphDensityResult(double[] Density, double[] Support, int[] NeighbourCount, SphKernel Kernel, double NeighbourNumber);
