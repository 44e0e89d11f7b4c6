using System.Text.RegularExpressions;
using Placement.Units;

namespace Placement.IO;

/// <summary>
/// One named per-point quantity written next to a point set (cell volume, SPH density, velocity …): one
/// array per component, each of length N, with its unit.
/// </summary>
/// <remarks>
/// Layout: structure-of-arrays, <c>Components[c][i]</c> is component c of point i; a scalar has one
/// component, a 3-vector three (x, y, z). <see cref="Unit"/> is the unit name written to files and
/// <see cref="CgsFactor"/> the factor that converts values to cgs (NaN when unknown). Names are
/// identifiers (<c>[A-Za-z][A-Za-z0-9_]*</c>) so that they are valid HDF5 link names, CSV headers and VTK
/// array names without quoting.
/// </remarks>
public sealed partial class PointColumn
{
    /// <summary>Creates a column from its component arrays.</summary>
    /// <param name="name">Identifier, <c>[A-Za-z][A-Za-z0-9_]*</c>, at most 64 characters.</param>
    /// <param name="components">One array per component (1 to 9 components), all of the same length.</param>
    /// <param name="unit">Unit name, e.g. <c>cm^3</c>; <c>1</c> for pure numbers.</param>
    /// <param name="cgsFactor">Factor converting a value to cgs, &gt; 0, or NaN when not known.</param>
    /// <param name="description">One-line human description (may be empty).</param>
    /// <exception cref="ArgumentException">The name is not an identifier, there are no or too many components,
    /// component lengths differ, the unit is empty, or the factor is not positive or NaN.</exception>
    public PointColumn(string name, IReadOnlyList<double[]> components, string unit, double cgsFactor, string description = "")
    {
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(components);
        ArgumentNullException.ThrowIfNull(unit);
        ArgumentNullException.ThrowIfNull(description);
        if (name.Length > 64 || !IdentifierPattern().IsMatch(name))
            throw new ArgumentException($"Column name '{name}' is not an identifier: expected a letter followed by letters, digits or '_', at most 64 characters.", nameof(name));
        if (components.Count is < 1 or > 9)
            throw new ArgumentException($"Column '{name}' has {components.Count} components; expected 1 to 9.", nameof(components));
        for (int c = 0; c < components.Count; c++)
        {
            if (components[c] is null)
                throw new ArgumentException($"Column '{name}' component {c} is null.", nameof(components));
            if (components[c].Length != components[0].Length)
                throw new ArgumentException($"Column '{name}' component {c} has {components[c].Length} values but component 0 has {components[0].Length}.", nameof(components));
        }
        if (string.IsNullOrWhiteSpace(unit) || unit.Contains('\n', StringComparison.Ordinal))
            throw new ArgumentException($"Column '{name}' has unit '{unit}'; expected a one-line unit name ('1' for pure numbers).", nameof(unit));
        if (!double.IsNaN(cgsFactor) && !(cgsFactor > 0 && double.IsFinite(cgsFactor)))
            throw new ArgumentException($"Column '{name}' has cgs factor {cgsFactor}; expected a finite positive number or NaN when unknown.", nameof(cgsFactor));
        Name = name;
        Components = components.ToArray();
        Unit = unit;
        CgsFactor = cgsFactor;
        Description = description.ReplaceLineEndings(" ");
    }

    /// <summary>Column name (identifier).</summary>
    public string Name { get; }

    /// <summary>Component arrays, each of length <see cref="Length"/>.</summary>
    public IReadOnlyList<double[]> Components { get; }

    /// <summary>Number of components (1 for a scalar, 3 for a vector).</summary>
    public int ComponentCount => Components.Count;

    /// <summary>Number of points (length of each component array).</summary>
    public int Length => Components[0].Length;

    /// <summary>Unit name written to files.</summary>
    public string Unit { get; }

    /// <summary>Factor converting a value to cgs, or NaN when not known.</summary>
    public double CgsFactor { get; }

    /// <summary>One-line human description.</summary>
    public string Description { get; }

    /// <summary>Suffixes of the component names of a 3-vector in CSV headers (<c>name_x</c> …).</summary>
    internal static readonly string[] VectorSuffixes = ["x", "y", "z"];

    /// <summary>Name of component <paramref name="c"/> in flat formats: the name for scalars, <c>name_x/y/z</c> for 3-vectors, <c>name_0…</c> otherwise.</summary>
    internal string ComponentName(int c) =>
        ComponentCount == 1 ? Name : ComponentCount == 3 ? Name + "_" + VectorSuffixes[c] : Name + "_" + c.ToString(System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>Creates a scalar column whose unit and cgs factor follow from a dimension in a unit system.</summary>
    /// <param name="name">Identifier.</param>
    /// <param name="values">Values, one per point.</param>
    /// <param name="dimension">Physical dimension of the quantity.</param>
    /// <param name="units">Unit system the values are expressed in.</param>
    /// <param name="description">One-line description.</param>
    /// <exception cref="ArgumentException">See the constructor.</exception>
    public static PointColumn Scalar(string name, double[] values, QuantityDimension dimension, UnitSystem units, string description = "")
    {
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(units);
        return new PointColumn(name, [values], dimension.UnitName(units), dimension.CgsFactor(units), description);
    }

    /// <summary>Creates a 3-vector column (e.g. velocity) whose unit and cgs factor follow from a dimension.</summary>
    /// <param name="name">Identifier.</param>
    /// <param name="x">x components.</param>
    /// <param name="y">y components.</param>
    /// <param name="z">z components.</param>
    /// <param name="dimension">Physical dimension of the quantity.</param>
    /// <param name="units">Unit system the values are expressed in.</param>
    /// <param name="description">One-line description.</param>
    /// <exception cref="ArgumentException">See the constructor.</exception>
    public static PointColumn Vector(string name, double[] x, double[] y, double[] z, QuantityDimension dimension, UnitSystem units, string description = "")
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(z);
        ArgumentNullException.ThrowIfNull(units);
        return new PointColumn(name, [x, y, z], dimension.UnitName(units), dimension.CgsFactor(units), description);
    }

    [GeneratedRegex("^[A-Za-z][A-Za-z0-9_]*$", RegexOptions.CultureInvariant)]
    private static partial Regex IdentifierPattern();
}
