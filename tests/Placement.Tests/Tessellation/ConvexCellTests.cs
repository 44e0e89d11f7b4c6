using Placement.Tessellation;

namespace Placement.Tests.Tessellation;

public class ConvexCellTests
{
    [Fact]
    public void ShellPointCell_WhoseApexAtTheBodyCentreIsMetByManyPlanes_ClipsWithoutError()
    {
        // Replays the clips that once made a whole tessellation throw: the HEALPix-shell placement of an invented
        // three-layer body (1e5 points, R = 6.957e10 cm) had a point at 0.483 R whose first eight neighbours lay on its
        // own shell. Bisectors of points on one sphere all pass through its centre, so the still-open cell is a cone
        // with a many-plane apex at the body centre; one apex vertex, from three nearly dependent planes, was rounded
        // 259 cm off it (7e-9 of the cell's extent) and the eighth plane's removed patch was not a disc even at the
        // largest spacing-relative tolerance. The offsets (neighbour − generator, cm) are the recorded ones.
        const double R = 69570000000;
        double gx = 15599210314.56083, gy = -22826740928.089115, gz = -19116875970.33763;
        double[,] offsets =
        {
            { -755008955.3357964, -65664136.11713791, -515696125.145874 },
            { 740758963.1335773, 82059305.40346146, 528296880.26351166 },
            { -1144959715.6147537, -1017435289.2686386, 345080349.2541275 },
            { -1524006591.7163105, -114721712.33325958, -1018375276.6619987 },
            { 1186516524.9654503, 1085329893.989231, -258387419.26301575 },
            { 444254080.5411949, 999886689.6043892, -784030917.4478378 },
            { -312348250.8478794, 930636327.548111, -1296915011.9481735 },
            { -388500450.4115677, -952679300.4216423, 867933816.7266998 },
        };
        var cell = new ConvexCell();
        cell.InitBox(-R - gx, -R - gy, -R - gz, R - gx, R - gy, R - gz, [-1, -2, -3, -4, -5, -6]);
        for (int k = 0; k < offsets.GetLength(0); k++)
        {
            double dx = offsets[k, 0], dy = offsets[k, 1], dz = offsets[k, 2], d2 = dx * dx + dy * dy + dz * dz;
            if (k == 0) cell.Tolerance = 1e-12 * Math.Sqrt(d2); // as the tessellation sets it from the nearest neighbour
            cell.Clip(dx, dy, dz, 0.5 * d2, k);
        }
        // The result is a closed convex cell around the generator: every vertex inside every plane, up to the largest
        // tolerance a clip may have used (1e-10 × 64³ of the farthest vertex distance).
        double reach = Math.Sqrt(cell.MaxRadiusSquared), slack = 1e-10 * Math.Pow(64, 3) * reach;
        Assert.True(cell.TriangleCount >= 4, $"{cell.TriangleCount} vertices");
        for (int p = 0; p < cell.PlaneCount; p++)
        {
            double norm = Math.Sqrt(cell.Nx[p] * cell.Nx[p] + cell.Ny[p] * cell.Ny[p] + cell.Nz[p] * cell.Nz[p]);
            Assert.True(cell.D[p] > 0, $"plane {p} does not keep the generator");
            for (int v = 0; v < cell.TriangleCount; v++)
            {
                double over = (cell.Nx[p] * cell.Vx[v] + cell.Ny[p] * cell.Vy[v] + cell.Nz[p] * cell.Vz[v] - cell.D[p]) / norm;
                Assert.True(over <= slack, $"vertex {v} lies {over} cm beyond plane {p}");
            }
        }
        // The eighth neighbour's bisector must have cut the cone (it is nearer than the cell's far vertices).
        Assert.Contains(7, cell.Neighbour.ToArray());
    }
}
