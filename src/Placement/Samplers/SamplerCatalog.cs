using System.Reflection;
using Placement.Samplers.Lattices;
using Placement.Samplers.Shells;

namespace Placement.Samplers;

/// <summary>Samplers by name (case-insensitive): the built-ins plus any a user registers or discovers in an assembly.</summary>
/// <remarks>
/// A catalogue is an ordinary object, not a process-wide registry: make one with <see cref="CreateDefault"/> and
/// add to it. Each entry is a factory, so every lookup returns a fresh sampler.
/// </remarks>
public sealed class SamplerCatalog
{
    private readonly Dictionary<string, Func<IPointSampler>> _factories = new(StringComparer.OrdinalIgnoreCase);

    /// <summary>An empty catalogue.</summary>
    public SamplerCatalog()
    {
    }

    /// <summary>A catalogue holding every built-in sampler.</summary>
    public static SamplerCatalog CreateDefault()
    {
        var c = new SamplerCatalog();
        c.Register(() => new HealpixShellSampler());
        c.Register(() => new RandomShellSampler());
        c.Register(() => new StratifiedShellSampler());
        c.Register(() => new StretchedLatticeSampler());
        c.Register(() => new PoissonSampler());
        c.Register(() => new Glass.GlassSampler());
        c.Register(() => new Relaxed.RelaxedSampler());
        c.Register(() => new Relaxed.VoronoiRelaxedSampler());
        return c;
    }

    /// <summary>Registered names, sorted.</summary>
    public IReadOnlyList<string> Names
    {
        get
        {
            var names = new List<string>(_factories.Keys);
            names.Sort(StringComparer.OrdinalIgnoreCase);
            return names;
        }
    }

    /// <summary>Registers a sampler factory under the name of the sampler it makes.</summary>
    /// <exception cref="ArgumentException">The name is empty or already registered.</exception>
    public void Register(Func<IPointSampler> factory)
    {
        ArgumentNullException.ThrowIfNull(factory);
        string name = factory().Name;
        if (string.IsNullOrWhiteSpace(name)) throw new ArgumentException("Sampler name must not be empty.", nameof(factory));
        if (!_factories.TryAdd(name, factory))
            throw new ArgumentException($"A sampler named '{name}' is already registered.", nameof(factory));
    }

    /// <summary>
    /// Registers every public, non-abstract class in <paramref name="assembly"/> that implements
    /// <see cref="IPointSampler"/> and has a public parameterless constructor; returns how many were added.
    /// </summary>
    /// <exception cref="ArgumentException">A discovered sampler's name is already registered.</exception>
    public int RegisterFromAssembly(Assembly assembly)
    {
        ArgumentNullException.ThrowIfNull(assembly);
        int added = 0;
        foreach (var type in assembly.GetExportedTypes())
        {
            if (type.IsAbstract || !type.IsClass || !typeof(IPointSampler).IsAssignableFrom(type)) continue;
            if (type.GetConstructor(Type.EmptyTypes) is null) continue;
            var t = type;
            Register(() => (IPointSampler)Activator.CreateInstance(t)!);
            added++;
        }
        return added;
    }

    /// <summary>True when a sampler of that name is registered.</summary>
    public bool Contains(string name) => _factories.ContainsKey(name?.Trim() ?? "");

    /// <summary>A new instance of the sampler called <paramref name="name"/> (case-insensitive).</summary>
    /// <exception cref="KeyNotFoundException">No such sampler; the message lists the known names.</exception>
    public IPointSampler Create(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        if (_factories.TryGetValue(name.Trim(), out var f)) return f();
        throw new KeyNotFoundException($"Unknown sampler '{name}'; known samplers: {string.Join(", ", Names)}.");
    }

    /// <summary>Descriptions of every registered sampler, sorted by name (for help text).</summary>
    public IReadOnlyList<SamplerDescription> DescribeAll()
    {
        var list = new List<SamplerDescription>();
        foreach (string n in Names) list.Add(Create(n).Describe());
        return list;
    }
}
