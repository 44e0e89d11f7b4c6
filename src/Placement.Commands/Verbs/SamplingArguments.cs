using System.CommandLine;
using Placement.Parallelism;
using Placement.Samplers;

namespace Placement.Commands.Verbs;

/// <summary>Options that choose and configure a sampler: name, count, seed, mode, parameters and threads.</summary>
internal sealed class SamplingArguments
{
    public Option<string> Sampler { get; } = new("--sampler", "-s")
    {
        Description = "Sampler name (see 'placement samplers').",
        DefaultValueFactory = _ => "healpix-shells",
    };

    public Option<int> Count { get; } = new("--count", "-n")
    {
        Description = "Number of points to place (samplers that cannot hit it exactly report the count they used).",
        DefaultValueFactory = _ => 100_000,
    };

    public Option<ulong> Seed { get; } = new("--seed")
    {
        Description = "Random seed; the same seed gives the same bits on any number of threads.",
        DefaultValueFactory = _ => 1UL,
    };

    public Option<string> Mode { get; } = new("--mode")
    {
        Description = "sph: equal-mass particles (final masses M/N); mesh: mesh-generating points (masses from their Voronoi cells when checked).",
        DefaultValueFactory = _ => "sph",
    };

    public Option<string[]> Parameters { get; } = new("--param")
    {
        Description = "Sampler parameter as key=value (repeatable); see 'placement samplers' for each sampler's parameters.",
        AllowMultipleArgumentsPerToken = true,
    };

    public Option<int> Threads { get; } = new("--threads")
    {
        Description = "Worker threads (0 = one per processor). Never changes the result.",
        DefaultValueFactory = _ => 0,
    };

    public SamplingArguments(bool includeSampler = true)
    {
        _includeSampler = includeSampler;
        Mode.AcceptOnlyFromAmong("sph", "mesh");
    }

    private readonly bool _includeSampler;

    public void AddTo(Command command)
    {
        if (_includeSampler) command.Options.Add(Sampler);
        command.Options.Add(Count);
        command.Options.Add(Seed);
        command.Options.Add(Mode);
        if (_includeSampler) command.Options.Add(Parameters);
        command.Options.Add(Threads);
    }

    public ParallelSettings Parallel(ParseResult parse)
    {
        int threads = parse.GetValue(Threads);
        if (threads < 0) throw new CliException(ExitCodes.Usage, $"--threads must be >= 0, got {threads}.");
        return new ParallelSettings { MaxDegreeOfParallelism = threads == 0 ? -1 : threads };
    }

    public SamplingMode ModeOf(ParseResult parse) =>
        parse.GetValue(Mode) == "mesh" ? SamplingMode.MeshGenerators : SamplingMode.EqualMassParticles;

    /// <summary>The request for <paramref name="sampler"/>, with its parameters parsed from <c>--param</c>.</summary>
    public SamplingRequest Request(ParseResult parse, Profiles.IRadialProfile profile, IPointSampler sampler, bool useParameters = true)
    {
        int count = parse.GetValue(Count);
        if (count < 1) throw new CliException(ExitCodes.Usage, $"--count must be >= 1, got {count}.");
        var given = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        if (useParameters)
        {
            foreach (string item in parse.GetValue(Parameters) ?? [])
            {
                int eq = item.IndexOf('=', StringComparison.Ordinal);
                if (eq <= 0) throw new CliException(ExitCodes.Usage, $"--param '{item}' is not of the form key=value.");
                given[item[..eq].Trim()] = item[(eq + 1)..].Trim();
            }
        }
        SamplerParameterValues values;
        try
        {
            values = sampler.Describe().Parse(given);
        }
        catch (ArgumentException ex)
        {
            throw new CliException(ExitCodes.Usage, $"sampler '{sampler.Name}': {ex.Message}");
        }
        return new SamplingRequest(profile, count)
        {
            Seed = parse.GetValue(Seed),
            Mode = ModeOf(parse),
            Parameters = values,
            Parallel = Parallel(parse),
        };
    }
}
