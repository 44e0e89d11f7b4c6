namespace Placement.Profiles;

/// <summary>Which table columns hold the coordinate, density, enclosed mass and carried quantities, with their units.</summary>
/// <remarks>
/// Every entry is a column name as written in the header, optionally followed by <c>:unit</c> (e.g. <c>r:cm</c>,
/// <c>rho:g/cm^3</c>). A unit given here overrides one written in the header as <c>name[unit]</c>; a column used without
/// a unit in either place is an error. Exactly one of <see cref="Radius"/> and <see cref="MassCoordinate"/> is set.
/// </remarks>
public sealed record ProfileColumnMap
{
    /// <summary>Radius column (e.g. <c>r:R_sun</c>); null when the table is in mass coordinate.</summary>
    public string? Radius { get; init; } = "r";

    /// <summary>Mass-coordinate column (enclosed mass as the independent variable); null for radius tables.</summary>
    public string? MassCoordinate { get; init; }

    /// <summary>Density column (required).</summary>
    public string Density { get; init; } = "rho";

    /// <summary>Optional enclosed-mass column of a radius table, compared with the integrated density.</summary>
    public string? EnclosedMass { get; init; }

    /// <summary>Columns to carry as extra quantities; null carries every column not used above, empty carries none.</summary>
    public IReadOnlyList<string>? Quantities { get; init; }

    /// <summary>The default map: radius <c>r</c>, density <c>rho</c>, every other column carried, units from the header.</summary>
    public static ProfileColumnMap Default { get; } = new();

    /// <summary>Splits "name:unit" into its parts (unit null when absent).</summary>
    internal static (string Name, string? Unit) Split(string entry)
    {
        int colon = entry.IndexOf(':', StringComparison.Ordinal);
        return colon < 0 ? (entry.Trim(), null) : (entry[..colon].Trim(), entry[(colon + 1)..].Trim());
    }
}
