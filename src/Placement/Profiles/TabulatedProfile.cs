using System.Runtime.InteropServices;
using System.Security.Cryptography;
using Placement.Units;

namespace Placement.Profiles;

/// <summary>
/// The general radial profile built from tabulated rows (r, ρ[, M][, extra quantities]); the table reader produces it
/// and analytic bodies can be sampled into it.
/// </summary>
/// <remarks>
/// <para><b>Interpolation.</b> Density is a monotone piecewise cubic Hermite interpolant (PCHIP, Fritsch &amp; Carlson
/// 1980) of ln ρ against ln r, so it never overshoots the rows and follows power laws and steep envelopes over many
/// decades exactly where they are power laws. Special segments: <i>centre</i>, when the table starts at r = 0:
/// ρ = ρ0 + (ρ1 − ρ0)(r/r1)², even in r as a smooth spherical density must be; <i>core extrapolation</i>, when the
/// table starts at r0 &gt; 0, from the first segment's log slope s at r0 (clamped to −2.5 ≤ s ≤ 0, so the mass stays
/// finite): a cusp (s ≤ −0.1, e.g. Hernquist's ρ ∝ 1/r) continues as the power law ρ0 (r/r0)^s, a core (a shallower
/// slope, as at a stellar model's first zone) as the centre form above with ρ(0) = ρ0 (1 − s/2), matching ρ0 and s at r0;
/// <i>surface</i>, when the last row has ρ = 0: ρ = ρ_a ((R − r)/(R − r_a))^p with p fitted to the two rows before
/// the surface (clamped to [0.25, 10]; exact for polytrope-like surfaces ρ ∝ (R − r)^p).</para>
/// <para><b>Steps.</b> A radius repeated on two consecutive rows with different densities is a density step (e.g. a
/// composition change): interpolation restarts on each side, ρ is right-continuous (the outer value at the step
/// radius) and M is continuous.</para>
/// <para><b>Enclosed mass.</b> dM/du = 4πr³ρ (u = ln r) is integrated once, at construction: closed forms on the
/// special segments; on PCHIP segments by the 8-point Gauss–Legendre rule on panels bisected until each panel agrees
/// with its two halves to 1e-14 relative and dM/du varies by at most e² across it. Each such panel then stores a
/// 16-term Chebyshev series of the mass from its start, accepted only if it matches the quadrature to 1e-14 of the
/// panel mass at 6 check points between the fit nodes (else the panel is split), plus a Chebyshev series of the inverse. M(r) is a panel
/// look-up, one logarithm and one series evaluation; r(M) starts from the inverse series and finishes with
/// safeguarded Newton on the mass series, stopping once a Newton step in ln r is below 2e-9 (quadratic convergence
/// leaves &lt; 1e-16), so r(M) is exact to rounding apart from the conditioning 1e-16 M/(4πr³ρ).
/// Stated accuracy: M(r) equals the integral of the interpolated density to ~1e-14 relative (tests require 1e-13).
/// How well the interpolated density represents the true body depends on the rows; measured for analytic bodies
/// tabulated at 2000 rows of <see cref="ProfileSampling.Radii"/>: Plummer 2e-9, polytrope n = 3 5e-10, Hernquist
/// 2.5e-7 (next to the innermost row, from the cusp extrapolation); 400 equally spaced rows of an 11-decade Gaussian
/// envelope: 3e-5 (coarse in ln r near the centre); all relative in M(r).</para>
/// <para><b>Extra quantities</b> use the same scheme (log–log PCHIP when all values in a zone are positive, PCHIP of
/// the value against ln r otherwise, linear in r² at the centre, constant below the first row, linear to a zero
/// value at a zero-density surface).</para>
/// <para>Immutable after construction and thread-safe for concurrent reads; no allocation per call.</para>
/// </remarks>
public sealed partial class TabulatedProfile : IRadialProfile
{
    private readonly double[] _r, _rho;
    private readonly double[]? _tabulatedMass;
    private readonly ProfileCurve _density;
    private readonly ProfileCurve[] _quantityCurves;
    private readonly ProfileQuantity[] _quantities;
    private readonly double[][] _quantityValues;

