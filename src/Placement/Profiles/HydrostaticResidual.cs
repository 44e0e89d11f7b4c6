namespace Placement.Profiles;

/// <summary>How far a profile is from hydrostatic equilibrium at sample radii: |dP/dr + G M ρ/r²| / (G M ρ/r²).</summary>
/// <param name="Samples">Number of radii evaluated.</param>
/// <param name="Max">Largest relative residual.</param>
/// <param name="Rms">Root mean square of the relative residuals.</param>
/// <param name="RadiusOfMax">Where the largest residual occurs, length units (NaN without samples).</param>
public sealed record HydrostaticResidual(int Samples, double Max, double Rms, double RadiusOfMax)
{
    /// <summary>No samples.</summary>
    public static HydrostaticResidual None { get; } = new(0, double.NaN, double.NaN, double.NaN);
}
