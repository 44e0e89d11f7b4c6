using Placement.Points;

namespace Placement.IO;

/// <summary>
/// What a point file holds: a <see cref="PointSet"/> (positions, masses, target densities, layers, units,
/// provenance), optional point identifiers, and any number of extra named per-point columns.
/// </summary>
/// <remarks>
/// Extra columns (cell volume, SPH density, velocity …) are added with <see cref="Add(PointColumn)"/>; each
/// must have exactly <see cref="Count"/> values per component and a name that differs, ignoring case, from
/// the core fields (<see cref="PointColumnNames.Reserved"/>) and from every other column and component
/// name (so the flat CSV and VTK layouts stay unambiguous). The writers of every format take a
/// <see cref="PointTable"/>; the HDF5 reader returns one.
/// </remarks>
public sealed class PointTable
{
    private readonly List<PointColumn> _columns = [];
    private readonly HashSet<string> _flatNames = new(StringComparer.OrdinalIgnoreCase);
    private long[]? _ids;

    /// <summary>Wraps a point set with no extra columns.</summary>
    /// <param name="points">The point set; its arrays are shared, not copied.</param>
    /// <exception cref="ArgumentNullException"><paramref name="points"/> is null.</exception>
    public PointTable(PointSet points)
    {
        ArgumentNullException.ThrowIfNull(points);
        Points = points;
    }

    /// <summary>The point set (core fields, units and provenance).</summary>
    public PointSet Points { get; }

    /// <summary>Number of points.</summary>
    public int Count => Points.Count;

    /// <summary>
    /// Point identifiers, or null for the default 0 … N−1 (written explicitly to every file).
    /// </summary>
    /// <exception cref="ArgumentException">Set to an array whose length is not <see cref="Count"/>.</exception>
    public long[]? Ids
    {
        get => _ids;
        set
        {
            if (value is not null && value.Length != Count)
                throw new ArgumentException($"Ids has {value.Length} values but the point set has {Count} points.", nameof(value));
            _ids = value;
        }
    }

    /// <summary>
    /// The background medium's box, density and pressure when the table holds background points (layer
    /// <see cref="PointLayers.Background"/>), else null. Writers record it apart from the per-point columns.
    /// </summary>
    public Bodies.Background.BackgroundBox? Background { get; set; }

    /// <summary>
    /// Point masses that travel with the points (a softened core, companions), in the point set's units; empty by
    /// default. Writers record them apart from the per-point columns (see docs/file-formats.md).
    /// </summary>
    public List<Bodies.PointMass> PointMasses { get; } = [];

    /// <summary>Body-level numbers with units (γ, energies, resolution figures), written to the HDF5 group <c>/body</c>; empty by default.</summary>
    public List<BodyScalar> BodyScalars { get; } = [];

    /// <summary>Body-level text labels (the energy source, the match chosen …), written as attributes of <c>/body</c>; empty by default.</summary>
    public SortedDictionary<string, string> BodyLabels { get; } = new(StringComparer.Ordinal);

    /// <summary>Extra columns in the order they were added.</summary>
    public IReadOnlyList<PointColumn> Columns => _columns;

    /// <summary>Adds an extra per-point column.</summary>
    /// <param name="column">The column; its arrays are shared, not copied.</param>
    /// <returns>This table, for chaining.</returns>
    /// <exception cref="ArgumentException">The column length is not <see cref="Count"/>, or its name (or a
    /// component name) is reserved or already used.</exception>
    public PointTable Add(PointColumn column)
    {
        ArgumentNullException.ThrowIfNull(column);
        if (column.Length != Count)
            throw new ArgumentException($"Column '{column.Name}' has {column.Length} values but the point set has {Count} points.", nameof(column));
        var names = new List<string>(column.ComponentCount + 1) { column.Name };
        for (int c = 0; c < column.ComponentCount && column.ComponentCount > 1; c++) names.Add(column.ComponentName(c));
        foreach (string name in names)
        {
            if (PointColumnNames.Reserved.Contains(name))
                throw new ArgumentException($"Column name '{name}' is reserved for a core field ({string.Join(", ", PointColumnNames.Reserved)}).", nameof(column));
            if (_flatNames.Contains(name))
                throw new ArgumentException($"Column name '{name}' is already used in this table (names are compared ignoring case).", nameof(column));
        }
        foreach (string name in names) _flatNames.Add(name);
        _columns.Add(column);
        return this;
    }

    /// <summary>Adds a scalar column in the point set's units (see <see cref="PointColumn.Scalar"/>).</summary>
    /// <param name="name">Identifier.</param>
    /// <param name="values">One value per point.</param>
    /// <param name="dimension">Physical dimension, which fixes the unit in <see cref="PointSet.Units"/>.</param>
    /// <param name="description">One-line description.</param>
    /// <returns>This table, for chaining.</returns>
    /// <exception cref="ArgumentException">See <see cref="Add(PointColumn)"/>.</exception>
    public PointTable Add(string name, double[] values, QuantityDimension dimension, string description = "") =>
        Add(PointColumn.Scalar(name, values, dimension, Points.Units, description));

    /// <summary>Finds an extra column by exact name.</summary>
    /// <param name="name">Column name.</param>
    /// <returns>The column, or null when absent.</returns>
    public PointColumn? Find(string name)
    {
        foreach (var column in _columns)
            if (column.Name == name) return column;
        return null;
    }

    /// <summary>The identifier of point <paramref name="i"/>: <see cref="Ids"/>[i], or i by default.</summary>
    public long IdOf(int i) => _ids is null ? i : _ids[i];

    /// <summary>
    /// Asserts the invariants: the point set's own (<see cref="PointSet.CheckValidity"/>), every column
    /// still has <see cref="Count"/> values per component (arrays may not be swapped after adding), and the body
    /// scalars and labels have distinct identifier names.
    /// </summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the column.</exception>
    public void CheckValidity()
    {
        Points.CheckValidity();
        foreach (var pointMass in PointMasses) pointMass.CheckValidity();
        CheckBodyValues();
        if (_ids is not null && _ids.Length != Count)
            throw new InvalidOperationException($"Ids has {_ids.Length} values but the point set has {Count} points.");
        Background?.CheckValidity();
        foreach (var column in _columns)
            for (int c = 0; c < column.ComponentCount; c++)
                if (column.Components[c].Length != Count)
                    throw new InvalidOperationException($"Column '{column.Name}' component {c} has {column.Components[c].Length} values; expected {Count}.");
    }

    private void CheckBodyValues()
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var scalar in BodyScalars)
        {
            scalar.CheckValidity();
            if (!names.Add(scalar.Name)) throw new InvalidOperationException($"Body scalar '{scalar.Name}' is given twice.");
        }
        foreach (var (name, value) in BodyLabels)
        {
            if (!BodyNames.IsIdentifier(name) || !names.Add(name))
                throw new InvalidOperationException($"Body label '{name}' is not an identifier or repeats a body scalar's name.");
        }
    }
}
