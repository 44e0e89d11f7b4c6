using Placement.Bodies;
using Placement.Bodies.Background;
using Placement.Commands.Verbs;
using Placement.IO;
using Placement.Parallelism;
using Placement.Profiles;
using Placement.Sph;
using Placement.Tessellation;

namespace Placement.Commands.Reports;

/// <summary>The body step of <c>place</c>: thermodynamic columns, resolution and energy budget, added to the point table and reported.</summary>
internal static class BodyRun
{
    private static readonly QuantityDimension EnergyDimension = new(2, 1, -2);

    /// <summary>Neighbour number of the SPH density estimate (Wendland C2), the quality checker's default.</summary>
    private const int SphNeighbours = 64;

    /// <summary>Computes what <paramref name="request"/> asks for, adds columns and /body values to <paramref name="table"/>, returns the report section.</summary>
    public static BodyReport Run(CliContext context, BodyRequest request, PointTable table, IRadialProfile profile, ParallelSettings parallel, Func<double, double>? angularVelocity)
    {
        var points = table.Points;
        var units = points.Units;
        var carriedColumns = new Dictionary<string, string>(StringComparer.Ordinal);
        double[]? volume = null, density = null;
        if (request.NeedsPointDensity)
            (volume, density) = context.Stage($"estimating point densities ({request.PointDensity})", _ => PointDensity(request.PointDensity, table, profile, parallel));

        BodyThermodynamicsSection? thermoSection = null;
        ThermodynamicState? state = null;
        if (request.Thermodynamics is { } options)
        {
            state = context.Stage("computing thermodynamic fields", _ => ThermodynamicFields.Compute(points, profile, options, density, parallel));
            var columns = new Dictionary<string, string>(StringComparer.Ordinal);
            carriedColumns.Clear();
            var u = PointColumn.Scalar(PointColumnNames.InternalEnergy, state.InternalEnergy, QuantityDimension.SpecificEnergy, units,
                $"specific internal energy, {MatchName(options.Match)}, gamma = {options.Gamma:R}");
            table.Add(u);
            columns[u.Name] = u.Unit;
            foreach (var carried in state.Carried)
            {
                string name = ColumnName(table, carried.Quantity, state.PressureQuantity);
                table.Add(new PointColumn(name, [carried.Values], carried.Quantity.Unit.Name, carried.Quantity.Unit.InCgs,
                    $"profile quantity '{carried.Quantity.Name}' at the point's radius"));
                columns[name] = carried.Quantity.Unit.Name;
                carriedColumns[name] = carried.Quantity.Name;
            }
            string source = options.Source == InternalEnergySource.IdealGas ? "ideal-gas" : "profile:" + state.InternalEnergyQuantity;
            thermoSection = new BodyThermodynamicsSection(options.Gamma, source, MatchName(options.Match), request.PointDensity, columns,
                state.PressureDeviation, state.EntropyDeviation, state.DensityDeviation, state.UndefinedCount);
            table.BodyLabels[BodyNames.EnergySource] = source;
            table.BodyLabels[BodyNames.Match] = MatchName(options.Match);
            table.BodyLabels[BodyNames.PointDensity] = request.PointDensity;
            AddNumber(table, BodyNames.Gamma, options.Gamma, QuantityDimension.Dimensionless, "adiabatic index");
            AddNumber(table, BodyNames.PressureDeviationRms, state.PressureDeviation.Rms, QuantityDimension.Dimensionless, "rms of (gamma-1) rho_pt u / P(r) - 1");
            AddNumber(table, BodyNames.PressureDeviationMax, state.PressureDeviation.Max, QuantityDimension.Dimensionless, "max |(gamma-1) rho_pt u / P(r) - 1|");
            AddNumber(table, BodyNames.EntropyDeviationRms, state.EntropyDeviation.Rms, QuantityDimension.Dimensionless, "rms of K_pt / K(r) - 1, K = P/rho^gamma");
            AddNumber(table, BodyNames.EntropyDeviationMax, state.EntropyDeviation.Max, QuantityDimension.Dimensionless, "max |K_pt / K(r) - 1|");
        }

        BodyResolutionSection? resolutionSection = null;
        if (request.Resolution)
        {
            var res = context.Stage("measuring cells per pressure scale height", _ =>
                ScaleHeights.PlacedResolution(profile, points, volume!, request.Threshold, request.InnerRadius));
            resolutionSection = new BodyResolutionSection(units.LengthUnitName, request.PointDensity, res.WantedCellsPerScaleHeight, res.InnerRadius,
                res.MassFraction, res.MinimumCellsPerScaleHeight, res.LimitingRadius, res.MaxPointsNeeded, res.Radius, res.ScaleHeight, res.Spacing!,
                res.CellsPerScaleHeight, res.PointsNeeded);
            AddNumber(table, BodyNames.ResolutionThreshold, res.WantedCellsPerScaleHeight, QuantityDimension.Dimensionless, "wanted cells per pressure scale height (NaN: none)");
            AddNumber(table, BodyNames.MinimumCellsPerScaleHeight, res.MinimumCellsPerScaleHeight, QuantityDimension.Dimensionless,
                $"fewest cells per H_P = P/(rho g) of the points, spacing (volume per point)^(1/3) from {request.PointDensity}");
            AddNumber(table, BodyNames.PointsNeeded, res.MaxPointsNeeded, QuantityDimension.Dimensionless, "points needed for the threshold everywhere in the window");
            AddNumber(table, BodyNames.InnerRadius, res.InnerRadius, QuantityDimension.LengthDimension, "inner edge of the resolution window");
        }

        BodyEnergySection? energySection = null;
        if (request.Energy)
        {
            var velocity = table.Find(PointColumnNames.Velocity);
            (double[], double[], double[])? v = velocity is { ComponentCount: 3 } ? (velocity.Components[0], velocity.Components[1], velocity.Components[2]) : null;
            var budget = context.Stage(request.OpeningAngle == 0 ? "summing the pairwise gravitational energy" : "computing the energy budget (octree)", _ =>
                EnergyBudgets.Compute(points, profile, state?.InternalEnergy, v, new EnergyBudgetOptions
                {
                    OpeningAngle = request.OpeningAngle,
                    Thermodynamics = request.Thermodynamics,
                    AngularVelocity = angularVelocity,
                }, parallel));
            energySection = new BodyEnergySection(EnergyDimension.UnitName(units), budget.OpeningAngle, budget.Gamma,
                new BodyEnergies(budget.PointsGravitational, budget.PointsCorePotential, budget.PointsThermal, budget.PointsKinetic, budget.PointsTotal, budget.PointsVirialRatio),
                new BodyEnergies(budget.ProfileGravitational, budget.ProfileCorePotential, budget.ProfileThermal, budget.ProfileRotational, budget.ProfileTotal, budget.ProfileVirialRatio),
                budget.GravitationalDeviation, budget.ThermalDeviation, budget.KineticDeviation);
            AddNumber(table, BodyNames.OpeningAngle, budget.OpeningAngle, QuantityDimension.Dimensionless, "octree opening angle (0 = exact pairwise sum)");
            AddNumber(table, BodyNames.PointsGravitationalEnergy, budget.PointsGravitational, EnergyDimension, "W of the points, -G sum m_i m_j / r_ij");
            AddNumber(table, BodyNames.PointsThermalEnergy, budget.PointsThermal, EnergyDimension, "sum m u of the points");
            AddNumber(table, BodyNames.PointsKineticEnergy, budget.PointsKinetic, EnergyDimension, "1/2 sum m v^2 of the points");
            AddNumber(table, BodyNames.ProfileGravitationalEnergy, budget.ProfileGravitational, EnergyDimension, "-G int M dM / r of the profile");
            AddNumber(table, BodyNames.ProfileThermalEnergy, budget.ProfileThermal, EnergyDimension, "int u dm of the profile");
            if (profile.CentralPointMass is not null)
            {
                AddNumber(table, BodyNames.PointsCorePotentialEnergy, budget.PointsCorePotential, EnergyDimension, "sum m Phi_core of the points in the softened core's potential");
                AddNumber(table, BodyNames.ProfileCorePotentialEnergy, budget.ProfileCorePotential, EnergyDimension, "int Phi_core dm of the profile");
            }
            AddNumber(table, BodyNames.ProfileRotationalEnergy, budget.ProfileRotational, EnergyDimension, "1/2 int Omega^2 varpi^2 dm of the profile");
        }
        return new BodyReport(thermoSection, resolutionSection, energySection) { CarriedColumns = carriedColumns };
    }

