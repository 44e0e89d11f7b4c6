using Placement.Profiles;
using Placement.Units;

namespace Placement.Commands.Verbs;

/// <summary>The built-in demo body the README's first command uses (an invented scenario, not a real star).</summary>
internal static class DemoBody
{
    /// <summary>The invented two-zone star of <see cref="DemoBodies.TwoZoneStar"/>, defined in solar units.</summary>
    /// <exception cref="CliException">Another unit system was asked for.</exception>
    public static IRadialProfile Create(UnitSystem units)
    {
        if (units.Name != UnitSystem.Solar.Name)
            throw new CliException(ExitCodes.Usage, $"the demo body is defined in solar units (R_sun, M_sun, G = 1); use --units solar, not '{units.Name}'.");
        return DemoBodies.TwoZoneStar();
    }
}
