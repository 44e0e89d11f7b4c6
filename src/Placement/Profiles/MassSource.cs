namespace Placement.Profiles;

/// <summary>Which column a tabulated profile trusts for its enclosed mass when a table gives both density and mass.</summary>
public enum MassSource
{
    /// <summary>M(r) is the integral of the interpolated density; tabulated masses are only compared (the default).</summary>
    IntegratedDensity,

    /// <summary>
    /// M(r) reproduces the tabulated masses exactly at every row: the interpolated density of each interval between rows
    /// is multiplied by (tabulated mass of the interval)/(integrated mass of the interval). Density then jumps at rows by
    /// the local mismatch, which <see cref="MassConsistency"/> reports. Intervals whose tabulated mass is below 1e-12 of
    /// the total (unresolved by the table's precision) keep the integrated density.
    /// </summary>
    Tabulated,
}
