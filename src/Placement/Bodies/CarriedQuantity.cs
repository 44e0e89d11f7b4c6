using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>A profile quantity evaluated at every point's radius.</summary>
/// <param name="Quantity">The profile quantity (name and unit; the values are in that unit).</param>
/// <param name="Values">One value per point, in <see cref="ProfileQuantity.Unit"/>.</param>
public sealed record CarriedQuantity(ProfileQuantity Quantity, double[] Values);
