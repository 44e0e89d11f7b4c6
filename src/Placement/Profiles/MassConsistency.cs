namespace Placement.Profiles;

/// <summary>How well a table's enclosed-mass column agrees with the integral of its density column.</summary>
/// <remarks>Differences are integrated minus tabulated, measured at every row before any renormalisation.</remarks>
/// <param name="Source">Which of the two the profile uses.</param>
/// <param name="MaxRelativeDifference">max over rows with M_tab &gt; 0 of |M_int − M_tab|/M_tab.</param>
/// <param name="RowOfMaxRelativeDifference">0-based row where that maximum occurs.</param>
/// <param name="MaxDifferenceOverTotal">max over rows of |M_int − M_tab| / M_tab(R).</param>
/// <param name="IntegratedTotalMass">Integral of the density to R, mass units.</param>
/// <param name="TabulatedTotalMass">Tabulated mass at R, mass units.</param>
public sealed record MassConsistency(
    MassSource Source,
    double MaxRelativeDifference,
    int RowOfMaxRelativeDifference,
    double MaxDifferenceOverTotal,
    double IntegratedTotalMass,
    double TabulatedTotalMass);
