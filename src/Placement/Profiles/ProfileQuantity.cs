namespace Placement.Profiles;

/// <summary>The name and unit of an extra quantity a profile carries along with density (pressure, temperature, composition...).</summary>
/// <param name="Name">Name as given by the table column or the model, e.g. <c>P</c>, <c>T</c>, <c>X_H</c>.</param>
/// <param name="Unit">Unit of the values returned by <see cref="IRadialProfile.TryQuantity(string, double, out double)"/>.</param>
public sealed record ProfileQuantity(string Name, PhysicalUnit Unit);
