namespace Placement.Relaxation;

/// <summary>What a relaxation did, iteration by iteration, so a user can plot its convergence.</summary>
/// <param name="RmsStep">rms step of each iteration, in units of the local target spacing (m/ρ)^(1/3).</param>
/// <param name="KernelSumScatter">Standard deviation of ln S_i, S_i = Σ_j (m_j/ρ_t,j) W(r_ij, H_i), before each step: 0 for a perfect partition of unity.</param>
/// <param name="Seconds">Wall-clock seconds of each iteration.</param>
/// <param name="Converged">True when the rms step fell below the tolerance before the iteration limit.</param>
public sealed record RelaxationHistory(double[] RmsStep, double[] KernelSumScatter, double[] Seconds, bool Converged)
{
    /// <summary>Number of iterations done.</summary>
    public int Iterations => RmsStep.Length;
}