    /// <summary>Builds a profile from rows of radius and density (and optionally tabulated enclosed mass and extra quantities).</summary>
    /// <param name="radius">Radii in length units: ≥ 0, non-decreasing; a radius repeated on two consecutive rows marks a density step.</param>
    /// <param name="density">Densities in mass/length³: finite, &gt; 0 (0 allowed at the last row only, if the options allow).</param>
    /// <param name="units">The units of every column.</param>
    /// <param name="options">Build options; <see cref="TabulatedProfileOptions.Default"/> when null.</param>
    /// <param name="enclosedMass">Optional tabulated M at each row, mass units; compared with the integral (see <see cref="Consistency"/>).</param>
    /// <param name="quantities">Optional extra quantities, one value per row each.</param>
    /// <exception cref="ArgumentNullException">A required argument is null.</exception>
    /// <exception cref="ArgumentException">The rows break a rule (the message names the row, column and value).</exception>
    public TabulatedProfile(IReadOnlyList<double> radius, IReadOnlyList<double> density, UnitSystem units,
        TabulatedProfileOptions? options = null, IReadOnlyList<double>? enclosedMass = null, IReadOnlyList<TabulatedQuantity>? quantities = null)
    {
        ArgumentNullException.ThrowIfNull(radius);
        ArgumentNullException.ThrowIfNull(density);
        ArgumentNullException.ThrowIfNull(units);
        options ??= TabulatedProfileOptions.Default;
        Units = units;
        Options = options;
        _r = [.. radius];
        _rho = [.. density];
        Throw(ProfileTableChecks.Check(_r, _rho, options.AllowZeroOuterDensity, options.AllowDensitySteps, "radius"));
        if (enclosedMass is not null)
        {
            _tabulatedMass = [.. enclosedMass];
            Throw(ProfileTableChecks.CheckMasses(_r, _tabulatedMass));
        }
        quantities ??= [];
        _quantities = new ProfileQuantity[quantities.Count];
        _quantityCurves = new ProfileCurve[quantities.Count];
        _quantityValues = new double[quantities.Count][];
        for (int q = 0; q < quantities.Count; q++)
        {
            var tq = quantities[q] ?? throw new ArgumentNullException(nameof(quantities));
            if (tq.Values.Count != _r.Length) throw new ArgumentException($"Quantity '{tq.Quantity.Name}' has {tq.Values.Count} values for {_r.Length} rows.", nameof(quantities));
            double[] v = [.. tq.Values];
            for (int i = 0; i < v.Length; i++)
                if (!double.IsFinite(v[i])) throw new ArgumentException($"Row {i}, quantity '{tq.Quantity.Name}': value {v[i]} is not finite.", nameof(quantities));
            for (int j = 0; j < q; j++)
                if (_quantities[j].Name == tq.Quantity.Name) throw new ArgumentException($"Quantity '{tq.Quantity.Name}' is given twice.", nameof(quantities));
            _quantities[q] = tq.Quantity;
            _quantityValues[q] = v;
            _quantityCurves[q] = ProfileCurve.Build(_r, v, density: false);
        }

        _density = ProfileCurve.Build(_r, _rho, density: true);
        BuildPanels();
        if (_tabulatedMass is not null)
        {
            Consistency = CompareMasses(options.MassSource);
            if (options.MassSource == MassSource.Tabulated)
            {
                RenormaliseToTabulatedMasses();
                BuildPanels();
            }
        }
        OuterRadius = _r[^1];
        TotalMass = _pM0[^1];
        var steps = new List<double>();
        for (int i = 0; i + 1 < _r.Length; i++)
            if (_r[i] == _r[i + 1] && _r[i] > 0 && _r[i] < OuterRadius && (steps.Count == 0 || steps[^1] != _r[i])) steps.Add(_r[i]);
        DensitySteps = steps;
        Fingerprint = ComputeFingerprint();
    }

    /// <summary>The options the profile was built with.</summary>
    public TabulatedProfileOptions Options { get; }

    /// <summary>Agreement of tabulated and integrated enclosed mass; null when the table gave no mass column.</summary>
    public MassConsistency? Consistency { get; }

    /// <summary>Number of rows.</summary>
    public int RowCount => _r.Length;

    /// <summary>Row radii, length units.</summary>
    public ReadOnlySpan<double> RowRadii => _r;

    /// <summary>Row densities, mass/length³.</summary>
    public ReadOnlySpan<double> RowDensities => _rho;

    /// <summary>
    /// Mass inside the first row's radius when the table starts off centre (r0 &gt; 0), mass units: the part of the body
    /// that comes from the core extrapolation, not from the rows; 0 when the table starts at r = 0. A large share (a table
    /// that starts far out, or a steep first segment continued inward as a cusp) usually means rows are missing.
    /// </summary>
    public double ExtrapolatedCoreMass => _r[0] > 0 ? EnclosedMass(_r[0]) : 0.0;

    /// <summary>Number of panels of the precomputed mass integral.</summary>
    public int PanelCount => _pM0.Length - 1;

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

    /// <summary>The radii repeated on two consecutive rows (density steps), ascending, strictly inside (0, R); length units.</summary>
    public IReadOnlyList<double> DensitySteps { get; }

    /// <inheritdoc />
    public double Density(double r) => r >= 0 && r <= OuterRadius ? _density.Evaluate(r) : 0.0;

    /// <inheritdoc />
    public void Density(ReadOnlySpan<double> r, Span<double> rho)
    {
        ProfileGuards.SpanLengths(r.Length, rho.Length, nameof(rho));
        for (int i = 0; i < r.Length; i++) rho[i] = Density(r[i]);
    }

    /// <inheritdoc />
    public bool TryQuantity(string name, double r, out double value)
    {
        for (int q = 0; q < _quantities.Length; q++)
        {
            if (_quantities[q].Name != name) continue;
            value = r >= 0 && r <= OuterRadius ? _quantityCurves[q].Evaluate(r) : 0.0;
            return true;
        }
        value = double.NaN;
        return false;
    }

