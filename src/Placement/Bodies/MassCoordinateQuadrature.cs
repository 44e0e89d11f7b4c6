using Placement.Numerics;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Integrals over a profile's mass coordinate, ∫₀^M f(m, r(m)) dm, shared by the energy integrals.</summary>
/// <remarks>Equal mass panels, each by the 4-point Gauss–Legendre rule of <see cref="GaussLegendreRule"/>; equal mass
/// panels put the resolution where the mass is, so steep envelopes cost nothing extra.</remarks>
internal static class MassCoordinateQuadrature
{
    private static readonly GaussLegendreRule Rule = new(4);

    public static double Integrate(IRadialProfile profile, Func<double, double, double> integrand, int panels)
    {
        var nodes = Rule.Nodes;
        var weights = Rule.Weights;
        double dm = profile.TotalMass / panels, sum = 0;
        for (int k = 0; k < panels; k++)
        {
            double mid = (k + 0.5) * dm;
            for (int q = 0; q < nodes.Length; q++)
            {
                double m = mid + 0.5 * dm * nodes[q];
                sum += weights[q] * 0.5 * dm * integrand(m, profile.RadiusOfEnclosedMass(m));
            }
        }
        return sum;
    }
}
