using Placement.Tessellation;

namespace Placement.Quality;

/// <summary>Settings of <see cref="QualityChecker"/>.</summary>
public sealed record QualityOptions
{
    /// <summary>
    /// Generator–centroid offset over cell radius, d/R with R = (3V/4π)^{1/3}, above which a moving-mesh code
    /// starts steering a generator. Default 0.1875 = 0.75 × 0.25 (reference notes §6: correction once d exceeds
    /// about 0.75–1.0 × a shaping factor × R, shaping factor η ≈ 0.25 in Springel 2010, MNRAS 401, 791).
    /// </summary>
    public double OffsetThreshold { get; init; } = 0.1875;

    /// <summary>Largest face-angle ratio √(A_f/π)/h_f tolerated before correction. Default 2.25 (common practice, reference notes §6).</summary>
    public double FaceAngleThreshold { get; init; } = 2.25;

    /// <summary>Number of equal-mass radial bins for the density and enclosed-mass comparisons. Default 20.</summary>
    public int RadialBins { get; init; } = 20;

    /// <summary>Number of histogram bins for ln(Vρ/m). Default 60.</summary>
    public int HistogramBins { get; init; } = 60;

    /// <summary>Histogram range: ln(Vρ/m) in [−HistogramRange, +HistogramRange]. Default 1.5 (a factor 4.5 either way).</summary>
    public double HistogramRange { get; init; } = 1.5;

    /// <summary>How many of the worst cells (largest |ln(Vρ/m)|) to list. Default 20.</summary>
    public int WorstCells { get; init; } = 20;

    /// <summary>Keep the per-point ln(Vρ/m) values in the report (8 bytes per point; for slice scatter plots). Default true.</summary>
    public bool KeepPerPointValues { get; init; } = true;

    /// <summary>
    /// Angular size of the quadrature triangles of the cell masses ∫ρ dV behind the radial density comparison (see the
    /// tessellation's mass quadrature). Default 0.5: a few triangles per face; degree-5 accuracy per triangle.
    /// </summary>
    public double CellMassQuadratureAngle { get; init; } = 0.5;

    /// <summary>Neighbour number N_H of the SPH density check; 0 switches the check off. Default 64.</summary>
    public double SphNeighbourNumber { get; init; } = 64;

    /// <summary>Kernel of the SPH density check. Default Wendland C2 (with the Dehnen–Aly self-contribution correction).</summary>
    public Sph.SphKernel SphKernel { get; init; } = Sph.SphKernel.WendlandC2;

    /// <summary>
    /// Also compare ρ_SPH with the target seen through the same kernel and support (<see cref="Sph.KernelSmoothedProfile"/>),
    /// which separates the placement's noise from the kernel's smoothing bias; default true (288 density evaluations per point, about 1 s per 1e5 points on two cores; not computed for the Poisson baseline).
    /// </summary>
    public bool SphSmoothedTarget { get; init; } = true;

    /// <summary>Tessellation settings; defaults when null.</summary>
    public TessellationOptions? Tessellation { get; init; }

    /// <summary>Defaults.</summary>
    public static QualityOptions Default { get; } = new();
}
