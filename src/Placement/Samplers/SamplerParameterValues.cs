using Placement.Geometry;

namespace Placement.Samplers;

/// <summary>Parsed parameter values of one sampler, made by <see cref="SamplerDescription.Parse"/>.</summary>
public sealed class SamplerParameterValues
{
    private readonly Dictionary<string, object?> _values;
    private readonly Dictionary<string, string> _texts;

    internal SamplerParameterValues(string sampler, Dictionary<string, object?> values, Dictionary<string, string> texts)
    {
        Sampler = sampler;
        _values = values;
        _texts = texts;
    }

    /// <summary>Name of the sampler these values belong to.</summary>
    public string Sampler { get; }

    /// <summary>Every parameter as name → the text it was parsed from (for provenance).</summary>
    public IReadOnlyDictionary<string, string> Texts => _texts;

    /// <summary>An integer parameter.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not an integer.</exception>
    public int GetInt32(string name) => (int)Get(name)!;

    /// <summary>A real parameter.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not real.</exception>
    public double GetDouble(string name) => (double)Get(name)!;

    /// <summary>A boolean parameter.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not boolean.</exception>
    public bool GetBoolean(string name) => (bool)Get(name)!;

    /// <summary>A choice parameter, as its canonical lower-case word.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not a choice.</exception>
    public string GetChoice(string name) => (string)Get(name)!;

    /// <summary>A three-component real parameter.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not a triple.</exception>
    public (double X, double Y, double Z) GetTriple(string name)
    {
        var v = (double[])Get(name)!;
        return (v[0], v[1], v[2]);
    }

    /// <summary>A text parameter (e.g. a file path), possibly empty.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not text.</exception>
    public string GetText(string name) => (string)Get(name)!;

    /// <summary>A rotation parameter: the quaternion given, or null when the user asked for a random one.</summary>
    /// <exception cref="KeyNotFoundException">No such parameter.</exception>
    /// <exception cref="InvalidCastException">The parameter is not a rotation.</exception>
    public UnitQuaternion? GetRotation(string name) => (UnitQuaternion?)Get(name);

    private object? Get(string name) =>
        _values.TryGetValue(name, out object? v)
            ? v
            : throw new KeyNotFoundException($"Sampler '{Sampler}' has no parameter '{name}'.");
}
