using Placement.Tessellation;

namespace Placement.Tests.Tessellation;

public class TinySphereSetTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(5)]
    public void FewPointsInABall_FillTheBall_WithinTheRaisedTolerance(int n)
    {
        var x = new double[n]; var y = new double[n]; var z = new double[n];
        for (int i = 0; i < n; i++) { x[i] = 0.1 * i; y[i] = -0.05 * i; z[i] = 0.02 * i * i; }
        var domain = TessellationDomain.Sphere(0, 0, 0, 1.0);
        var cells = VoronoiTessellation.Compute(x, y, z, domain);
        // The tangent-plane ball holds the true ball and exceeds it by at most (1 + δ)³ with δ = 1.4e-3 n^(-2/3).
        double delta = Math.Max(1e-4, 1.4e-3 * Math.Pow(n, -2.0 / 3.0));
        double ball = 4.0 / 3.0 * Math.PI;
        Assert.InRange(cells.TotalVolume(), ball, ball * Math.Pow(1 + delta, 3));
    }
}
