// Library use from C#: two invented bodies, a placement, the quality check and an HDF5 file.
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
