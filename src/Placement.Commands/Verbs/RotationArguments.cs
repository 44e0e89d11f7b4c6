using System.Globalization;
using Placement.Bodies;
using Placement.Profiles;

namespace Placement.Commands.Verbs;

/// <summary>Parses <c>--rotation</c>: 'omega=W', 'breakup=F' or 'table=FILE' into Ω(r) and a one-line description.</summary>
internal static class RotationArguments
{
    public const string Help =
        "Give the points a rotation velocity about the z axis: 'omega=W' (W in 1/time of the unit system), 'breakup=F' (F times the "
        + "break-up rate sqrt(GM/R^3)) or 'table=FILE' (Omega(r) from a two-column file with header 'radius [unit] omega [unit]', "
        + "monotone cubic between rows, constant beyond the ends); written as the 'velocity' column. Default: at rest (no column).";

    /// <summary>Ω(r) in 1/time units of <paramref name="body"/>, and a description for the velocity column.</summary>
    /// <exception cref="CliException">The specification is malformed (usage error).</exception>
    public static (Func<double, double> Omega, string Description, string? Note) Parse(string spec, IRadialProfile body)
    {
        int eq = spec.IndexOf('=', StringComparison.Ordinal);
        string key = eq > 0 ? spec[..eq].Trim().ToLowerInvariant() : "";
        string value = eq > 0 ? spec[(eq + 1)..].Trim() : "";
        if (key == "table")
        {
            if (value.Length == 0) throw new CliException(ExitCodes.Usage, $"--rotation '{spec}': 'table=' needs a file name.");
            var table = AngularVelocityTable.Read(value, body.Units);
            string? note = table.Covers(body.OuterRadius) ? null
                : string.Create(CultureInfo.InvariantCulture,
                    $"the rotation table covers r = {table.Radius[0]:G6} to {table.Radius[^1]:G6}; Omega is held at its end values outside that range (body radius {body.OuterRadius:G6})");
            return (table.Evaluate, $"differential rotation about +z, Omega(r) from {Path.GetFileName(value)} (monotone cubic, constant beyond the ends)", note);
        }
        if (!double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out double number)
            || !double.IsFinite(number) || key is not ("omega" or "breakup"))
            throw new CliException(ExitCodes.Usage, $"--rotation '{spec}' is not 'omega=<number>', 'breakup=<fraction>' or 'table=<file>'.");
        double omega = key == "omega" ? number : number * Rotation.BreakupAngularVelocity(body);
        return (_ => omega, string.Create(CultureInfo.InvariantCulture, $"solid-body rotation about +z, Omega = {omega:R} per time unit"), null);
    }
}
