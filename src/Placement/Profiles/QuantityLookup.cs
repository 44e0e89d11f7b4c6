namespace Placement.Profiles;

/// <summary>Finds a profile's carried quantity by its physical dimension (pressure, specific energy, temperature).</summary>
internal static class QuantityLookup
{
    /// <summary>Name of the first quantity whose unit is length^l mass^m time^t K^k, or null.</summary>
    public static string? FirstWithDimension(IRadialProfile profile, int length, int mass, int time, int temperature)
    {
        ArgumentNullException.ThrowIfNull(profile);
        foreach (var q in profile.Quantities)
            if (q.Unit.Length == length && q.Unit.Mass == mass && q.Unit.Time == time && q.Unit.Temperature == temperature) return q.Name;
        return null;
    }
}
