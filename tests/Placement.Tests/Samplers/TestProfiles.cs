using System.Globalization;
using Placement.Profiles;
using Placement.Units;

namespace Placement.Tests.Samplers;

/// <summary>
/// Small closed-form profiles for sampler tests (to be replaced by the library's profile types after merging).
/// Each one implements M(r) and r(M) analytically or by bisection on the closed-form M(r).
/// </summary>
internal static class TestProfiles
{
    /// <summary>Plummer sphere of scale a truncated at R and renormalised to mass M (Binney &amp; Tremaine 2008, Plummer M(r)).</summary>
    public static IRadialProfile Plummer(double mass = 1.0, double a = 0.2, double radius = 1.0) => new TruncatedPlummer(mass, a, radius);

    /// <summary>Lane–Emden n = 1 polytrope: ρ ∝ sin ξ / ξ, M ∝ sin ξ − ξ cos ξ, ξ = π r / R (methods reference §8, analytic θ).</summary>
    public static IRadialProfile PolytropeN1(double mass = 1.0, double radius = 1.0) => new PolytropeOne(mass, radius);

    /// <summary>
    /// A layered body built from power laws ρ = A_k r^(−α_k): a central cusp (α = 1) to r = 0.1, a density drop by
    /// 100 there, an α = 2 mantle to 0.5, and a steep α = 12 envelope to R = 1 (density falls by 3.6 decades in it).
    /// </summary>
    public static IRadialProfile Layered() => new PowerLawLayers([0.0, 0.1, 0.5, 1.0], [1.0, 2.0, 12.0], [1.0, 0.01, 1.0]);

    /// <summary>
    /// A uniform core (r &lt; 0.05) under an α = 8 power-law envelope to R = 1: the density falls by 10.4 decades
    /// through the envelope, like a giant star's.
    /// </summary>
    public static IRadialProfile SteepEnvelope() => new PowerLawLayers([0.0, 0.05, 1.0], [0.0, 8.0], [1.0, 1.0]);

    private abstract class ProfileBase(double mass, double radius, string name) : IRadialProfile
    {
        public UnitSystem Units => UnitSystem.Dimensionless;

        public double OuterRadius { get; } = radius;

        public double TotalMass { get; } = mass;

        public string Fingerprint { get; } = string.Create(CultureInfo.InvariantCulture, $"test:{name}:M={mass:R}:R={radius:R}");

        public abstract double Density(double r);

        public abstract double EnclosedMass(double r);

