namespace Placement.Profiles;

/// <summary>Argument checks shared by the profile types.</summary>
internal static class ProfileGuards
{
    public static void Positive(double value, string name, string what)
    {
        if (!(value > 0) || !double.IsFinite(value)) throw new ArgumentOutOfRangeException(name, value, $"{what} must be finite and > 0.");
    }

    /// <summary>Accepts 0 ≤ m ≤ total, and masses up to 1e-12 relative above the total (rounding in callers' sums), which mean R.</summary>
    public static void MassInRange(double m, double total, string name)
    {
        if (!(m >= 0 && m <= total * (1 + 1e-12))) throw new ArgumentOutOfRangeException(name, m, $"Enclosed mass must lie in [0, {total}].");
    }

    public static void SpanLengths(int input, int output, string name)
    {
        if (output < input) throw new ArgumentException("Output span is shorter than the input.", name);
    }
}
