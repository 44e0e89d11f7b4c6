using System.Globalization;
using Placement.Geometry;

namespace Placement.Samplers;

/// <summary>Describes one sampler parameter: its name, type, default, unit and help text, and parses its values.</summary>
/// <remarks>
/// Parsed value types by <see cref="Kind"/>: Integer → <see cref="int"/>, Real → <see cref="double"/>,
/// Boolean → <see cref="bool"/>, Choice → the canonical lower-case <see cref="string"/>, RealTriple →
/// <see cref="double"/>[3], Rotation → <see cref="Nullable{UnitQuaternion}"/> (null meaning "random from the seed").
/// </remarks>
public sealed record SamplerParameter
{
    /// <summary>Creates a parameter description and checks that its default parses.</summary>
    /// <param name="name">Name used on command lines and in provenance, lower-case with dashes, e.g. <c>lattice</c>.</param>
    /// <param name="kind">Value type.</param>
    /// <param name="defaultText">Default value as text; must parse.</param>
    /// <param name="unit">Unit of the value (e.g. <c>length units</c>), or empty for dimensionless values.</param>
    /// <param name="help">One-sentence help text.</param>
    /// <param name="choices">Allowed words for <see cref="SamplerParameterKind.Choice"/>; empty otherwise.</param>
    /// <param name="minimum">Smallest allowed value for Integer and Real parameters.</param>
    /// <param name="maximum">Largest allowed value for Integer and Real parameters.</param>
    /// <exception cref="ArgumentException">The name is empty, a choice parameter has no choices, or the default does not parse.</exception>
    public SamplerParameter(string name, SamplerParameterKind kind, string defaultText, string unit, string help,
        IReadOnlyList<string>? choices = null, double minimum = double.NegativeInfinity, double maximum = double.PositiveInfinity)
    {
        if (string.IsNullOrWhiteSpace(name)) throw new ArgumentException("Parameter name must not be empty.", nameof(name));
        ArgumentNullException.ThrowIfNull(defaultText);
        Name = name.Trim().ToLowerInvariant();
        Kind = kind;
        DefaultText = defaultText;
        Unit = unit ?? "";
        Help = help ?? "";
        Choices = choices ?? [];
        Minimum = minimum;
        Maximum = maximum;
        if (kind == SamplerParameterKind.Choice && Choices.Count == 0)
            throw new ArgumentException($"Choice parameter '{Name}' needs at least one choice.", nameof(choices));
        Parse(defaultText);
    }

    /// <summary>Name, lower-case.</summary>
    public string Name { get; }

    /// <summary>Value type.</summary>
    public SamplerParameterKind Kind { get; }

    /// <summary>Default value as text.</summary>
    public string DefaultText { get; }

    /// <summary>Unit of the value, or empty.</summary>
    public string Unit { get; }

    /// <summary>Help text.</summary>
    public string Help { get; }

    /// <summary>Allowed words for a choice parameter.</summary>
    public IReadOnlyList<string> Choices { get; }

    /// <summary>Smallest allowed value (numeric kinds).</summary>
    public double Minimum { get; }

    /// <summary>Largest allowed value (numeric kinds).</summary>
    public double Maximum { get; }

    /// <summary>Parses <paramref name="text"/> into this parameter's value type (see the type remarks).</summary>
    /// <exception cref="ArgumentException">The text does not parse or is out of range; the message names the parameter, the value and what was expected.</exception>
    public object? Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        string t = text.Trim();
        var inv = CultureInfo.InvariantCulture;
        switch (Kind)
        {
            case SamplerParameterKind.Integer:
                if (!int.TryParse(t, NumberStyles.Integer, inv, out int i)) throw Bad(text, "an integer");
                CheckRange(i, text);
                return i;
            case SamplerParameterKind.Real:
                if (!double.TryParse(t, NumberStyles.Float, inv, out double d) || !double.IsFinite(d)) throw Bad(text, "a finite real number");
                CheckRange(d, text);
                return d;
            case SamplerParameterKind.Boolean:
                return t.ToLowerInvariant() switch
                {
                    "true" or "yes" or "1" => true,
                    "false" or "no" or "0" => false,
                    _ => throw Bad(text, "true or false"),
                };
            case SamplerParameterKind.Choice:
                foreach (string c in Choices)
                    if (string.Equals(c, t, StringComparison.OrdinalIgnoreCase)) return c.ToLowerInvariant();
                throw Bad(text, "one of " + string.Join(", ", Choices));
            case SamplerParameterKind.RealTriple:
                return ParseReals(t, 3) ?? throw Bad(text, "three real numbers separated by commas, e.g. 0.1,0,0.25");
            case SamplerParameterKind.Rotation:
                string lower = t.ToLowerInvariant();
                if (lower is "identity" or "none") return (UnitQuaternion?)UnitQuaternion.Identity;
                if (lower == "random") return null;
                double[] q = ParseReals(t, 4) ?? throw Bad(text, "identity, random, or a quaternion w,x,y,z");
                if (q[0] == 0 && q[1] == 0 && q[2] == 0 && q[3] == 0) throw Bad(text, "a quaternion w,x,y,z that is not all zero");
                return (UnitQuaternion?)UnitQuaternion.Normalise(q[0], q[1], q[2], q[3]);
            case SamplerParameterKind.Text:
                return t;
            default:
                throw new InvalidOperationException($"Unknown parameter kind {Kind}.");
        }
    }

    private static double[]? ParseReals(string t, int count)
    {
        string[] parts = t.Split(',', StringSplitOptions.TrimEntries);
        if (parts.Length != count) return null;
        var values = new double[count];
        for (int k = 0; k < count; k++)
            if (!double.TryParse(parts[k], NumberStyles.Float, CultureInfo.InvariantCulture, out values[k]) || !double.IsFinite(values[k])) return null;
        return values;
    }

    private void CheckRange(double v, string text)
    {
        if (v < Minimum || v > Maximum)
        {
            string range = double.IsPositiveInfinity(Maximum)
                ? string.Create(CultureInfo.InvariantCulture, $"a value >= {Minimum}")
                : string.Create(CultureInfo.InvariantCulture, $"a value in [{Minimum}, {Maximum}]");
            throw Bad(text, range);
        }
    }

    private ArgumentException Bad(string text, string expected) =>
        new($"Parameter '{Name}' has value '{text}'; expected {expected}.");
}
