using System.CommandLine;
using System.Globalization;
using Placement.Bodies;
using Placement.Bodies.Background;
using Placement.IO;
using Placement.Profiles;
using Placement.Samplers;

namespace Placement.Commands.Verbs;

/// <summary>
/// The <c>place</c> options that add to the body: <c>--companion</c> (repeatable) and <c>--background</c>, their parsing
/// into library requests, the assembly (<see cref="BodyAssembly"/>) and the lines printed about it.
/// </summary>
internal sealed class CompanionBackgroundArguments
{
    public Option<string[]> Companions { get; } = new("--companion")
    {
        Description = "Add a companion point mass on a two-body orbit about the body (repeatable): "
            + "'mass=M,separation=A[,eccentricity=E][,softening=H][,phase=apastron|periastron|DEG][,inclination=DEG][,name=NAME]'. "
            + "A is the semi-major axis (length units), the orbit lies in the x-y plane (tilted about x by the inclination) with "
            + "periastron on +x; default phase apastron. Everything is then moved into the centre-of-mass frame.",
    };

    public Option<string?> Background { get; } = new("--background")
    {
        Description = "Fill a cube around the body with a low-density medium: 'box=L,density=RHO[,pressure=P][,periodic][,growth=G][,spacing=S][,max-spacing=S]' "
            + "(side L, density and pressure in the profile's units). Its points have layer -2; their spacing starts at the body's "
            + "surface spacing (or S) and grows by a factor 1+G (default 0.1) per shell out to the box edge.",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(Companions);
        command.Options.Add(Background);
    }

    /// <summary>True when a background was asked for (the mesh masses then come from the joint tessellation).</summary>
    public bool HasBackground(ParseResult parse) => parse.GetValue(Background) is not null;

    /// <summary>Parses both options; throws a usage error naming the bad token.</summary>
    public BodyAssemblyRequest? Request(ParseResult parse, SamplingRequest sampling)
    {
        var companions = new List<CompanionOrbit>();
        foreach (string spec in parse.GetValue(Companions) ?? [])
            companions.Add(ParseCompanion(spec, companions.Count));
        BackgroundSettings? background = parse.GetValue(Background) is { } b ? ParseBackground(b) : null;
        if (companions.Count == 0 && background is null) return null;
        return new BodyAssemblyRequest
        {
            Companions = companions,
            Background = background,
            MeshGenerators = sampling.Mode == SamplingMode.MeshGenerators,
            Seed = sampling.Seed,
            Parallel = sampling.Parallel,
        };
    }

    /// <summary>Runs the assembly, turning range errors into usage errors.</summary>
    public static (PointTable Table, BodyAssemblySummary Summary) Assemble(CliContext context, PointTable table, IRadialProfile body, BodyAssemblyRequest request)
    {
        try
        {
            return context.Stage("adding companions and background, moving to the centre-of-mass frame", _ => BodyAssembly.Assemble(table, body, request));
        }
        catch (ArgumentException e)
        {
            string message = e.ParamName is null ? e.Message : e.Message.Replace($" (Parameter '{e.ParamName}')", "", StringComparison.Ordinal);
            throw new CliException(ExitCodes.Usage, message);
        }
    }

    /// <summary>Lines for the terminal summary.</summary>
    public static IEnumerable<string> Describe(BodyAssemblySummary summary, Units.UnitSystem units)
    {
        var inv = CultureInfo.InvariantCulture;
        foreach (var p in summary.PointMasses)
            yield return string.Create(inv,
                $"point mass {p.Name}: m = {p.Mass:G6} {units.MassUnitName}, softening {p.SofteningLength:G4}, at ({p.X:G5}, {p.Y:G5}, {p.Z:G5}), v = ({p.Vx:G5}, {p.Vy:G5}, {p.Vz:G5})");
        yield return string.Create(inv,
            $"centre-of-mass frame: shifted by ({summary.Shift.X:G5}, {summary.Shift.Y:G5}, {summary.Shift.Z:G5}) and v ({summary.Shift.Vx:G5}, {summary.Shift.Vy:G5}, {summary.Shift.Vz:G5}); residual |x_cm| = {summary.ResidualOffset:E1}, |v_cm| = {summary.ResidualVelocity:E1}");
        if (summary.Background is { } b)
            yield return string.Create(inv,
                $"background: {b.Points:N0} points (layer {b.Layer}) in a {(b.Box.Periodic ? "periodic" : "walled")} box of side {b.Box.MaxX - b.Box.MinX:G5} {units.LengthUnitName}, density {b.Box.Density:G4}, pressure {b.Box.Pressure:G4}; mass {b.Mass:G6} of rho*(V_box - V_body) = {b.ExpectedMass:G6}; spacing {b.SurfaceSpacing:G3} at r = {b.InnerRadius:G4} to {b.OuterSpacing:G3} in {b.Shells} shells; body cells / body volume = {b.BodyCellVolumeRatio:F4}");
    }

