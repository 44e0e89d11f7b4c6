using System.CommandLine;
using System.Globalization;
using Placement.IO;
using Placement.Profiles;

namespace Placement.Commands.Verbs;

/// <summary>
/// The <c>--replace-core</c> option shared by <c>place</c> and <c>inspect</c>, and <c>--write-profile</c>: cut the profile at a
/// radius and replace the inside by a softened point mass plus polytropic gas (<see cref="CoreReplacement"/>).
/// </summary>
/// <remarks>
/// Syntax: <c>radius=R[,softening=H|softening-ratio=F][,index=N|index=local]</c>, lengths in the profile's length unit.
/// Defaults: softening = R (ratio 1), index 3; <c>index=local</c> takes n = 1/(d ln P/d ln ρ − 1) of the profile at R.
/// </remarks>
internal sealed class CoreReplacementArguments
{
    public Option<string?> ReplaceCore { get; } = new("--replace-core")
    {
        Description = "Cut the profile at radius=R and replace the inside by a softened point mass 'core' plus polytropic gas in "
            + "equilibrium with it, matching density, pressure and enclosed mass at the cut: "
            + "'radius=R[,softening=H|softening-ratio=F][,index=N|local]' (lengths in the unit system's length unit; "
            + "defaults softening = R, index 3; 'local' uses the profile's own d ln P/d ln rho at R). Needs a pressure column.",
    };

    public Option<string?> WriteProfile { get; } = new("--write-profile")
    {
        Description = "Write the profile (after --replace-core, if given) as a profile table (r, rho, m, carried quantities) to this file.",
    };

    public void AddTo(Command command, bool withWriteProfile)
    {
        command.Options.Add(ReplaceCore);
        if (withWriteProfile) command.Options.Add(WriteProfile);
    }

    /// <summary>Applies <c>--replace-core</c> when given: the gas profile to use, and the replacement (null when not asked).</summary>
    /// <exception cref="CliException">Malformed specification or impossible request (usage).</exception>
    public (IRadialProfile Body, CoreReplacedProfile? Replaced) Apply(ParseResult parse, IRadialProfile body)
    {
        if (parse.GetValue(ReplaceCore) is not { } spec) return (body, null);
        try
        {
            return ApplySpec(spec, body);
        }
        catch (ArgumentException ex)
        {
            throw new CliException(ExitCodes.Usage, $"--replace-core '{spec}': {Clean(ex.Message)}");
        }
    }

    /// <summary>Writes <c>--write-profile</c> when given (atomically; an existing file only with <paramref name="overwrite"/>).</summary>
    public string? Write(ParseResult parse, IRadialProfile body, CoreReplacedProfile? replaced, bool overwrite)
    {
        if (parse.GetValue(WriteProfile) is not { } path) return null;
        OutputArguments.CheckWritable(overwrite, path);
        var radii = new List<double>(ProfileSampling.Radii(body, 2000));
        if (replaced is not null)
        {
            // A row exactly at the cut, so the table shows the join.
            int at = radii.BinarySearch(replaced.CutRadius);
            if (at < 0) radii.Insert(~at, replaced.CutRadius);
        }
        string description = replaced is null
            ? $"profile {body.Fingerprint}"
            : string.Join('\n', Lines(replaced).Prepend("gas profile after core replacement; m is the gas mass only (add the core mass for the total gravity)"));
        try
        {
            AtomicFile.Write(path, overwrite, stream =>
            {
                using var writer = new StreamWriter(stream, leaveOpen: true);
                ProfileTableWriter.Write(writer, body, radii, description);
            });
        }
        catch (OutputFileExistsException ex)
        {
            throw new CliException(ExitCodes.OutputRefused, $"output '{path}' exists; pass --overwrite to replace it.", ex);
        }
        return path;
    }

