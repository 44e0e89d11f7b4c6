using System.Globalization;
using Placement.Tessellation;

namespace Placement.Tests.Tessellation;

public class ReferenceComparisonTests
{
    [Fact]
    public void InteriorCells_MatchQhullVolumesAndFaceCounts()
    {
        // Fixture made by Fixtures/Qhull/make_qhull_fixture.py with Qhull through scipy.spatial 1.10.1
        // (Debian python3-scipy): cells whose unbounded Voronoi region lies inside the unit cube, so the box
        // cannot have changed them.
        string path = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Qhull", "qhull_unit_cube_3000.csv");
        var rows = File.ReadAllLines(path).Where(l => !l.StartsWith('#') && !l.StartsWith("index", StringComparison.Ordinal)).ToArray();
        int n = rows.Length;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var interior = new bool[n]; var volume = new double[n]; var faces = new int[n];
        foreach (var row in rows)
        {
            var f = row.Split(',');
            int i = int.Parse(f[0], CultureInfo.InvariantCulture);
            x[i] = double.Parse(f[1], CultureInfo.InvariantCulture);
            y[i] = double.Parse(f[2], CultureInfo.InvariantCulture);
            z[i] = double.Parse(f[3], CultureInfo.InvariantCulture);
            interior[i] = f[4] == "1";
            volume[i] = double.Parse(f[5], CultureInfo.InvariantCulture);
            faces[i] = int.Parse(f[6], CultureInfo.InvariantCulture);
        }
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube());
        cells.CheckValidity(x, y, z, 1e-12);
        int compared = 0;
        for (int i = 0; i < n; i++)
        {
            if (!interior[i]) continue;
            compared++;
            // Both exact in double precision: Qhull and cell clipping agree to ~1e-14 (reference notes §11);
            // 1e-10 leaves room for Qhull's own joggle-free rounding on near-degenerate vertices.
            Assert.True(Math.Abs(cells.Volume[i] / volume[i] - 1) < 1e-10, $"cell {i}: {cells.Volume[i]} vs Qhull {volume[i]}");
            Assert.True(faces[i] == cells.FaceCount[i], $"cell {i}: {cells.FaceCount[i]} faces vs Qhull {faces[i]}");
            Assert.False(cells.CutByDomain[i]);
        }
        Assert.True(compared > 1500, $"only {compared} interior cells");
    }

    [Fact]
    public void PoissonVoronoi_MeanFacesAndVolumeVariance_MatchTheory()
    {
        // 3-D Poisson–Voronoi typical cell: mean face count 2 + 48π²/35 = 15.5355 (Meijering 1953, citation from
        // memory; value in the project's reference notes §9, reproduced there by Monte Carlo) and
        // var(V/<V>) ≈ 0.1790 (same source; Lazar et al. 2013, PRE 88, 063309 for large simulations).
        const int n = 40_000;
        var (x, y, z) = TestPoints.Uniform(n, 2024);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(true));
        cells.CheckValidity(x, y, z, 1e-12);
        double mean = 0, mean2 = 0;
        for (int i = 0; i < n; i++) { mean += cells.FaceCount[i]; mean2 += (double)cells.FaceCount[i] * cells.FaceCount[i]; }
        mean /= n;
        double sdFaces = Math.Sqrt(mean2 / n - mean * mean);
        double vbar = 1.0 / n, m2 = 0, m4 = 0;
        for (int i = 0; i < n; i++)
        {
            double u = cells.Volume[i] / vbar - 1;
            m2 += u * u; m4 += u * u * u * u;
        }
        m2 /= n; m4 /= n;
        // Statistical tolerances: 5 standard errors, from the sample itself (se of a mean: sd/√n; se of a
        // variance: √((μ4 − σ⁴)/n)). Cells of one periodic set are weakly correlated; 5σ leaves room.
        double seFaces = sdFaces / Math.Sqrt(n), seVar = Math.Sqrt((m4 - m2 * m2) / n);
        Assert.InRange(mean, 15.5355 - 5 * seFaces, 15.5355 + 5 * seFaces);
        Assert.InRange(m2, 0.1790 - 5 * seVar, 0.1790 + 5 * seVar);
        Assert.True(5 * seFaces < 0.1 && 5 * seVar < 0.012, "tolerances must stay meaningful");
    }
}
