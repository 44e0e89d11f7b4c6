using System.CommandLine;
using Placement.Bodies;
using Placement.Profiles;

namespace Placement.Commands.Verbs;

/// <summary>
/// The <c>place</c> options for the body's physics: thermodynamic fields per point, resolution of pressure scale heights by
/// the placed points, and the energy budget. <see cref="Parse"/> turns them into a <see cref="BodyRequest"/> and refuses
/// bad combinations before anything is placed or written.
/// </summary>
internal sealed class BodyArguments
{
    public Option<double?> Gamma { get; } = new("--gamma")
    {
        Description = "Give every point a specific internal energy (column internal_energy) for this adiabatic index, and carry the profile's "
            + "quantities (pressure, temperature, composition ...) as columns. Needs a profile with pressure, or --energy-source profile.",
    };

    public Option<string> EnergySource { get; } = new("--energy-source")
    {
        Description = "Where u comes from: 'ideal-gas' (u = P/((gamma-1) rho)) or 'profile' / 'profile:NAME' (the table's own specific-energy column, e.g. erg/g).",
        DefaultValueFactory = _ => "ideal-gas",
    };

    public Option<string> Match { get; } = new("--match")
    {
        Description = "Profile quantities matched exactly: 'density+pressure' (u of the profile at the point's radius) or 'density+entropy' "
            + "(the profile's adiabat K = P/rho^gamma at the point's own density); the report gives the deviation of the other.",
        DefaultValueFactory = _ => "density+pressure",
    };

    public Option<string?> PointDensity { get; } = new("--point-density")
    {
        Description = "The points' own density estimate for the entropy match, the deviations and the resolution: 'sph' (Wendland C2, 64 neighbours) "
            + "or 'voronoi' (m/V). Default: voronoi in mesh mode, sph otherwise.",
    };

    public Option<bool> Resolution { get; } = new("--resolution")
    {
        Description = "Report cells per pressure scale height H_P = P/(rho g) of the placed points per radial bin (no threshold: see --resolution-threshold).",
    };

    public Option<double?> ResolutionThreshold { get; } = new("--resolution-threshold")
    {
        Description = "Cells per H_P you want: the report adds the number of points that reaches it everywhere outside --inner-radius "
            + "(your threshold; none is built in). Implies --resolution.",
    };

    public Option<double?> InnerRadius { get; } = new("--inner-radius")
    {
        Description = "Leave points inside this radius (length units) out of the resolution requirement. Default: the softening length "
            + "of a core from --replace-core (Newtonian gravity starts there), else 0.",
    };

    public Option<bool> Energy { get; } = new("--energy")
    {
        Description = "Report the energy budget: gravitational (octree), thermal and kinetic energy of the points against the profile's integrals.",
    };

    public Option<double> OpeningAngle { get; } = new("--opening-angle")
    {
        Description = "Opening angle theta in [0, 1] of the octree for the points' gravitational energy (0 = exact pairwise sum, O(N^2)).",
        DefaultValueFactory = _ => 0.5,
    };

    public Option<bool> NoCheck { get; } = new("--no-check")
    {
        Description = "With --report: skip the Voronoi/SPH quality check and write only the body section (thermodynamics, resolution, energy).",
    };

    public void AddTo(Command command)
    {
        foreach (var option in new Option[] { Gamma, EnergySource, Match, PointDensity, Resolution, ResolutionThreshold, InnerRadius, Energy, OpeningAngle, NoCheck })
            command.Options.Add(option);
    }

