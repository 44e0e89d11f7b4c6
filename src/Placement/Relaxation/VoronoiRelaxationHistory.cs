namespace Placement.Relaxation;

/// <summary>What a <see cref="VoronoiRelaxation"/> did, iteration by iteration, so a user can plot its convergence.</summary>
/// <remarks>Entry k describes the set measured at the start of iteration k (after the previous step); the last accepted
/// entry describes the result.</remarks>
/// <param name="LogRatioStd">Standard deviation of ln(V ρ_target(r)/m) over every cell with ρ_target &gt; 0 (the quality checker's figure).</param>
/// <param name="InteriorLogRatioStd">The same over the cells not cut by the domain (the cells the volume correction targets).</param>
/// <param name="MaxAbsLogRatio">Largest |ln(V ρ_target/m)| over the cells not cut by the domain.</param>
/// <param name="RmsStep">rms step of the iteration that followed, in cell radii (0 for the last entry).</param>
/// <param name="Seconds">Wall-clock seconds of the iteration (tessellation, geometry, solve, step).</param>
/// <param name="Undone">True for a state that was worse than the one before it: its step was undone (the set went back
/// to the previous state) and the next step halved.</param>
/// <param name="Converged">True when the interior rms fell below the tolerance before the iteration limit.</param>
public sealed record VoronoiRelaxationHistory(double[] LogRatioStd, double[] InteriorLogRatioStd, double[] MaxAbsLogRatio,
    double[] RmsStep, double[] Seconds, bool[] Undone, bool Converged)
{
    /// <summary>Number of iterations done (one tessellation each; undone steps included).</summary>
    public int Iterations => Math.Max(0, LogRatioStd.Length - 1);

    /// <summary>Index of the entry that describes the result: the last one whose step was kept (−1 when empty).</summary>
    public int ResultIndex
    {
        get
        {
            int k = LogRatioStd.Length - 1;
            while (k > 0 && Undone[k]) k--;
            return k;
        }
    }
}