    /// <summary>
    /// Values of the body step's columns at background-medium points: the SPH density is the medium's density, the
    /// kernel support holds <see cref="SphNeighbours"/> neighbours at that density in the point's own cell volume,
    /// H = (3 N_H V/(4π))^(1/3), and a carried profile quantity (temperature, composition …) takes the body's surface
    /// value, the profile's value just inside R. Any other column is unknown (null: the assembly names it).
    /// </summary>
    public static Func<PointColumn, BackgroundPoints, IReadOnlyList<double[]>?> BackgroundColumns(IRadialProfile profile, BodyReport? report) =>
        (column, medium) =>
        {
            int n = medium.Points.Count;
            if (column.ComponentCount != 1) return null;
            var values = new double[n];
            if (column.Name == PointColumnNames.SphDensity) Array.Fill(values, medium.Settings.Density);
            else if (column.Name == PointColumnNames.SmoothingLength)
                for (int i = 0; i < n; i++) values[i] = Math.Cbrt(3 * SphNeighbours * medium.CellVolume[i] / (4 * Math.PI));
            else if (report is not null && report.CarriedColumns.TryGetValue(column.Name, out string? quantity)
                && profile.TryQuantity(quantity, profile.OuterRadius * (1 - 1e-9), out double surface))
                Array.Fill(values, surface);
            else return null;
            return [values];
        };