        public virtual double RadiusOfEnclosedMass(double m)
        {
            if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m));
            double lo = 0, hi = OuterRadius;
            while (true)
            {
                double mid = 0.5 * (lo + hi);
                if (mid <= lo || mid >= hi) break; // interval is down to adjacent doubles
                if (EnclosedMass(mid) < m) lo = mid; else hi = mid;
            }
            return 0.5 * (lo + hi);
        }
    }

    private sealed class TruncatedPlummer(double mass, double a, double radius) : ProfileBase(mass, radius, $"plummer:a={a}")
    {
        private readonly double _scale = mass / G(radius, a);

        private static double G(double r, double a) => r * r * r / Math.Pow(r * r + a * a, 1.5);

        public override double Density(double r) =>
            r < 0 || r > OuterRadius ? 0 : 3 * _scale * a * a / (4 * Math.PI * Math.Pow(r * r + a * a, 2.5));

        public override double EnclosedMass(double r) => r <= 0 ? 0 : r >= OuterRadius ? TotalMass : _scale * G(r, a);

        public override double RadiusOfEnclosedMass(double m)
        {
            if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m));
            if (m == TotalMass) return OuterRadius;
            double y = Math.Pow(m / _scale, 2.0 / 3.0); // y = r²/(r² + a²)
            return Math.Min(OuterRadius, a * Math.Sqrt(y / (1 - y)));
        }
    }

    private sealed class PolytropeOne(double mass, double radius) : ProfileBase(mass, radius, "polytrope-n1")
    {
        private static double Mu(double xi) => Math.Sin(xi) - xi * Math.Cos(xi);

        public override double Density(double r)
        {
            if (r < 0 || r > OuterRadius) return 0;
            double xi = Math.PI * r / OuterRadius;
            double rhoC = TotalMass * Math.PI / (4 * OuterRadius * OuterRadius * OuterRadius); // M = 4π ρc (R/π)³ π
            return xi < 1e-8 ? rhoC : rhoC * Math.Sin(xi) / xi;
        }

        public override double EnclosedMass(double r)
        {
            if (r <= 0) return 0;
            if (r >= OuterRadius) return TotalMass;
            double xi = Math.PI * r / OuterRadius;
            // Small ξ: sin ξ − ξ cos ξ = ξ³/3 − ξ⁵/30 + …, avoiding cancellation.
            double mu = xi < 1e-3 ? xi * xi * xi / 3 - Math.Pow(xi, 5) / 30 : Mu(xi);
            return TotalMass * mu / Math.PI;
        }
    }

    private sealed class PowerLawLayers : ProfileBase
    {
        private readonly double[] _edges, _alpha, _a, _massAtEdge;

        public PowerLawLayers(double[] edges, double[] alpha, double[] densityAtInnerEdgeFactor)
            : base(Total(edges, alpha, densityAtInnerEdgeFactor, out var a, out var m), edges[^1], "layers")
        {
            _edges = edges;
            _alpha = alpha;
            _a = a;
            _massAtEdge = m;
        }

        // Coefficients: layer 0 has A = 1; each later layer starts at the previous layer's density times the factor.
        private static double Total(double[] edges, double[] alpha, double[] factor, out double[] a, out double[] m)
        {
            a = new double[alpha.Length];
            m = new double[edges.Length];
            for (int k = 0; k < alpha.Length; k++)
            {
                if (k == 0) a[k] = factor[0];
                else
                {
                    double rhoEnd = a[k - 1] * Math.Pow(edges[k], -alpha[k - 1]);
                    a[k] = factor[k] * rhoEnd / Math.Pow(edges[k], -alpha[k]);
                }
                m[k + 1] = m[k] + Shell(a[k], alpha[k], edges[k], edges[k + 1]);
            }
            return m[^1];
        }

        private static double Shell(double a, double alpha, double r0, double r1) =>
            4 * Math.PI * a * (Math.Pow(r1, 3 - alpha) - Math.Pow(r0, 3 - alpha)) / (3 - alpha);

        private int LayerOf(double r)
        {
            int k = 0;
            while (k < _alpha.Length - 1 && r >= _edges[k + 1]) k++;
            return k;
        }

        public override double Density(double r) =>
            r < 0 || r > OuterRadius ? 0 : r == 0 && _alpha[0] > 0 ? double.PositiveInfinity : _a[LayerOf(r)] * Math.Pow(r, -_alpha[LayerOf(r)]);

        public override double EnclosedMass(double r)
        {
            if (r <= 0) return 0;
            if (r >= OuterRadius) return TotalMass;
            int k = LayerOf(r);
            return _massAtEdge[k] + Shell(_a[k], _alpha[k], _edges[k], r);
        }

        public override double RadiusOfEnclosedMass(double m)
        {
            if (!(m >= 0 && m <= TotalMass)) throw new ArgumentOutOfRangeException(nameof(m));
            if (m == TotalMass) return OuterRadius;
            int k = 0;
            while (k < _alpha.Length - 1 && m >= _massAtEdge[k + 1]) k++;
            double p = 3 - _alpha[k];
            double v = Math.Pow(_edges[k], p) + (m - _massAtEdge[k]) * p / (4 * Math.PI * _a[k]);
            return Math.Clamp(Math.Pow(v, 1 / p), _edges[k], _edges[k + 1]);
        }
    }
}
