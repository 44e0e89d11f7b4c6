using System.Globalization;

namespace Placement.Profiles;

/// <summary>Writes any profile as a table that <see cref="ProfileTableReader"/> reads back with the default column map.</summary>
/// <remarks>
/// Layout: <c>#</c> comment lines (description, unit system, fingerprint), then a header
/// <c>r[unit] rho[unit] m[unit] name[unit]...</c> (m is the enclosed mass, then every carried quantity), then one row per
/// radius with round-trip ("R") invariant-culture numbers, whitespace separated. Read back with
/// <c>EnclosedMass = "m"</c> in the column map to compare or trust the written masses.
/// </remarks>
public static class ProfileTableWriter
{
    /// <summary>Writes <paramref name="profile"/> at the given radii.</summary>
    /// <param name="writer">Destination.</param>
    /// <param name="profile">The profile.</param>
    /// <param name="radii">Strictly increasing radii in [0, R], length units (e.g. from <see cref="ProfileSampling.Radii"/>).</param>
    /// <param name="description">Free text written as a comment (e.g. "invented demo body").</param>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ArgumentException">Radii are not strictly increasing inside [0, R].</exception>
    public static void Write(TextWriter writer, IRadialProfile profile, IReadOnlyList<double> radii, string description = "")
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(radii);
        for (int i = 0; i < radii.Count; i++)
        {
            if (!(radii[i] >= 0 && radii[i] <= profile.OuterRadius)) throw new ArgumentException($"Radius {radii[i]} at index {i} is outside [0, R].", nameof(radii));
            if (i > 0 && !(radii[i] > radii[i - 1])) throw new ArgumentException($"Radii must increase strictly (index {i}).", nameof(radii));
        }
        var u = profile.Units;
        var inv = CultureInfo.InvariantCulture;
        if (description.Length > 0) foreach (string d in description.Split('\n')) writer.WriteLine($"# {d.TrimEnd()}");
        writer.WriteLine($"# units: {u.Name}; fingerprint: {profile.Fingerprint}");
        writer.WriteLine("# columns: radius, density, enclosed mass, then carried quantities");
        var quantities = profile.Quantities;
        var head = new List<string>
        {
            $"r[{PhysicalUnit.ForSystem(u, 1, 0, 0).Name}]",
            $"rho[{PhysicalUnit.ForSystem(u, -3, 1, 0).Name}]",
            $"m[{PhysicalUnit.ForSystem(u, 0, 1, 0).Name}]",
        };
        foreach (var q in quantities) head.Add($"{q.Name}[{q.Unit.Name}]");
        writer.WriteLine(string.Join(' ', head));
        var sb = new System.Text.StringBuilder();
        foreach (double r in radii)
        {
            sb.Clear();
            sb.Append(r.ToString("R", inv)).Append(' ');
            sb.Append(profile.Density(r).ToString("R", inv)).Append(' ');
            sb.Append(profile.EnclosedMass(r).ToString("R", inv));
            foreach (var q in quantities)
            {
                profile.TryQuantity(q.Name, r, out double v);
                sb.Append(' ').Append(v.ToString("R", inv));
            }
            writer.WriteLine(sb.ToString());
        }
    }

    /// <summary>Writes <paramref name="profile"/> to a file at about <paramref name="rows"/> radii from <see cref="ProfileSampling.Radii"/>.</summary>
    /// <param name="path">File to create or overwrite.</param>
    /// <param name="profile">The profile.</param>
    /// <param name="rows">Target number of rows, ≥ 8.</param>
    /// <param name="description">Free text written as a comment.</param>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rows"/> is below 8.</exception>
    public static void Write(string path, IRadialProfile profile, int rows = 2000, string description = "")
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(profile);
        using var w = new StreamWriter(path);
        Write(w, profile, ProfileSampling.Radii(profile, rows), description);
    }
}
