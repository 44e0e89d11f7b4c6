// Library use from C#: two invented bodies, a placement, the quality check and an HDF5 file.
using Placement.Bodies;
using Placement.Bodies.Background;
using Placement.IO;
using Placement.Profiles;
using Placement.Quality;
using Placement.Samplers;
using Placement.Units;

string output = args.Length > 0 ? args[0] : "library-sample-output";
Directory.CreateDirectory(output);

// 1. An analytic body: an n = 3 polytrope of 1 M_sun and 1 R_sun (G = 1 in solar units).
var star = new Polytrope(n: 3.0, mass: 1.0, radius: 1.0, UnitSystem.Solar);
Console.WriteLine(ProfileSummary.Of(star));

// 2. A profile table (invented layered planet, km and g/cm^3), converted to cgs on reading.
var planet = ProfileTableReader.Read(Path.Combine(AppContext.BaseDirectory, "layered-planet.txt"),
    new ProfileTableOptions { TargetUnits = UnitSystem.Cgs });
Console.WriteLine(ProfileSummary.Of(planet));

// 3. Place 20,000 equal-mass points on each with HEALPix shells and check them against the profile.
var catalog = SamplerCatalog.CreateDefault();
foreach (var (name, body) in new[] { ("star", (IRadialProfile)star), ("planet", planet) })
{
    var placed = PointSampling.Place(catalog.Create("healpix-shells"), new SamplingRequest(body, 20_000) { Seed = 7 });
    var report = QualityChecker.Evaluate(placed.Points, body);
    Console.WriteLine($"{name}: {placed.Points.Count} points, std ln(V rho/m) = {report.LogRatio.StandardDeviation:F3}, " +
                      $"radial density rms = {report.RadialDensity.RmsError:P2}, enclosed-mass error max = {report.EnclosedMass.MaxRelativeError:P3}");
    PointFiles.Write(new PointTable(placed.Points), Path.Combine(output, $"{name}.h5"), overwrite: true);
    File.WriteAllText(Path.Combine(output, $"{name}.report.json"), QualityJson.Serialize(report));
}
Console.WriteLine($"wrote {output}/star.h5, {output}/planet.h5 and their reports");

// 4. A simulation-ready binary (invented scenario): the star's dense centre replaced by a softened core, internal
//    energies for an ideal gas, its energy budget, a companion on an eccentric orbit and a low-density medium around both,
//    everything in the centre-of-mass frame.
var gas = CoreReplacement.Apply(star, new CoreReplacementOptions(0.2) { Index = 1.5 });
var gasPoints = PointSampling.Place(catalog.Create("healpix-shells"), new SamplingRequest(gas, 20_000) { Seed = 7 }).Points;
var thermo = new ThermodynamicOptions { Gamma = 5.0 / 3.0 };
var state = ThermodynamicFields.Compute(gasPoints, gas, thermo);
var budget = EnergyBudgets.Compute(gasPoints, gas, state.InternalEnergy, options: new EnergyBudgetOptions { Thermodynamics = thermo });
Console.WriteLine($"core: {gas.CoreMass:G4} M_sun, softening {gas.SofteningLength:G3} R_sun; virial ratio of the points {budget.PointsVirialRatio:F4}, " +
                  $"W off the profile's by {budget.GravitationalDeviation:P2}");
var single = new PointTable(gasPoints);
single.Add(PointColumnNames.InternalEnergy, state.InternalEnergy, QuantityDimension.SpecificEnergy, "ideal gas, gamma = 5/3");
single.PointMasses.Add(gas.Core!);
var (binary, summary) = BodyAssembly.Assemble(single, gas, new BodyAssemblyRequest
{
    Companions = [new CompanionOrbit("companion", Mass: 0.5, SemiMajorAxis: 3.0, Eccentricity: 0.2, SofteningLength: 0.05)],
    Background = new BackgroundSettings { BoxSide = 12, Density = 1e-6, Pressure = 1e-8 },
    BackgroundInternalEnergy = 1e-8 / ((5.0 / 3.0 - 1) * 1e-6),
    Seed = 7,
});
PointFiles.Write(binary, Path.Combine(output, "binary.h5"), overwrite: true);
Console.WriteLine($"binary: {binary.Count} points ({summary.Background?.Points ?? 0} in the medium), point masses " +
                  $"{string.Join(", ", binary.PointMasses.Select(p => p.Name))}; wrote {output}/binary.h5");
