using System.Globalization;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>A polytrope of index 0 ≤ n &lt; 5 scaled to a user mass and radius, with pressure P = Kρ^(1+1/n).</summary>
/// <remarks>
/// <para>From our own Lane–Emden solution (<see cref="LaneEmden"/>): ξ = ξ1 r/R, ρ = ρ_c θⁿ, M(r) = M μ(ξ)/μ1,
/// ρ_c = M ξ1³/(4π R³ μ1) (ρ_c/ρ̄ = ξ1³/(3μ1)), α = R/ξ1, P = P_c θ^(n+1) with P_c = 4πGα²ρ_c²/(n + 1), so
/// K = P_c/ρ_c^(1+1/n) (Chandrasekhar 1939, ch. IV; Poisson &amp; Will 2014, §2.4). For n = 0 the same P_c gives the
/// incompressible result P = (2π/3)Gρ²(R² − r²), and K is undefined (NaN). G comes from <see cref="Units"/>.</para>
/// <para>Accuracy: M(r) and r(M) carry the Lane–Emden dense output's accuracy, about 1e-12 relative (tests
/// require 1e-10 against the closed forms for n = 0 and 1).</para>
/// <para>Carries one extra quantity, <c>P</c> (pressure), in the unit system's mass/(length·time²).</para>
/// </remarks>
public sealed class Polytrope : IRadialProfile
{
    /// <summary>Name of the pressure quantity.</summary>
    public const string PressureName = "P";

    private readonly double _xiScale, _massScale;
    private readonly ProfileQuantity[] _quantities;

    /// <summary>Builds the polytrope of index <paramref name="n"/>, mass <paramref name="mass"/> and radius <paramref name="radius"/>.</summary>
    /// <param name="n">Polytropic index, 0 ≤ n &lt; 5.</param>
    /// <param name="mass">Total mass, mass units.</param>
    /// <param name="radius">Radius, length units.</param>
    /// <param name="units">Units; <see cref="UnitSystem.Dimensionless"/> (G = 1) when null.</param>
    /// <exception cref="ArgumentOutOfRangeException">n is outside [0, 5) or mass/radius not finite and positive.</exception>
    public Polytrope(double n, double mass, double radius, UnitSystem? units = null)
    {
        if (!(n >= 0 && n < 5)) throw new ArgumentOutOfRangeException(nameof(n), n, "Polytropic index must lie in [0, 5).");
        ProfileGuards.Positive(mass, nameof(mass), "Mass");
        ProfileGuards.Positive(radius, nameof(radius), "Radius");
        Index = n;
        TotalMass = mass;
        OuterRadius = radius;
        Units = units ?? UnitSystem.Dimensionless;
        Solution = LaneEmden.Solve(n);
        double xi1 = Solution.FirstZero, mu1 = Solution.SurfaceMass;
        _xiScale = xi1 / radius;
        _massScale = mass / mu1;
        CentralDensity = mass * xi1 * xi1 * xi1 / (4 * Math.PI * radius * radius * radius * mu1);
        double alpha = radius / xi1;
        CentralPressure = 4 * Math.PI * Units.GravitationalConstant * alpha * alpha * CentralDensity * CentralDensity / (n + 1);
        PolytropicConstant = n == 0 ? double.NaN : CentralPressure / Math.Pow(CentralDensity, 1 + 1 / n);
        _quantities = [new ProfileQuantity(PressureName, PhysicalUnit.ForSystem(Units, -1, 1, -2))];
        Fingerprint = string.Create(CultureInfo.InvariantCulture, $"polytrope:n={n:R}:M={mass:R}:R={radius:R}:{Units.Name}");
    }

    /// <summary>Polytropic index n.</summary>
    public double Index { get; }

    /// <summary>The dimensionless Lane–Emden solution behind this body.</summary>
    public LaneEmdenSolution Solution { get; }

    /// <summary>Central density ρ_c, mass/length³.</summary>
    public double CentralDensity { get; }

    /// <summary>Central pressure P_c, mass/(length·time²).</summary>
    public double CentralPressure { get; }

    /// <summary>K in P = Kρ^(1+1/n), in the matching units; NaN for n = 0.</summary>
    public double PolytropicConstant { get; }

    /// <inheritdoc />
    public UnitSystem Units { get; }

    /// <inheritdoc />
    public double OuterRadius { get; }

    /// <inheritdoc />
    public double TotalMass { get; }

    /// <inheritdoc />
    public string Fingerprint { get; }

    /// <inheritdoc />
    public IReadOnlyList<ProfileQuantity> Quantities => _quantities;

    /// <inheritdoc />
    public double Density(double r)
    {
        if (!(r >= 0 && r <= OuterRadius)) return 0;
        return CentralDensity * Solution.DensityFactor(Math.Min(r * _xiScale, Solution.MaxXi));
    }

    /// <summary>Pressure P(r) = P_c θ^(n+1), mass/(length·time²); 0 outside [0, R].</summary>
    public double Pressure(double r)
    {
        if (!(r >= 0 && r <= OuterRadius)) return 0;
        double theta = Math.Max(0, Solution.Theta(Math.Min(r * _xiScale, Solution.MaxXi)));
        return CentralPressure * theta * Solution.DensityFactor(Math.Min(r * _xiScale, Solution.MaxXi));
    }

    /// <inheritdoc />
    public bool TryQuantity(string name, double r, out double value)
    {
        if (name == PressureName)
        {
            value = Pressure(r);
            return true;
        }
        value = double.NaN;
        return false;
    }

    /// <inheritdoc />
    public double EnclosedMass(double r)
    {
        if (!(r > 0)) return 0;
        if (r >= OuterRadius) return TotalMass;
        return Math.Min(TotalMass, _massScale * Solution.Mu(r * _xiScale));
    }

    /// <inheritdoc />
    public double RadiusOfEnclosedMass(double m)
    {
        ProfileGuards.MassInRange(m, TotalMass, nameof(m));
        if (m >= TotalMass) return OuterRadius;
        return Solution.XiOfMu(m / _massScale) / _xiScale;
    }
}
