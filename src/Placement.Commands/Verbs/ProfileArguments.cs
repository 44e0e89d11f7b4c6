using System.CommandLine;
using System.Globalization;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Commands.Verbs;

/// <summary>
/// The options every command uses to name a profile: a table file with its column map, a built-in analytic body,
/// or the built-in demo body.
/// </summary>
/// <remarks>
/// <c>--profile</c> takes a path to a profile table, <c>demo</c> (the invented two-zone star), or an analytic body
/// <c>kind:key=value,…</c>: <c>uniform:mass=1,radius=1</c>, <c>polytrope:n=1.5,mass=1,radius=1</c>,
/// <c>plummer:mass=1,scale=0.1,radius=1</c>, <c>hernquist:mass=1,scale=0.1,radius=1</c>. Analytic bodies are in the
/// unit system of <c>--units</c> (default solar); tables are converted into it.
/// </remarks>
internal sealed class ProfileArguments
{
    public Option<string> Profile { get; } = new("--profile", "-p")
    {
        Description = "Profile: a table file, 'demo' (an invented two-zone star), or an analytic body such as "
            + "'polytrope:n=3,mass=1,radius=1', 'plummer:mass=1,scale=0.2,radius=2', 'hernquist:mass=1,scale=0.2,radius=5', 'uniform:mass=1,radius=1'.",
        Required = true,
    };

    public Option<string> Units { get; } = new("--units")
    {
        Description = "Unit system of the profile and every output: solar (R_sun, M_sun, G = 1), cgs, or dimensionless.",
        DefaultValueFactory = _ => "solar",
    };

    public Option<string?> RadiusColumn { get; } = new("--radius-column")
    {
        Description = "Table column holding the radius, as name or name:unit (e.g. r:R_sun). Default 'r' with the unit from the header.",
    };

    public Option<string?> MassColumn { get; } = new("--mass-coordinate-column")
    {
        Description = "Table column holding the enclosed mass as the independent coordinate (instead of a radius column), as name:unit.",
    };

    public Option<string?> DensityColumn { get; } = new("--density-column")
    {
        Description = "Table column holding the density, as name or name:unit (e.g. rho:g/cm^3). Default 'rho'.",
    };

    public Option<string?> EnclosedMassColumn { get; } = new("--enclosed-mass-column")
    {
        Description = "Optional table column with the enclosed mass, checked against the integrated density.",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(Profile);
        command.Options.Add(Units);
        command.Options.Add(RadiusColumn);
        command.Options.Add(MassColumn);
        command.Options.Add(DensityColumn);
        command.Options.Add(EnclosedMassColumn);
    }

    /// <summary>Loads the profile the options name; warnings about it (<see cref="ProfileSummary.Notes"/>) go to
    /// <paramref name="context"/>'s informational lines when one is given.</summary>
    /// <exception cref="CliException">Bad specification (usage) or unreadable table (bad input).</exception>
    public IRadialProfile Load(ParseResult parse, CliContext? context = null)
    {
        var profile = LoadQuietly(parse);
        if (context is not null) Notify(context, profile);
        return profile;
    }

    /// <summary>Writes the warnings about a loaded table (<see cref="ProfileSummary.Notes"/>) as informational lines.</summary>
    public static void Notify(CliContext context, IRadialProfile profile)
    {
        if (profile is not TabulatedProfile) return;
        foreach (string note in ProfileSummary.Of(profile).Notes()) context.Info(note);
    }

    private IRadialProfile LoadQuietly(ParseResult parse)
    {
        string spec = parse.GetValue(Profile)!.Trim();
        UnitSystem units;
        try
        {
            units = UnitSystem.Parse(parse.GetValue(Units)!);
        }
        catch (ArgumentException ex)
        {
            throw new CliException(ExitCodes.Usage, ex.Message);
        }
        if (string.Equals(spec, "demo", StringComparison.OrdinalIgnoreCase)) return DemoBody.Create(units);
        int colon = spec.IndexOf(':', StringComparison.Ordinal);
        string kind = colon > 0 ? spec[..colon].ToLowerInvariant() : "";
        if (kind is "uniform" or "polytrope" or "plummer" or "hernquist") return Analytic(kind, spec[(colon + 1)..], units);
        if (!File.Exists(spec))
            throw new CliException(ExitCodes.BadInput, $"profile '{spec}' is neither an existing file, 'demo', nor an analytic body (uniform:, polytrope:, plummer:, hernquist:).");
        var map = ProfileColumnMap.Default;
        string? radius = parse.GetValue(RadiusColumn), massCoordinate = parse.GetValue(MassColumn);
        if (radius is not null && massCoordinate is not null)
            throw new CliException(ExitCodes.Usage, "give either --radius-column or --mass-coordinate-column, not both.");
        if (radius is not null) map = map with { Radius = radius };
        if (massCoordinate is not null) map = map with { Radius = null, MassCoordinate = massCoordinate };
        if (parse.GetValue(DensityColumn) is { } rho) map = map with { Density = rho };
        if (parse.GetValue(EnclosedMassColumn) is { } m) map = map with { EnclosedMass = m };
        try
        {
            return ProfileTableReader.Read(spec, new ProfileTableOptions { Columns = map, TargetUnits = units });
        }
        catch (ProfileFormatException ex)
        {
            throw new CliException(ExitCodes.BadInput, ex.Message, ex);
        }
    }

    private static IRadialProfile Analytic(string kind, string body, UnitSystem units)
    {
        var values = new Dictionary<string, double>(StringComparer.OrdinalIgnoreCase);
        foreach (string part in body.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            int eq = part.IndexOf('=', StringComparison.Ordinal);
            if (eq <= 0 || !double.TryParse(part[(eq + 1)..], NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
                throw new CliException(ExitCodes.Usage, $"profile parameter '{part}' of '{kind}' is not of the form key=number.");
            values[part[..eq].Trim()] = v;
        }
        double Get(string key, double? fallback = null)
        {
            if (values.Remove(key, out double v)) return v;
            if (fallback is { } f) return f;
            throw new CliException(ExitCodes.Usage, $"profile '{kind}' needs '{key}=<number>'.");
        }
        try
        {
            IRadialProfile profile = kind switch
            {
                "uniform" => new UniformSphere(Get("mass", 1), Get("radius", 1), units),
                "polytrope" => new Polytrope(Get("n"), Get("mass", 1), Get("radius", 1), units),
                "plummer" => new PlummerSphere(Get("mass", 1), Get("scale"), Get("radius"), units),
                _ => new HernquistSphere(Get("mass", 1), Get("scale"), Get("radius"), units),
            };
            if (values.Count > 0)
                throw new CliException(ExitCodes.Usage, $"profile '{kind}' has no parameter(s) {string.Join(", ", values.Keys)}.");
            return profile;
        }
        catch (ArgumentException ex)
        {
            throw new CliException(ExitCodes.Usage, $"profile '{kind}': {ex.Message}");
        }
    }
}
