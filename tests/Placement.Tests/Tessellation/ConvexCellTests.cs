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

    [Fact]
    public void ThinDenseShellCell_WhoseConeApexCannotBeCutConsistently_IsRebuiltWithTheCuttingPlaneFirst()
    {
        // Replays the clips of a cell that still failed with the larger tolerances: the HEALPix-shell placement (2e4
        // points, R = 1 R_sun) of an invented body with a thin shell 100× denser than its surroundings at 0.6 R. The
        // point at 0.605 R was clipped first by 34 neighbours on its own thin shell, whose bisectors all pass through the
        // body centre: dozens of vertices there, rounded into an inconsistent fan, and the 35th plane (a point of an
        // inner shell) cuts the whole fan away. Rebuilt from the box with that plane first, the apex never forms.
        double gx = 0.24208796161129784, gy = 0.4712842034453684, gz = -0.2922676913769451;
        double[,] offsets =
        {
            { -0.01992977257485337, -0.019536046034750232, -0.04344815024691473 },
            { -0.014912756881081318, 0.028019630352328517, 0.036879960842050585 },
            { -0.00046512178255728176, 0.01936191898898837, 0.03338437632886615 },
            { -0.02177953522010459, 0.023171044012843922, 0.021871703020734157 },
            { -0.04332844806981542, 0.025945928708267674, 0.010500701734281637 },
            { -0.007329862644563423, 0.014521574287793215, 0.01837507320759646 },
            { -0.028591246111518337, 0.017787423383442413, 0.007024144037334923 },
            { 0.006813992747865677, 0.005392858742623574, 0.014846386324373517 },
            { -0.014141595306519844, 0.00913785764120717, 0.0035275273767966797 },
            { -0.035327735005908106, 0.011866027513021848, -0.007652044579193662 },
            { -0.02087998240139452, 0.0032072640874357683, -0.011147308531587352 },
            { -0.041968446035022505, 0.005404337536910386, -0.02214604779289636 },
            { -0.006742700329391643, -0.005949616719085171, -0.01467223008243157 },
            { -0.02752425217669563, -0.0032735462105438207, -0.025638307788451165 },
            { 0.0070626784150086, -0.015602340234069423, -0.018237997961943808 },
            { -0.01339312132658868, -0.012460232610136679, -0.029158845814991785 },
            { 0.00040288073122049517, -0.022154311228446022, -0.03271894880121573 },
            { 0.013678759147163905, 0.010233298787842848, 0.029855678327599278 },
            { 0.02749913900434922, 0.0006381596355267694, 0.02628298617220831 },
            { 0.040976008688210636, -0.009418767917155235, 0.02265520431510515 },
            { 0.020631754935919316, -0.004211349515917395, 0.011274658266504145 },
            { 0.03410282846064658, -0.014286997539649404, 0.007648671859874168 },
            { 0.013812702675693372, -0.009623098055624058, -0.0035695253231411983 },
            { 0.02727529350124977, -0.01972813501125875, -0.007192387519324328 },
            { 0.04036611264447379, -0.030311597794474787, -0.01088019662301154 },
            { 0.02051427019529664, -0.025748442359315726, -0.021856071558502332 },
            { 0.013841161708623179, -0.03235425583721013, -0.03633019347086369 },
            { 0.021764162325746933, -0.0015436212411760741, 0.04272720714509015 },
            { 0.020574219045416037, 0.014525804522680541, 0.0450168066306981 },
            { -0.04044498536172428, -0.017898630794837, -0.054023252250839426 },
            { -0.006144949991411602, -0.029284294518721665, -0.04700028644240639 },
            { -0.02633061785555993, -0.02718127764206718, -0.057528170384559485 },
            { 0.007277951697603563, -0.039552068211262115, -0.050602239767322144 },
            { -0.012558484353522997, -0.03699770163166172, -0.06106959565804032 },
            { -0.016303681886350535, -0.04956967379903554, -0.010663954555008626 },
        };
        var (cell, half) = Replay(gx, gy, gz, offsets, null);
        // The last plane cut the cell (the centre lies beyond it) and the result lies inside every half-space applied.
        Assert.Contains(offsets.GetLength(0) - 1, cell.Neighbour.ToArray());
        AssertInside(cell, half, 1e-9 * Math.Sqrt(cell.MaxRadiusSquared));
    }

    [Fact]
    public void CuspCell_WithPlanesMeetingInNoPoint_StaysFinite()
    {
        // Replays the clips of a cell that once made a tessellation spin forever: the HEALPix-shell placement (1e5
        // points, R = 1 R_sun) of an invented ρ ∝ r⁻² cusp, a point at 1e-4 R. The tenth plane's boundary edge met it in
        // no single point (zero triple product), the new vertex came out NaN, and with it the cell's extent, which no
        // exit test of the neighbour search could then pass. Such a rebuild is now refused and retried like any other
        // inconsistent clip.
        double gx = 2.9839684906753094E-05, gy = -3.6468430607725316E-05, gz = 8.895735567513681E-05;
        double[,] offsets =
        {
            { -4.068069687746589E-05, 4.399648088654751E-05, -7.305416484851058E-05 },
            { -1.3668390390632166E-05, 2.6474838096075837E-05, -8.085008101581493E-05 },
            { -4.000660475958942E-05, 1.9915483174824185E-05, -9.601031477095725E-05 },
            { -3.7015293204569596E-06, -6.0037877802985107E-05, -7.724865743318863E-05 },
            { -9.292260458461608E-05, 2.8855812566632938E-05, -1.087818017670892E-05 },
            { 6.64952358785008E-05, 8.024403988913746E-06, -8.23026774676816E-05 },
            { -2.7552035162849876E-05, 0.00010172658105083646, -1.234205162672183E-05 },
            { -3.35844250446805E-05, 5.1800405601987935E-05, -0.00010229969520358545 },
            { -9.862257052915711E-05, -3.681412382429956E-05, -8.326998225587019E-05 },
            { 3.8943200715650924E-05, 0.00010975098503975019, -9.464472909440343E-05 },
            { 0.00012355090968627221, -6.615288621751651E-05, 3.201331792229447E-05 },
            { -8.36373562395991E-05, -0.00010906287492412479, 6.795077896587904E-05 },
            { -3.212733465065631E-05, -2.8789719835385823E-05, -0.00016557265972355178 },
            { -0.000126174605692007, 6.491245722653688E-05, -9.561203388259202E-05 },
            { -5.597784049304923E-05, 0.00013297473901843575, -0.00010066605391708499 },
            { 3.3243234771109895E-05, 4.4081048648817695E-05, -0.0001670365311735647 },
            { 9.650266256294572E-05, 0.00014545757898051163, 5.544724889128772E-05 },
            { -0.00010676147659587183, 0.00010057093168681073, 0.00010768348536737512 },
            { -5.967936981350619E-05, 7.293686121545063E-05, -0.00017791471135027363 },
            { -9.625617959280918E-06, -0.00018103753591752956, -0.0001202025004263232 },
            { 0.0001802586344279188, 8.725057922865295E-05, -0.00013338237836903107 },
            { -0.00023993800424142498, -1.4313718013202317E-05, -4.453233298124254E-05 },
            { -5.005375185422527E-05, 0.00025397439713298017, -5.771221092395043E-05 },
            { 4.7082106782365645E-05, -2.7634070471360098E-05, -0.00028559819671764876 },
            { -0.0001561820323764519, -7.252071776506101E-05, -0.00023336196024156136 },
            { 2.395798642609291E-05, 0.00018199973613957542, -0.00024586549031615265 },
            { -0.0001832302794997784, 0.00013908974743296714, -0.0002099280292725681 },
        };
        var (cell, half) = Replay(gx, gy, gz, offsets, (c, k) => Assert.True(double.IsFinite(c.MaxRadiusSquared), $"extent not finite after clip {k}"));
        for (int v = 0; v < cell.TriangleCount; v++)
            Assert.True(double.IsFinite(cell.Vx[v]) && double.IsFinite(cell.Vy[v]) && double.IsFinite(cell.Vz[v]), $"vertex {v}");
        AssertInside(cell, half, 1e-9 * Math.Sqrt(cell.MaxRadiusSquared));
    }

    // Clips a cell in the box [−1, 1]³ (relative to the generator g) by the bisectors of the given neighbour offsets, in
    // order, with the tessellation's tolerance (1e-12 × the first neighbour's distance); `afterEach` sees each step.
    private static (ConvexCell Cell, List<(double X, double Y, double Z, double D)> Half) Replay(double gx, double gy, double gz, double[,] offsets, Action<ConvexCell, int>? afterEach)
    {
        var cell = new ConvexCell();
        cell.InitBox(-1 - gx, -1 - gy, -1 - gz, 1 - gx, 1 - gy, 1 - gz, [-1, -2, -3, -4, -5, -6]);
        var half = new List<(double X, double Y, double Z, double D)>();
        for (int k = 0; k < offsets.GetLength(0); k++)
        {
            double dx = offsets[k, 0], dy = offsets[k, 1], dz = offsets[k, 2], d2 = dx * dx + dy * dy + dz * dz;
            if (k == 0) cell.Tolerance = 1e-12 * Math.Sqrt(d2);
            cell.Clip(dx, dy, dz, 0.5 * d2, k);
            afterEach?.Invoke(cell, k);
            half.Add((dx, dy, dz, 0.5 * d2));
        }
        return (cell, half);
    }

    // Every vertex of the cell within `slack` (length) of every half-space n·x ≤ d given.
    private static void AssertInside(ConvexCell cell, List<(double X, double Y, double Z, double D)> half, double slack)
    {
        foreach (var (x, y, z, d) in half)
        {
            double norm = Math.Sqrt(x * x + y * y + z * z);
            for (int v = 0; v < cell.TriangleCount; v++)
            {
                double over = (x * cell.Vx[v] + y * cell.Vy[v] + z * cell.Vz[v] - d) / norm;
                Assert.True(over <= slack, $"vertex {v} lies {over} beyond a plane");
            }
        }
    }
}