    private static CompanionOrbit ParseCompanion(string spec, int index)
    {
        var values = Pairs("--companion", spec, ["mass", "separation", "eccentricity", "softening", "phase", "inclination", "name"], []);
        double Number(string key, double fallback) => values.TryGetValue(key, out string? text) ? ToNumber("--companion", spec, key, text) : fallback;
        if (!values.ContainsKey("mass") || !values.ContainsKey("separation"))
            throw new CliException(ExitCodes.Usage, $"--companion '{spec}' needs at least 'mass=M,separation=A'.");
        double mass = Number("mass", 0), a = Number("separation", 0), e = Number("eccentricity", 0), h = Number("softening", 0);
        double inclination = Number("inclination", 0) * Math.PI / 180;
        string phaseText = values.GetValueOrDefault("phase", "apastron");
        double phase = phaseText.ToLowerInvariant() switch
        {
            "apastron" => Math.PI,
            "periastron" => 0,
            _ => ToNumber("--companion", spec, "phase", phaseText) * Math.PI / 180,
        };
        string name = values.GetValueOrDefault("name", index == 0 ? "companion" : "companion" + (index + 1).ToString(inv));
        if (!(mass > 0)) Bad("--companion", spec, "mass=" + values["mass"], "the mass must be positive");
        if (!(a > 0)) Bad("--companion", spec, "separation=" + values["separation"], "the separation (semi-major axis) must be positive");
        if (!(e >= 0 && e < 1)) Bad("--companion", spec, "eccentricity=" + values["eccentricity"], "the eccentricity must satisfy 0 <= e < 1");
        if (!(h >= 0)) Bad("--companion", spec, "softening=" + values["softening"], "the softening length must be >= 0");
        if (name.Length == 0 || !name.All(c => char.IsAsciiLetterOrDigit(c) || c is '_' or '-'))
            Bad("--companion", spec, "name=" + name, "names use letters, digits, '_' and '-'");
        return new CompanionOrbit(name, mass, a, e, h, phase, inclination);
    }

    private static readonly CultureInfo inv = CultureInfo.InvariantCulture;

    private static BackgroundSettings ParseBackground(string spec)
    {
        var values = Pairs("--background", spec, ["box", "density", "pressure", "growth", "spacing", "max-spacing"], ["periodic"]);
        double Number(string key, double fallback) => values.TryGetValue(key, out string? text) ? ToNumber("--background", spec, key, text) : fallback;
        if (!values.ContainsKey("box") || !values.ContainsKey("density"))
            throw new CliException(ExitCodes.Usage, $"--background '{spec}' needs at least 'box=L,density=RHO'.");
        var settings = new BackgroundSettings
        {
            BoxSide = Number("box", 0),
            Density = Number("density", 0),
            Pressure = Number("pressure", 0),
            Periodic = values.ContainsKey("periodic"),
            SpacingGrowth = Number("growth", 0.1),
            SurfaceSpacing = Number("spacing", double.NaN),
            MaximumSpacing = Number("max-spacing", double.PositiveInfinity),
        };
        try
        {
            settings.Validate();
        }
        catch (ArgumentException e)
        {
            throw new CliException(ExitCodes.Usage, $"--background '{spec}': {e.Message}");
        }
        return settings;
    }

    /// <summary>Splits 'k=v,k=v,flag' into a dictionary, refusing unknown keys and repeated keys by name.</summary>
    private static Dictionary<string, string> Pairs(string option, string spec, string[] keys, string[] flags)
    {
        var result = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (string raw in spec.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            int eq = raw.IndexOf('=', StringComparison.Ordinal);
            string key = (eq < 0 ? raw : raw[..eq]).Trim().ToLowerInvariant();
            bool isFlag = eq < 0 && Array.IndexOf(flags, key) >= 0;
            if (!isFlag && (eq <= 0 || Array.IndexOf(keys, key) < 0))
                Bad(option, spec, raw, $"expected one of {string.Join(", ", keys.Select(k => k + "=..").Concat(flags))}");
            if (!result.TryAdd(key, isFlag ? "" : raw[(eq + 1)..].Trim()))
                Bad(option, spec, raw, "this key is given twice");
        }
        return result;
    }

    private static double ToNumber(string option, string spec, string key, string text)
    {
        if (!double.TryParse(text, NumberStyles.Float, inv, out double value) || !double.IsFinite(value))
            Bad(option, spec, key + "=" + text, "not a finite number");
        return value;
    }

    private static void Bad(string option, string spec, string token, string reason) =>
        throw new CliException(ExitCodes.Usage, $"{option} '{spec}': bad token '{token}': {reason}.");
}
