namespace Placement.Profiles;

/// <summary>Values of one carried quantity at the rows of a table, in the quantity's unit.</summary>
/// <param name="Quantity">Name and unit.</param>
/// <param name="Values">One finite value per row.</param>
public sealed record TabulatedQuantity(ProfileQuantity Quantity, IReadOnlyList<double> Values);