    /// <summary>Value of a carried quantity at r; see <see cref="TryQuantity"/>.</summary>
    /// <exception cref="KeyNotFoundException">The profile does not carry <paramref name="name"/>.</exception>
    public double Quantity(string name, double r) =>
        TryQuantity(name, r, out double v) ? v : throw new KeyNotFoundException($"The profile carries no quantity '{name}'.");

    /// <summary>
    /// A copy of this profile that also carries the hydrostatic pressure P(r) = P_surface + ∫_r^R G M(s) ρ(s)/s² ds at
    /// every row (integrated per row interval by adaptive Gauss–Legendre quadrature to 1e-12 relative), e.g. for tables
    /// that give no pressure. Units: mass/(length·time²) of <see cref="Units"/>, G from the unit system.
    /// </summary>
    /// <remarks>Hydrostatic equilibrium dP/dr = −G M ρ / r² (e.g. Kippenhahn, Weigert &amp; Weiss 2012, Stellar Structure and Evolution, eq. 2.4).</remarks>
    /// <param name="name">Name of the new quantity.</param>
    /// <param name="surfacePressure">Pressure at R, in the same units; ≥ 0.</param>
    /// <exception cref="ArgumentException">The profile already carries a quantity of that name.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="surfacePressure"/> is negative or not finite.</exception>
    public TabulatedProfile WithHydrostaticPressure(string name = "P", double surfacePressure = 0)
    {
        ArgumentNullException.ThrowIfNull(name);
        if (!(surfacePressure >= 0) || !double.IsFinite(surfacePressure))
            throw new ArgumentOutOfRangeException(nameof(surfacePressure), surfacePressure, "Surface pressure must be finite and ≥ 0.");
        foreach (var q in _quantities)
            if (q.Name == name) throw new ArgumentException($"The profile already carries a quantity '{name}'.", nameof(name));
        double g = Units.GravitationalConstant;
        var p = new double[_r.Length];
        p[^1] = surfacePressure;
        for (int i = _r.Length - 2; i >= 0; i--)
        {
            double a = _r[i], b = _r[i + 1];
            p[i] = p[i + 1] + (b > a ? Numerics.AdaptiveQuadrature.Integrate(s => g * EnclosedMass(s) * Density(s) / (s * s), a, b, 1e-12).Value : 0);
        }
        var list = new List<TabulatedQuantity>(_quantities.Length + 1);
        for (int q = 0; q < _quantities.Length; q++) list.Add(new TabulatedQuantity(_quantities[q], _quantityValues[q]));
        list.Add(new TabulatedQuantity(new ProfileQuantity(name, PhysicalUnit.ForSystem(Units, -1, 1, -2)), p));
        return new TabulatedProfile(_r, _rho, Units, Options, _tabulatedMass, list);
    }

    /// <summary>Asserts the internal invariants (contiguous segments, non-decreasing cumulative mass, M(R) = total, r(M(r)) = r at panel ends).</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken.</exception>
    public void CheckValidity()
    {
        for (int k = 1; k < _density.Count; k++)
            if (_density.R0[k] != _density.R1[k - 1]) throw new InvalidOperationException($"Segment {k} does not start where segment {k - 1} ends.");
        for (int p = 0; p + 1 < _pM0.Length; p++)
        {
            // Far out in a steep envelope a panel's mass can fall below the rounding of the cumulative mass, so equal
            // neighbours are legal; the inverse is checked only where the cumulative mass is distinct.
            if (!(_pM0[p + 1] >= _pM0[p])) throw new InvalidOperationException($"Panel {p} has negative mass.");
            double r = _pR0[p];
            if (r > 0 && _pM0[p] > _pM0[p - 1] && _pM0[p + 1] > _pM0[p])
            {
                double back = RadiusOfEnclosedMass(_pM0[p]);
                if (Math.Abs(back / r - 1) > 1e-12) throw new InvalidOperationException($"r(M(r)) = {back} at panel start r = {r}.");
            }
        }
        if (EnclosedMass(OuterRadius) != TotalMass) throw new InvalidOperationException("M(R) differs from the total mass.");
    }

    private static void Throw(TableProblem? problem)
    {
        if (problem is { } p) throw new ArgumentException($"Row {p.Row}, {p.Column} = {p.Value}: {p.Message}.");
    }

    private string ComputeFingerprint()
    {
        using var h = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        h.AppendData(MemoryMarshal.AsBytes(_r.AsSpan()));
        h.AppendData(MemoryMarshal.AsBytes(_rho.AsSpan()));
        if (_tabulatedMass is not null && Options.MassSource == MassSource.Tabulated) h.AppendData(MemoryMarshal.AsBytes(_tabulatedMass.AsSpan()));
        for (int q = 0; q < _quantities.Length; q++)
        {
            h.AppendData(System.Text.Encoding.UTF8.GetBytes(_quantities[q].Name + "[" + _quantities[q].Unit.Name + "]"));
            h.AppendData(MemoryMarshal.AsBytes(_quantityValues[q].AsSpan()));
        }
        h.AppendData(System.Text.Encoding.UTF8.GetBytes(Units.Name));
        return "table:" + Convert.ToHexString(h.GetHashAndReset(), 0, 12).ToLowerInvariant();
    }
}