    /// <summary>The replacement summary as terminal lines.</summary>
    public static IEnumerable<string> Lines(CoreReplacedProfile replaced)
    {
        var r = replaced.Report;
        var c = CultureInfo.InvariantCulture;
        string l = r.Units.LengthUnitName, m = r.Units.MassUnitName, d = r.Units.DensityUnitName;
        yield return string.Create(c, $"core replacement: cut r_c = {r.CutRadius:G6} {l}, softening h = {r.SofteningLength:G6} {l} (cubic spline, Newtonian beyond h), index n = {r.Index:G4}, K = {r.PolytropicConstant:G6}");
        yield return string.Create(c, $"  core mass m_c = {r.CoreMass:G8} {m} ({(r.CoreMass > 0 ? "point mass 'core'" : "no core needed")}); mass inside the cut {r.OriginalMassInsideCut:G8} -> gas {r.GasMassInsideCut:G8} {m}; removed gas {r.RemovedGasMass:G6} {m}");
        yield return string.Create(c, $"  central density {r.OriginalCentralDensity:G6} -> {r.CentralDensity:G6} {d}");
        yield return string.Create(c, $"  match at the cut (relative): rho {r.DensityMismatch:G3}, P {r.PressureMismatch:G3}, M {r.MassMismatch:G3}");
        yield return string.Create(c, $"  hydrostatic residual |dP/dr + G M rho/r^2|/(G M rho/r^2): inside max {r.HydrostaticInside.Max:G3} rms {r.HydrostaticInside.Rms:G3} ({r.HydrostaticInside.Samples} radii); outside max {r.HydrostaticOutside.Max:G3} rms {r.HydrostaticOutside.Rms:G3} ({r.HydrostaticOutside.Samples} radii)");
    }

    /// <summary>The replacement summary for --json output.</summary>
    public static object Json(CoreReplacedProfile replaced)
    {
        var r = replaced.Report;
        return new
        {
            r.CutRadius, r.SofteningLength, r.Index, r.PolytropicConstant, r.CoreMass, r.OriginalMassInsideCut, r.GasMassInsideCut,
            r.RemovedGasMass, r.OriginalCentralDensity, r.CentralDensity, r.DensityAtCut, r.PressureAtCut, r.DensityMismatch,
            r.PressureMismatch, r.MassMismatch, r.PressureQuantity, hydrostaticInside = r.HydrostaticInside, hydrostaticOutside = r.HydrostaticOutside,
            core = replaced.Core,
        };
    }

    private static (IRadialProfile, CoreReplacedProfile) ApplySpec(string spec, IRadialProfile body)
    {
        double? radius = null, softening = null, ratio = null, index = null;
        bool local = false;
        foreach (string part in spec.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            int eq = part.IndexOf('=', StringComparison.Ordinal);
            string key = eq > 0 ? part[..eq].Trim().ToLowerInvariant() : part;
            string text = eq > 0 ? part[(eq + 1)..].Trim() : "";
            if (key == "index" && text.Equals("local", StringComparison.OrdinalIgnoreCase)) { local = true; continue; }
            if (eq <= 0 || !double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
                throw new ArgumentException($"'{part}' is not key=number (keys: radius, softening, softening-ratio, index).");
            switch (key)
            {
                case "radius": radius = v; break;
                case "softening": softening = v; break;
                case "softening-ratio": ratio = v; break;
                case "index": index = v; break;
                default: throw new ArgumentException($"unknown key '{key}' (keys: radius, softening, softening-ratio, index).");
            }
        }
        if (radius is not { } rc) throw new ArgumentException("give the cut radius as radius=<number>.");
        if (softening is not null && ratio is not null) throw new ArgumentException("give softening or softening-ratio, not both.");
        var options = new CoreReplacementOptions(rc)
        {
            SofteningLength = softening,
            SofteningRatio = ratio ?? CoreReplacementOptions.DefaultSofteningRatio,
            Index = local ? LocalIndex(body, rc) : index ?? CoreReplacementOptions.DefaultIndex,
        };
        var replaced = CoreReplacement.Apply(body, options);
        return (replaced, replaced);
    }

    private static double LocalIndex(IRadialProfile body, double rc)
    {
        if (!(rc > 0 && rc < body.OuterRadius)) return CoreReplacementOptions.DefaultIndex; // Apply reports the bad radius
        return CoreReplacement.LocalIndex(body, rc);
    }

    private static string Clean(string message)
    {
        int at = message.IndexOf(" (Parameter '", StringComparison.Ordinal);
        return at >= 0 ? message[..at] : message;
    }
}