    public static string MatchName(ThermodynamicMatch match) => match == ThermodynamicMatch.DensityEntropy ? "density+entropy" : "density+pressure";

    private static void AddNumber(PointTable table, string name, double value, QuantityDimension dimension, string description) =>
        table.BodyScalars.Add(BodyScalar.Of(name, value, dimension, table.Points.Units, description));

    /// <summary>Pressure → <c>pressure</c>, temperature → <c>temperature</c>, others their own name, or <c>profile_NAME</c> when that is not free.</summary>
    private static string ColumnName(PointTable table, ProfileQuantity quantity, string? pressureName)
    {
        string wanted = quantity.Name == pressureName ? PointColumnNames.Pressure
            : quantity.Unit is { Temperature: 1, Length: 0, Mass: 0, Time: 0 } ? PointColumnNames.Temperature
            : quantity.Name;
        if (Free(table, wanted)) return wanted;
        var safe = new System.Text.StringBuilder("profile_");
        foreach (char c in quantity.Name) safe.Append(char.IsAsciiLetterOrDigit(c) ? c : '_');
        string fallback = safe.ToString();
        for (int k = 2; !Free(table, fallback); k++) fallback = safe + "_" + k.ToString(System.Globalization.CultureInfo.InvariantCulture);
        return fallback;
    }

    private static bool Free(PointTable table, string name)
    {
        if (!BodyNames.IsIdentifier(name) || PointColumnNames.Reserved.Contains(name)) return false;
        foreach (var column in table.Columns)
        {
            if (string.Equals(column.Name, name, StringComparison.OrdinalIgnoreCase)) return false;
            if (column.ComponentCount == 3 && name.StartsWith(column.Name + "_", StringComparison.OrdinalIgnoreCase)) return false;
        }
        return true;
    }

    /// <summary>Volume per point and density of every point, from Voronoi cells (m/V) or SPH; adds the matching columns when new.</summary>
    private static (double[] Volume, double[] Density) PointDensity(string kind, PointTable table, IRadialProfile profile, ParallelSettings parallel)
    {
        var points = table.Points;
        int n = points.Count;
        var volume = new double[n];
        var density = new double[n];
        if (kind == "voronoi")
        {
            var cells = table.Find(PointColumnNames.CellVolume)?.Components[0];
            if (cells is null)
            {
                double reach = profile.OuterRadius;
                for (int i = 0; i < n; i++) reach = Math.Max(reach, points.Radius(i));
                cells = VoronoiTessellation.Compute(points, TessellationDomain.Sphere(0, 0, 0, reach * (1 + 1e-9)), new TessellationOptions { Parallel = parallel }).Volume;
                table.Add(PointColumnNames.CellVolume, cells, QuantityDimension.Volume, "Voronoi cell volume (ball domain of the profile radius)");
            }
            for (int i = 0; i < n; i++) { volume[i] = cells[i]; density[i] = points.Mass[i] / cells[i]; }
            return (volume, density);
        }
        var sph = SphDensity.Compute(points, SphKernel.WendlandC2, SphNeighbours, parallel);
        for (int i = 0; i < n; i++) { density[i] = sph.Density[i]; volume[i] = points.Mass[i] / sph.Density[i]; }
        if (table.Find(PointColumnNames.SphDensity) is null)
        {
            table.Add(PointColumnNames.SphDensity, sph.Density, QuantityDimension.Density, $"SPH density, Wendland C2, {SphNeighbours} neighbours");
            table.Add(PointColumnNames.SmoothingLength, sph.Support, QuantityDimension.LengthDimension, $"kernel support radius H of the SPH density (Wendland C2, {SphNeighbours} neighbours)");
        }
        return (volume, density);
    }
}