    /// <summary>Reads and checks the options against the profile; null when no body feature was asked for.</summary>
    /// <exception cref="CliException">A bad value or combination (usage exit code).</exception>
    public BodyRequest? Parse(ParseResult parse, IRadialProfile profile, bool meshMode)
    {
        double? gamma = parse.GetValue(Gamma);
        double? threshold = parse.GetValue(ResolutionThreshold);
        bool resolution = parse.GetValue(Resolution) || threshold is not null;
        bool energy = parse.GetValue(Energy);
        string source = parse.GetValue(EnergySource)!.Trim();
        string match = parse.GetValue(Match)!.Trim().ToLowerInvariant();
        if (gamma is null && (parse.GetResult(EnergySource) is { Implicit: false } || parse.GetResult(Match) is { Implicit: false }))
            throw new CliException(ExitCodes.Usage, "--energy-source and --match need --gamma (the adiabatic index of the gas).");
        ThermodynamicOptions? thermo = null;
        if (gamma is { } g)
        {
            if (!(g > 1) || !double.IsFinite(g)) throw new CliException(ExitCodes.Usage, $"--gamma must be a finite number > 1, got {g}.");
            var kind = match switch
            {
                "density+pressure" => ThermodynamicMatch.DensityPressure,
                "density+entropy" => ThermodynamicMatch.DensityEntropy,
                _ => throw new CliException(ExitCodes.Usage, $"--match '{match}' is not 'density+pressure' or 'density+entropy'."),
            };
            thermo = new ThermodynamicOptions { Gamma = g, Match = kind };
            if (source.Equals("ideal-gas", StringComparison.OrdinalIgnoreCase))
            {
                if (ScaleHeights.PressureQuantity(profile) is null)
                    throw new CliException(ExitCodes.Usage, "--gamma with --energy-source ideal-gas needs a profile that carries a pressure (a column with a pressure unit such as dyn/cm^2); "
                        + $"this profile carries: {QuantityList(profile)}.");
            }
            else if (source.Equals("profile", StringComparison.OrdinalIgnoreCase) || source.StartsWith("profile:", StringComparison.OrdinalIgnoreCase))
            {
                string? name = source.Length > "profile:".Length ? source["profile:".Length..].Trim() : ThermodynamicFields.InternalEnergyQuantity(profile);
                bool found = false;
                foreach (var q in profile.Quantities)
                    if (q.Name == name && ThermodynamicFields.IsSpecificEnergy(q.Unit)) found = true;
                if (!found)
                    throw new CliException(ExitCodes.Usage, $"--energy-source '{source}': the profile has no specific-energy quantity{(name is null ? "" : $" '{name}'")} "
                        + $"(a column with a unit such as erg/g); it carries: {QuantityList(profile)}.");
                thermo = thermo with { Source = InternalEnergySource.Profile, InternalEnergyQuantity = name };
            }
            else throw new CliException(ExitCodes.Usage, $"--energy-source '{source}' is not 'ideal-gas', 'profile' or 'profile:NAME'.");
        }
        if (resolution)
        {
            if (ScaleHeights.PressureQuantity(profile) is null)
                throw new CliException(ExitCodes.Usage, $"--resolution needs a profile that carries a pressure; this profile carries: {QuantityList(profile)}.");
            if (threshold is { } k && (!(k > 0) || !double.IsFinite(k)))
                throw new CliException(ExitCodes.Usage, $"--resolution-threshold must be a finite number > 0, got {k}.");
        }
        double inner = parse.GetValue(InnerRadius) ?? (profile.CentralPointMass is { } core ? core.SofteningLength : 0.0);
        if (!(inner >= 0) || !(inner < profile.OuterRadius))
            throw new CliException(ExitCodes.Usage, $"--inner-radius must lie in [0, {profile.OuterRadius:G6}) (the profile radius), got {inner}.");
        double theta = parse.GetValue(OpeningAngle);
        if (!(theta >= 0 && theta <= 1)) throw new CliException(ExitCodes.Usage, $"--opening-angle must lie in [0, 1], got {theta}.");
        string density = (parse.GetValue(PointDensity) ?? (meshMode ? "voronoi" : "sph")).Trim().ToLowerInvariant();
        if (density is not ("sph" or "voronoi")) throw new CliException(ExitCodes.Usage, $"--point-density '{density}' is not 'sph' or 'voronoi'.");
        if (thermo is null && !resolution && !energy) return null;
        return new BodyRequest(thermo, resolution, threshold, inner, energy, theta, density);
    }

    public bool SkipsCheck(ParseResult parse) => parse.GetValue(NoCheck);

    private static string QuantityList(IRadialProfile profile)
    {
        var names = new List<string>();
        foreach (var q in profile.Quantities) names.Add($"{q.Name} [{q.Unit.Name}]");
        return names.Count == 0 ? "nothing but density" : string.Join(", ", names);
    }
}
