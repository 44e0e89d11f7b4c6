using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Placement.Profiles;
using Spectre.Console;

namespace Placement.Commands.Verbs;

/// <summary><c>placement inspect</c>: summarises a profile and, where it carries pressure, its scale heights and resolution needs.</summary>
internal static class InspectCommand
{
    public static Command Create(CliContext context)
    {
        var profile = new ProfileArguments();
        var cells = new Option<double>("--cells-per-scale-height")
        {
            Description = "Cells per pressure scale height H_P = P/(ρ g) wanted; the report gives the points needed (your threshold, no built-in one).",
            DefaultValueFactory = _ => 10.0,
        };
        var fraction = new Option<double>("--mass-fraction")
        {
            Description = "Count the requirement inside the radius enclosing this fraction of the mass (H_P → 0 at the surface).",
            DefaultValueFactory = _ => 0.99,
        };
        var count = new Option<long>("--count", "-n")
        {
            Description = "A point count to evaluate: the report shows the cells per H_P it gives.",
            DefaultValueFactory = _ => 100_000,
        };
        var core = new CoreReplacementArguments();
        var overwrite = new Option<bool>("--overwrite") { Description = "Replace the --write-profile file if it exists." };
        var gamma = new Option<double>("--gamma")
        {
            Description = "Adiabatic index for the thermal energy U = ∫ P/((γ-1)ρ) dm of a profile that carries pressure.",
            DefaultValueFactory = _ => 5.0 / 3.0,
        };
        var command = new Command("inspect", "Summarise a profile: mass, radius, densities and contrast, and where pressure is known the pressure scale heights and the points needed to resolve them.");
        profile.AddTo(command);
        command.Options.Add(cells);
        command.Options.Add(fraction);
        command.Options.Add(count);
        core.AddTo(command, withWriteProfile: true);
        command.Options.Add(overwrite);
        command.Options.Add(gamma);
        command.SetAction(parse =>
        {
            var (body, replaced) = core.Apply(parse, profile.Load(parse));
            string? written = core.Write(parse, body, replaced, parse.GetValue(overwrite));
            var summary = ProfileSummary.Of(body);
            double g = parse.GetValue(gamma);
            if (!(g > 1) || !double.IsFinite(g)) throw new CliException(ExitCodes.Usage, $"--gamma must be a finite number > 1, got {g}.");
            var budget = ProfileBudget.Of(body, g);
            ResolutionReport? resolution = null;
            if (ScaleHeights.PressureQuantity(body) is not null)
            {
                try
                {
                    resolution = ScaleHeights.Resolution(body, parse.GetValue(count), parse.GetValue(cells), parse.GetValue(fraction), 200);
                }
                catch (ArgumentOutOfRangeException ex)
                {
                    throw new CliException(ExitCodes.Usage, ex.Message);
                }
            }
            if (context.Json)
            {
                context.Output.WriteLine(JsonSerializer.Serialize(new
                {
                    units = summary.Units.Name,
                    summary.TotalMass, summary.OuterRadius, summary.CentralDensity, summary.MeanDensity, summary.MaxDensity,
                    summary.MinPositiveDensity, summary.DensityContrast, summary.Radius10, summary.HalfMassRadius, summary.Radius90,
                    summary.QuantityNames, summary.Fingerprint, summary.DensitySteps, summary.FirstRowRadius, summary.ExtrapolatedCoreFraction,
                    bindingEnergy = Bodies.GravitationalEnergy.OfProfile(body),
                    corePotentialEnergy = Bodies.GravitationalEnergy.OfProfileInCentralField(body),
                    virialRatio = resolution is null ? double.NaN : Bodies.ThermalEnergy.VirialRatio(body),
                    gamma = g,
                    thermalEnergy = budget.IdealGas,
                    thermalEnergyFromTable = budget.FromTable,
                    internalEnergyQuantity = budget.TableQuantity,
                    resolution = resolution is null ? null : new
                    {
                        resolution.PressureQuantity, resolution.Count, resolution.WantedCellsPerScaleHeight, resolution.MassFraction,
                        resolution.MaxPointsNeeded, resolution.LimitingRadius, resolution.Radius, resolution.ScaleHeight,
                        resolution.CellsPerScaleHeight, resolution.PointsNeeded,
                    },
                    coreReplacement = replaced is null ? null : CoreReplacementArguments.Json(replaced),
                    profileTable = written,
                }, CliJson.Options));
                return ExitCodes.Ok;
            }
            context.Output.WriteLine(summary.ToString());
            if (replaced is not null) foreach (string line in CoreReplacementArguments.Lines(replaced)) context.Output.WriteLine(line);
            if (written is not null) context.Output.WriteLine($"profile table written to {written}");
            double binding = Bodies.GravitationalEnergy.OfProfile(body);
            context.Output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"binding energy   W = {binding:G6} {body.Units.MassUnitName} {body.Units.LengthUnitName}^2/{body.Units.TimeUnitName}^2 (-G ∫ M dM / r)"));
            if (body.CentralPointMass is not null)
                context.Output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"in core's field  W_c = {Bodies.GravitationalEnergy.OfProfileInCentralField(body):G6} (∫ Φ_core dm; the virial ratio counts the core's force)"));
            foreach (string line in budget.Lines(body.Units)) context.Output.WriteLine(line);
            if (resolution is not null)
                context.Output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"virial ratio     3∫P dV / -(W + V_core) = {Bodies.ThermalEnergy.VirialRatio(body):F6} (1 in hydrostatic equilibrium)"));
            if (resolution is null)
            {
                context.Output.WriteLine("pressure         not carried: no scale heights");
                return ExitCodes.Ok;
            }
            var c = CultureInfo.InvariantCulture;
            string l = body.Units.LengthUnitName;
            var table = new Table().AddColumns(Markup.Escape($"r [{l}]"), "m(r)/M", Markup.Escape($"H_P [{l}]"), $"cells/H_P at N={resolution.Count:N0}", $"N for {resolution.WantedCellsPerScaleHeight:G3} cells/H_P");
            for (int i = 19; i < resolution.Radius.Length; i += 20)
            {
                double r = resolution.Radius[i];
                table.AddRow(r.ToString("G5", c), (body.EnclosedMass(r) / body.TotalMass).ToString("F3", c), resolution.ScaleHeight[i].ToString("G4", c),
                    resolution.CellsPerScaleHeight[i].ToString("F2", c), resolution.PointsNeeded[i].ToString("G3", c));
            }
            context.Console.Write(table);
            context.Output.WriteLine(string.Create(c,
                $"points needed for {resolution.WantedCellsPerScaleHeight:G3} cells per H_P inside {resolution.MassFraction:P1} of the mass: {resolution.MaxPointsNeeded:G3} (limited at r = {resolution.LimitingRadius:G4} {l})"));
            return ExitCodes.Ok;
        });
        return command;
    }
}
