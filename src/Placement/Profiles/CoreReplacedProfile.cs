using System.Globalization;
using Placement.Bodies;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>
/// The gas of a body whose inner part was replaced by a softened point mass and a polytropic gas in equilibrium with it
/// (<see cref="CoreReplacement.Apply"/>); outside the cut it is the original profile minus the core's mass.
/// </summary>
/// <remarks>
/// <para>For r &lt; r_c: ρ, M and the pressure P = Kρ^(1+1/n) of the replaced gas (dense solution of the modified
/// Lane–Emden problem); every other carried quantity keeps its value at the cut (composition, for example, is then
/// the envelope's). For r ≥ r_c: ρ and the quantities of the original profile, and M(r) = M_original(r) − m_c.
/// <see cref="TotalMass"/> is the gas mass only; the core travels separately as <see cref="Core"/>. Density steps of the
/// original profile outside the cut are kept exactly.</para>
/// <para>M is continuous at r_c to rounding when there is a core (its mass closes the gap the shooting left, see
/// <see cref="CoreReplacementReport.MassMismatch"/>); without a core the gas mass inside the cut is capped at the original
/// M(r_c) − m_c, a change below 1e-10 relative. Thread-safe for concurrent reads.</para>
/// </remarks>
public sealed class CoreReplacedProfile : IRadialProfile
{
    private readonly IRadialProfile _original;
    private readonly SoftenedCorePolytrope _inner;
    private readonly string _pressure;
    private readonly double _pressureFactor, _innerMassCap;
    private readonly Dictionary<string, double> _cutValues = new(StringComparer.Ordinal);

    internal CoreReplacedProfile(IRadialProfile original, SoftenedCorePolytrope inner, string pressure, double coreMass, CoreReplacementReport report)
    {
        _original = original;
        _inner = inner;
        _pressure = pressure;
        Report = report;
        CutRadius = report.CutRadius;
        CoreMass = coreMass;
        SofteningLength = report.SofteningLength;
        TotalMass = original.TotalMass - coreMass;
        _innerMassCap = original.EnclosedMass(CutRadius) - coreMass;
        foreach (var q in original.Quantities)
        {
            if (q.Name == pressure)
                _pressureFactor = PhysicalUnit.ForSystem(original.Units, -1, 1, -2).FactorTo(q.Unit);
            else if (original.TryQuantity(q.Name, CutRadius, out double v))
                _cutValues[q.Name] = v;
        }
        Core = coreMass > 0 ? new PointMass("core", coreMass, SofteningLength) : null;
        Fingerprint = string.Create(CultureInfo.InvariantCulture,
            $"core-replaced:{original.Fingerprint}:rc={CutRadius:R}:h={SofteningLength:R}:n={report.Index:R}");
    }

    /// <summary>The profile that was cut.</summary>
    public IRadialProfile Original => _original;

    /// <summary>The replacement's parameters, match residuals and hydrostatic residuals.</summary>
    public CoreReplacementReport Report { get; }

    /// <summary>r_c, length units.</summary>
    public double CutRadius { get; }

    /// <summary>The original profile's density steps outside the cut radius, length units.</summary>
    public IReadOnlyList<double> DensitySteps => _steps ??= [.. _original.DensitySteps.Where(r => r > CutRadius)];

    private double[]? _steps;

    /// <summary>m_c, mass units (0 when no core was needed).</summary>
    public double CoreMass { get; }

    /// <summary>h of the core, length units.</summary>
    public double SofteningLength { get; }

    /// <summary>The core as a point mass named "core" at the origin, at rest; null when <see cref="CoreMass"/> is 0.</summary>
    public PointMass? Core { get; }

    /// <inheritdoc />
    public PointMass? CentralPointMass => Core;

    /// <inheritdoc />
    public UnitSystem Units => _original.Units;

    /// <inheritdoc />
    public double OuterRadius => _original.OuterRadius;

    /// <summary>Gas mass M(R) − m_c, mass units.</summary>
    public double TotalMass { get; }

    /// <inheritdoc />
    public string Fingerprint { get; }

    /// <inheritdoc />
    public IReadOnlyList<ProfileQuantity> Quantities => _original.Quantities;

    /// <inheritdoc />
    public double Density(double r)
    {
        if (!(r >= 0 && r <= OuterRadius)) return 0;
        return r < CutRadius ? _inner.Density(r) : _original.Density(r);
    }

    /// <inheritdoc />
    public double EnclosedMass(double r)
    {
        if (!(r > 0)) return 0;
        if (r >= OuterRadius) return TotalMass;
        if (r < CutRadius) return Math.Min(_inner.Mass(r), _innerMassCap);
        return Math.Max(_original.EnclosedMass(r) - CoreMass, _innerMassCap);
    }

    /// <inheritdoc />
    public double RadiusOfEnclosedMass(double m)
    {
        ProfileGuards.MassInRange(m, TotalMass, nameof(m));
        if (m >= TotalMass) return OuterRadius;
        if (m < _innerMassCap) return Math.Min(_inner.RadiusOfMass(m), CutRadius);
        return Math.Max(_original.RadiusOfEnclosedMass(Math.Min(m + CoreMass, _original.TotalMass)), CutRadius);
    }

    /// <inheritdoc />
    public bool TryQuantity(string name, double r, out double value)
    {
        if (r >= CutRadius || !(r >= 0)) return _original.TryQuantity(name, r, out value);
        if (name == _pressure)
        {
            value = _inner.Pressure(r) * _pressureFactor;
            return true;
        }
        if (_cutValues.TryGetValue(name, out value)) return true;
        return _original.TryQuantity(name, r, out value);
    }

    /// <summary>Asserts the invariants: M(0) = 0, M non-decreasing across the cut, M(R) = total, total gas + core = original mass.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken.</exception>
    public void CheckValidity()
    {
        if (EnclosedMass(0) != 0) throw new InvalidOperationException("M(0) is not 0.");
        double below = EnclosedMass(CutRadius * (1 - 1e-12)), at = EnclosedMass(CutRadius);
        if (!(at >= below)) throw new InvalidOperationException($"M decreases across the cut: {below} → {at}.");
        if (Math.Abs(at - below) > 1e-9 * at) throw new InvalidOperationException($"M jumps at the cut: {below} → {at}.");
        if (EnclosedMass(OuterRadius) != TotalMass) throw new InvalidOperationException("M(R) differs from the total mass.");
        if (Math.Abs(TotalMass + CoreMass - _original.TotalMass) > 1e-12 * _original.TotalMass)
            throw new InvalidOperationException("Gas and core masses do not add up to the original mass.");
        if (!(CoreMass >= 0)) throw new InvalidOperationException($"Negative core mass {CoreMass}.");
    }
}
