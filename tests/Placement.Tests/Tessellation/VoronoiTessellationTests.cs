using Placement.Parallelism;
using Placement.Tessellation;

namespace Placement.Tests.Tessellation;

public class VoronoiTessellationTests
{
    // Perfect lattices (cubic cell edge a = 1): SC cube V = 1, 6 faces; BCC truncated octahedron V = 1/2, 14 faces;
    // FCC rhombic dodecahedron V = 1/4, 12 faces. Source: the project's reference notes §9 [computed], volumes
    // follow from one cell per lattice point (a³ / points per cubic cell).
    [Theory]
    [InlineData("sc", 6, 1.0)]
    [InlineData("bcc", 14, 0.5)]
    [InlineData("fcc", 12, 0.25)]
    public void PeriodicLattice_GivesExactCellsWithKnownFaceCounts(string lattice, int faces, double volume)
    {
        var basis = lattice switch { "sc" => TestPoints.Sc, "bcc" => TestPoints.Bcc, _ => TestPoints.Fcc };
        const int m = 5;
        var (x, y, z) = TestPoints.Lattice(m, basis, 0.0);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.PeriodicBox(0, 0, 0, m, m, m), new TessellationOptions { KeepFaces = true });
        cells.CheckValidity(x, y, z, 1e-12);
        for (int i = 0; i < cells.Count; i++)
        {
            Assert.Equal(faces, cells.FaceCount[i]);
            Assert.Equal(volume, cells.Volume[i], 12);
            // Lattice cells are centrally symmetric about their generator: zero offset (rounding only).
            Assert.True(cells.CentroidOffset[i] < 1e-12, $"cell {i} offset {cells.CentroidOffset[i]}");
            Assert.False(cells.CutByDomain[i]);
        }
    }

    [Theory]
    [InlineData("sc", 6)]
    [InlineData("bcc", 14)]
    [InlineData("fcc", 12)]
    public void SlightlyNoisyLattice_VolumesStillSumExactly(string lattice, int idealFaces)
    {
        var basis = lattice switch { "sc" => TestPoints.Sc, "bcc" => TestPoints.Bcc, _ => TestPoints.Fcc };
        const int m = 6;
        // Noise 1e-11 of the spacing: SC edges where 4 cells met split into sliver faces of area ~1e-11 (noise ×
        // edge), FCC vertices into faces of area ~1e-22; both fall below the default face tolerance (1e-9 V^2/3), so
        // face counts stay ideal while the volumes include the slivers.
        var (x, y, z) = TestPoints.Lattice(m, basis, 0.25, 1e-11, 17);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.PeriodicBox(0, 0, 0, m, m, m));
        cells.CheckValidity(x, y, z, 1e-12);
        for (int i = 0; i < cells.Count; i++) Assert.Equal(idealFaces, cells.FaceCount[i]);
    }

    [Fact]
    public void LatticeInSolidBox_CellsAreCubesTouchingWalls()
    {
        const int m = 4;
        var (x, y, z) = TestPoints.Lattice(m, TestPoints.Sc, 0.5);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.Box(0, 0, 0, m, m, m));
        cells.CheckValidity(x, y, z, 1e-13);
        int cut = 0;
        for (int i = 0; i < cells.Count; i++)
        {
            Assert.Equal(1.0, cells.Volume[i], 13);
            Assert.Equal(6, cells.FaceCount[i]);
            if (cells.CutByDomain[i]) cut++;
        }
        Assert.Equal(m * m * m - (m - 2) * (m - 2) * (m - 2), cut);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void RandomSet_VolumesSumToBoxVolume_AndFacesAreSymmetric(bool periodic)
    {
        var (x, y, z) = TestPoints.Uniform(5000, 7, 0, 2);
        var domain = periodic ? TessellationDomain.PeriodicBox(0, 0, 0, 2, 2, 2) : TessellationDomain.Box(0, 0, 0, 2, 2, 2);
        var cells = VoronoiTessellation.Compute(x, y, z, domain, new TessellationOptions { KeepFaces = true });
        // Exact in a box: every face is shared by two cells computed from the same two points, so the
        // volumes sum to the box volume up to rounding (reference notes §11: 1e-12 relative or better).
        cells.CheckValidity(x, y, z, 1e-12);
    }

    [Fact]
    public void Results_AreIdenticalOnOneAndTwoThreads()
    {
        var (x, y, z) = TestPoints.Uniform(20000, 3);
        var one = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(), new TessellationOptions { Parallel = ParallelSettings.Sequential });
        var two = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(), new TessellationOptions { Parallel = new ParallelSettings { MaxDegreeOfParallelism = 2 } });
        Assert.Equal(one.Volume, two.Volume);
        Assert.Equal(one.FaceCount, two.FaceCount);
        Assert.Equal(one.CentroidX, two.CentroidX);
    }

    [Fact]
    public void Results_AreIdenticalForEveryVectorWidth()
    {
        // The hot loops (neighbour gathering, vertex classification, farthest-vertex rescan) have scalar, 4-wide (AVX2)
        // and 8-wide (AVX-512) forms; this machine's widest runs everywhere else, so the narrower ones are checked here
        // against the scalar form, bit for bit: a uniform set in a box (face walks, masses off) and an uneven set in a
        // ball (far tree, sphere clipping) with cell masses (rings built for the quadrature) and kept faces.
        var (ux, uy, uz) = TestPoints.Uniform(6000, 17);
        var (bx, by, bz) = TestPoints.UniformBall(4000, 18, 1.0);
        for (int i = 0; i < bx.Length; i++)
        {
            // Concentrate the ball's points toward its centre (r → r³): an uneven set.
            double r2 = bx[i] * bx[i] + by[i] * by[i] + bz[i] * bz[i];
            bx[i] *= r2; by[i] *= r2; bz[i] *= r2;
        }
        var ballOptions = new TessellationOptions { KeepFaces = true, MassProfile = new Placement.Profiles.PlummerSphere(1.0, 0.3, 1.0) };
        int was = Placement.Spatial.SimdLanes.Doubles;
        try
        {
            Placement.Spatial.SimdLanes.Doubles = 1;
            var boxScalar = VoronoiTessellation.Compute(ux, uy, uz, TessellationDomain.UnitCube());
            var ballScalar = VoronoiTessellation.Compute(bx, by, bz, TessellationDomain.Sphere(0, 0, 0, 1), ballOptions);
            int[] widths = Placement.Spatial.SimdLanes.Best switch { 8 => [4, 8], 4 => [4], _ => [] };
            foreach (int width in widths)
            {
                Placement.Spatial.SimdLanes.Doubles = width;
                var box = VoronoiTessellation.Compute(ux, uy, uz, TessellationDomain.UnitCube());
                var ball = VoronoiTessellation.Compute(bx, by, bz, TessellationDomain.Sphere(0, 0, 0, 1), ballOptions);
                foreach (var (a, b) in new[] { (boxScalar, box), (ballScalar, ball) })
                {
                    Assert.Equal(a.Volume, b.Volume);
                    Assert.Equal(a.CentroidX, b.CentroidX);
                    Assert.Equal(a.CentroidY, b.CentroidY);
                    Assert.Equal(a.CentroidZ, b.CentroidZ);
                    Assert.Equal(a.FaceCount, b.FaceCount);
                    Assert.Equal(a.MaxFaceAngleRatio, b.MaxFaceAngleRatio);
                }
                Assert.Equal(ballScalar.Mass, ball.Mass);
                Assert.Equal(ballScalar.FaceNeighbour, ball.FaceNeighbour);
                Assert.Equal(ballScalar.FaceArea, ball.FaceArea);
            }
        }
        finally
        {
            Placement.Spatial.SimdLanes.Doubles = was;
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(7)]
    [InlineData(10)]
    public void TinySets_AreValidInEveryDomain(int n)
    {
        var (x, y, z) = TestPoints.Uniform(n, (ulong)(100 + n));
        VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube()).CheckValidity(x, y, z, 1e-12);
        VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(true)).CheckValidity(x, y, z, 1e-12);
        var (bx, by, bz) = TestPoints.UniformBall(n, (ulong)(200 + n), 1.0);
        var options = new TessellationOptions { SphereTolerance = 1e-3 };
        VoronoiTessellation.Compute(bx, by, bz, TessellationDomain.Sphere(0, 0, 0, 1), options).CheckValidity(bx, by, bz, 1e-12, 1e-3);
    }

    [Fact]
    public void SinglePoint_FillsTheWholeBox()
    {
        var cells = VoronoiTessellation.Compute([0.3], [0.6], [0.2], TessellationDomain.Box(0, 0, 0, 1, 2, 3));
        Assert.Equal(6.0, cells.Volume[0], 13);
        Assert.Equal(6, cells.FaceCount[0]);
        Assert.Equal(0.5, cells.CentroidX[0], 13);
        Assert.Equal(1.0, cells.CentroidY[0], 13);
        Assert.Equal(1.5, cells.CentroidZ[0], 13);
    }

    [Fact]
    public void DuplicatedPoints_AreAClearErrorNamingBothIndices()
    {
        var (x, y, z) = TestPoints.Uniform(100, 5);
        x[73] = x[12]; y[73] = y[12]; z[73] = z[12];
        var e = Assert.Throws<ArgumentException>(() => VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube()));
        Assert.Contains("Points 12 and 73 coincide", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PointsAroundACuspAtTheOrigin_FarCloserThanTheMeanSpacing_AreNotDuplicates()
    {
        // A steep cusp at the origin puts its innermost points far closer together than any fraction of the mean spacing
        // (an invented r^-2.9 cusp, 2e4 HEALPix-shell points: 8e-12 apart for a mean spacing of 0.6, once reported as
        // coinciding). Here a cluster of 20 points within 1e-12 of the origin, 10 of them at one radius, among 2000 random
        // points of the unit ball: a valid tessellation; two of them made to coincide are still an error.
        var (x, y, z) = TestPoints.UniformBall(2000, 91, 1.0);
        var rng = new Placement.Random.KeyedRandom(92, 0);
        for (int k = 0; k < 20; k++)
        {
            double u = 2 * rng.NextDouble() - 1, phi = 2 * Math.PI * rng.NextDouble(), s = Math.Sqrt(1 - u * u);
            double r = k < 10 ? 1e-12 : 1e-12 * rng.NextDouble();
            x[k] = r * s * Math.Cos(phi); y[k] = r * s * Math.Sin(phi); z[k] = r * u;
        }
        var domain = TessellationDomain.Sphere(0, 0, 0, 1.0);
        var cells = VoronoiTessellation.Compute(x, y, z, domain);
        cells.CheckValidity(x, y, z);
        x[7] = x[3]; y[7] = y[3]; z[7] = z[3];
        var e = Assert.Throws<ArgumentException>(() => VoronoiTessellation.Compute(x, y, z, domain));
        Assert.Contains("Points 3 and 7 coincide", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PointOutsideDomain_IsRejected()
    {
        var e = Assert.Throws<ArgumentException>(() => VoronoiTessellation.Compute([0.5, 1.5], [0.5, 0.5], [0.5, 0.5], TessellationDomain.UnitCube()));
        Assert.Contains("Point 1", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TinySharedFace_KeptByOneCellOnly_PassesTheValidityCheck()
    {
        // Seed 41, 4000 uniform points: one cell keeps a face a few 1e-9 of its V^(2/3) in area that its neighbour, with a
        // larger volume and so a larger area threshold, drops; the check treats a missing face as area 0 within the same
        // 1e-6 V^(2/3) it allows between the two sides of a shared face.
        var (x, y, z) = TestPoints.Uniform(4000, 41);
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(), new TessellationOptions { KeepFaces = true });
        cells.CheckValidity(x, y, z, 1e-12);
    }

    [Fact]
    public void CoplanarSet_GivesPrismsFillingTheBox()
    {
        // 400 random points all in the plane z = 0.5: every cell is a prism spanning the box height.
        var (x, y, _) = TestPoints.Uniform(400, 9);
        var z = Enumerable.Repeat(0.5, 400).ToArray();
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.UnitCube(), new TessellationOptions { KeepFaces = true });
        cells.CheckValidity(x, y, z, 1e-12);
        for (int i = 0; i < cells.Count; i++) Assert.Equal(0.5, cells.CentroidZ[i], 12);
    }

    [Fact]
    public void PointsOnConcentricShells_TessellateTheBall()
    {
        // Two shells of 300 random directions each (co-spherical generators) plus a centre point.
        int n = 601;
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        var (dx, dy, dz) = TestPoints.UniformBall(600, 31, 1.0);
        for (int i = 0; i < 600; i++)
        {
            double r = i < 300 ? 0.4 : 0.8, len = Math.Sqrt(dx[i] * dx[i] + dy[i] * dy[i] + dz[i] * dz[i]);
            x[i] = r * dx[i] / len; y[i] = r * dy[i] / len; z[i] = r * dz[i] / len;
        }
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.Sphere(0, 0, 0, 1), new TessellationOptions { KeepFaces = true });
        cells.CheckValidity(x, y, z, 1e-12);
        var box = VoronoiTessellation.Compute(x, y, z, TessellationDomain.Box(-1, -1, -1, 1, 1, 1));
        box.CheckValidity(x, y, z, 1e-12);
    }

    [Fact]
    public void SphereDomain_VolumeSumWithinTheStatedApproximationBound()
    {
        var (x, y, z) = TestPoints.UniformBall(3000, 11, 2.0);
        const double delta = 1e-4;
        var cells = VoronoiTessellation.Compute(x, y, z, TessellationDomain.Sphere(0, 0, 0, 2.0), new TessellationOptions { SphereTolerance = delta });
        cells.CheckValidity(x, y, z, 1e-12, delta);
        double sum = cells.TotalVolume(), ball = 4.0 / 3.0 * Math.PI * 8;
        // Tangent planes at the farthest vertex converge to within δ: the excess is positive and below 3δ.
        Assert.InRange((sum - ball) / ball, 0, 3 * delta);
        Assert.Contains(true, cells.CutByDomain);
    }
}
