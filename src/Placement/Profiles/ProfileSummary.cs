using System.Globalization;
using System.Text;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>Headline numbers of a radial profile (mass, radius, densities, characteristic radii), for reports and the CLI.</summary>
/// <param name="Units">Units of every number below.</param>
/// <param name="TotalMass">M(R), mass units.</param>
/// <param name="OuterRadius">R, length units.</param>
/// <param name="CentralDensity">ρ(0), mass/length³ (+∞ for a central cusp).</param>
/// <param name="MeanDensity">3M/(4πR³), mass/length³.</param>
/// <param name="MaxDensity">Largest finite density over the sample radii, mass/length³.</param>
/// <param name="MinPositiveDensity">Smallest positive density over the sample radii, mass/length³.</param>
/// <param name="DensityContrast">MaxDensity / MinPositiveDensity.</param>
/// <param name="Radius10">Radius enclosing 10 % of the mass, length units.</param>
/// <param name="HalfMassRadius">Radius enclosing half the mass, length units.</param>
/// <param name="Radius90">Radius enclosing 90 % of the mass, length units.</param>
/// <param name="QuantityNames">Names of the extra quantities the profile carries.</param>
/// <param name="Fingerprint">The profile's fingerprint.</param>
/// <param name="DensitySteps">Radii of the profile's density steps, length units (empty when it has none; null when not given).</param>
/// <param name="FirstRowRadius">For a table that starts off centre, its first row's radius, length units; 0 otherwise.</param>
/// <param name="ExtrapolatedCoreFraction">The share of the mass inside <paramref name="FirstRowRadius"/>, from the core
/// extrapolation rather than from rows (see <see cref="TabulatedProfile.ExtrapolatedCoreMass"/>); 0 otherwise.</param>
public sealed record ProfileSummary(
    UnitSystem Units,
    double TotalMass,
    double OuterRadius,
    double CentralDensity,
    double MeanDensity,
    double MaxDensity,
    double MinPositiveDensity,
    double DensityContrast,
    double Radius10,
    double HalfMassRadius,
    double Radius90,
    IReadOnlyList<string> QuantityNames,
    string Fingerprint,
    IReadOnlyList<double>? DensitySteps = null,
    double FirstRowRadius = 0,
    double ExtrapolatedCoreFraction = 0)
{
    /// <summary>
    /// Share of the mass from a table's core extrapolation above which <see cref="Notes"/> warns: 1 %, a judgement (common
    /// practice for a model's first zone is a tiny fraction of its mass).
    /// </summary>
    public const double ExtrapolatedCoreNoteFraction = 0.01;

    /// <summary>Warnings about the profile a user should see before placing points (empty when there are none).</summary>
    public IReadOnlyList<string> Notes()
    {
        if (!(ExtrapolatedCoreFraction > ExtrapolatedCoreNoteFraction)) return [];
        return [string.Create(CultureInfo.InvariantCulture,
            $"note: {ExtrapolatedCoreFraction:P1} of the mass lies inside the table's first row (r = {FirstRowRadius:G6} {Units.LengthUnitName}), where the density is extrapolated inward, not tabulated; add rows toward the centre if that is not intended.")];
    }

    /// <summary>Computes the summary; densities are sampled at 1000 radii from <see cref="ProfileSampling.Radii"/>.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    public static ProfileSummary Of(IRadialProfile profile)
    {
        ArgumentNullException.ThrowIfNull(profile);
        double max = 0, min = double.PositiveInfinity;
        foreach (double r in ProfileSampling.Radii(profile, 1000))
        {
            double rho = profile.Density(r);
            if (double.IsFinite(rho) && rho > max) max = rho;
            if (rho > 0 && rho < min) min = rho;
        }
        double m = profile.TotalMass, big = profile.OuterRadius;
        var names = new List<string>();
        foreach (var q in profile.Quantities) names.Add(q.Name);
        return new ProfileSummary(profile.Units, m, big, profile.Density(0), 3 * m / (4 * Math.PI * big * big * big), max, min, max / min,
            profile.RadiusOfEnclosedMass(0.1 * m), profile.RadiusOfEnclosedMass(0.5 * m), profile.RadiusOfEnclosedMass(0.9 * m),
            names, profile.Fingerprint, [.. profile.DensitySteps],
            profile is TabulatedProfile t ? t.RowRadii[0] : 0,
            profile is TabulatedProfile u && m > 0 ? u.ExtrapolatedCoreMass / m : 0);
    }

    /// <summary>A few lines of text with units, e.g. for a command-line report.</summary>
    public override string ToString()
    {
        var c = CultureInfo.InvariantCulture;
        string l = Units.LengthUnitName, ms = Units.MassUnitName, d = Units.DensityUnitName;
        var sb = new StringBuilder();
        sb.AppendLine(string.Create(c, $"mass             {TotalMass:G6} {ms}"));
        sb.AppendLine(string.Create(c, $"radius           {OuterRadius:G6} {l}"));
        sb.AppendLine(string.Create(c, $"central density  {CentralDensity:G6} {d}"));
        sb.AppendLine(string.Create(c, $"mean density     {MeanDensity:G6} {d}"));
        sb.AppendLine(string.Create(c, $"density contrast {DensityContrast:G3} ({MaxDensity:G3} to {MinPositiveDensity:G3} {d})"));
        sb.AppendLine(string.Create(c, $"r(10%/50%/90%)   {Radius10:G5} / {HalfMassRadius:G5} / {Radius90:G5} {l}"));
        sb.AppendLine($"quantities       {(QuantityNames.Count == 0 ? "none" : string.Join(", ", QuantityNames))}");
        if (DensitySteps is { Count: > 0 } steps)
            sb.AppendLine(string.Create(c, $"density steps    {string.Join(", ", steps.Select(r => r.ToString("G6", c)))} {l}"));
        if (ExtrapolatedCoreFraction > 0)
            sb.AppendLine(string.Create(c, $"below first row  {ExtrapolatedCoreFraction:P2} of the mass inside r = {FirstRowRadius:G6} {l} (extrapolated inward)"));
        sb.Append($"fingerprint      {Fingerprint}");
        return sb.ToString();
    }
}
