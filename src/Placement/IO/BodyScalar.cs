using Placement.Units;

namespace Placement.IO;

/// <summary>One body-level number written next to the points (adiabatic index, an energy, a threshold …) with its unit.</summary>
/// <remarks>Written to HDF5 as a scalar float64 dataset <c>/body/NAME</c> with the same <c>units</c>, <c>cgs_factor</c>
/// and <c>description</c> attributes as the per-point datasets (docs/file-formats.md). NaN is a legal value (not computed).</remarks>
/// <param name="Name">Identifier, <c>[A-Za-z][A-Za-z0-9_]*</c>, at most 64 characters.</param>
/// <param name="Value">The value, in <paramref name="Unit"/>.</param>
/// <param name="Unit">Unit name, <c>1</c> for pure numbers.</param>
/// <param name="CgsFactor">Factor converting the value to cgs, or NaN when unknown.</param>
/// <param name="Description">One-line description.</param>
public sealed record BodyScalar(string Name, double Value, string Unit, double CgsFactor, string Description = "")
{
    /// <summary>A scalar whose unit and cgs factor follow from a dimension in a unit system.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="units"/> is null.</exception>
    public static BodyScalar Of(string name, double value, QuantityDimension dimension, UnitSystem units, string description = "")
    {
        ArgumentNullException.ThrowIfNull(units);
        return new BodyScalar(name, value, dimension.UnitName(units), dimension.CgsFactor(units), description);
    }

    /// <summary>Asserts the invariants: identifier name, one-line non-empty unit, positive or NaN factor.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the scalar.</exception>
    public void CheckValidity()
    {
        if (!BodyNames.IsIdentifier(Name))
            throw new InvalidOperationException($"Body scalar name '{Name}' is not an identifier (a letter, then letters, digits or '_', at most 64 characters).");
        if (string.IsNullOrWhiteSpace(Unit) || Unit.Contains('\n', StringComparison.Ordinal))
            throw new InvalidOperationException($"Body scalar '{Name}' has unit '{Unit}'; expected a one-line unit name ('1' for pure numbers).");
        if (!double.IsNaN(CgsFactor) && !(CgsFactor > 0 && double.IsFinite(CgsFactor)))
            throw new InvalidOperationException($"Body scalar '{Name}' has cgs factor {CgsFactor}; expected a finite positive number or NaN.");
    }
}
