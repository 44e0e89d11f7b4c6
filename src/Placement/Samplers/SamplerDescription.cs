namespace Placement.Samplers;

/// <summary>What a sampler is and which parameters it takes: used for help text and for files' provenance.</summary>
/// <param name="Name">Catalogue name, lower-case with dashes, e.g. <c>healpix-shells</c>.</param>
/// <param name="Summary">One or two sentences on what the sampler does and when to use it.</param>
/// <param name="Parameters">The parameters it accepts, each with default, unit and help.</param>
public sealed record SamplerDescription(string Name, string Summary, IReadOnlyList<SamplerParameter> Parameters)
{
    /// <summary>Values of every parameter at its default.</summary>
    public SamplerParameterValues Defaults() => Parse(new Dictionary<string, string>());

    /// <summary>
    /// Parses parameter values given as name → text (e.g. from a command line); parameters not given take their
    /// defaults. Names are case-insensitive.
    /// </summary>
    /// <param name="given">Parameter texts by name.</param>
    /// <exception cref="ArgumentException">A name is not a parameter of this sampler (the message lists the known ones), or a value does not parse.</exception>
    public SamplerParameterValues Parse(IReadOnlyDictionary<string, string> given)
    {
        ArgumentNullException.ThrowIfNull(given);
        var texts = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        var values = new Dictionary<string, object?>(StringComparer.OrdinalIgnoreCase);
        foreach (var (name, text) in given)
        {
            if (Find(name) is null)
            {
                var known = new List<string>();
                foreach (var p in Parameters) known.Add(p.Name);
                throw new ArgumentException(
                    $"Sampler '{Name}' has no parameter '{name}'; known parameters: {(known.Count == 0 ? "(none)" : string.Join(", ", known))}.",
                    nameof(given));
            }
        }
        foreach (var p in Parameters)
        {
            string text = p.DefaultText;
            foreach (var (name, t) in given)
                if (string.Equals(name.Trim(), p.Name, StringComparison.OrdinalIgnoreCase)) text = t;
            values[p.Name] = p.Parse(text);
            texts[p.Name] = text.Trim();
        }
        return new SamplerParameterValues(Name, values, texts);
    }

    private SamplerParameter? Find(string name)
    {
        foreach (var p in Parameters)
            if (string.Equals(p.Name, name.Trim(), StringComparison.OrdinalIgnoreCase)) return p;
        return null;
    }
}
