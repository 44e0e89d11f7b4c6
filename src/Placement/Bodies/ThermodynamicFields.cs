using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Gives placed points a thermodynamic state from their profile: specific internal energy u and every carried quantity.</summary>
/// <remarks>
/// <para>Target state at a point's radius r: density ρ(r), pressure P(r) (the profile quantity with the dimension of
/// pressure, <see cref="ScaleHeights.PressureQuantity"/>) and u_t(r) = P / ((γ − 1) ρ) for an ideal gas of adiabatic
/// index γ, or the profile's own specific-energy quantity (<see cref="InternalEnergySource.Profile"/>). The point's u is
/// u_t(r) when density and pressure are matched, and u_t(r) (ρ_pt / ρ(r))^(γ − 1) when density and entropy are
/// matched (the adiabat K = P / ρ^γ of the profile kept at the point's own density estimate ρ_pt: an SPH or Voronoi
/// m/V density). Ideal-gas relations P = (γ − 1) ρ u and K = P / ρ^γ (standard thermodynamics).</para>
/// <para>Report: with a point density the implied pressure (γ − 1) ρ_pt u and adiabat (γ − 1) u ρ_pt^(1−γ) are compared,
/// point by point, with the reference P and K at the same radius (unweighted rms and maximum of the relative
/// deviation): the matched quantity shows rounding only, the other one shows what the choice costs.</para>
/// <para>Units: u in length²/time² of the point set's units; carried quantities in their profile units. Points where
/// ρ(r) or u_t(r) is not positive (at or beyond the surface) get u = 0 and are counted as undefined. Every point is
/// independent, so the result does not depend on the thread count.</para>
/// </remarks>
public static class ThermodynamicFields
{
    /// <summary>Name of the first profile quantity with the dimension of specific energy (length²/time², e.g. erg/g), or null.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    public static string? InternalEnergyQuantity(IRadialProfile profile) => QuantityLookup.FirstWithDimension(profile, 2, 0, -2, 0);

    /// <summary>Name of the first profile quantity with the dimension of temperature (K), or null.</summary>
    /// <exception cref="ArgumentNullException"><paramref name="profile"/> is null.</exception>
    public static string? TemperatureQuantity(IRadialProfile profile) => QuantityLookup.FirstWithDimension(profile, 0, 0, 0, 1);

    /// <summary>Computes u for every point and carries every profile quantity along (see the remarks of <see cref="ThermodynamicFields"/>).</summary>
    /// <param name="points">The placed points (positions relative to the profile centre).</param>
    /// <param name="profile">The target profile, in the points' unit system.</param>
    /// <param name="options">γ, energy source and match; defaults when null.</param>
    /// <param name="pointDensity">Each point's own density estimate ρ_pt (mass/length³, finite and &gt; 0), e.g. SPH or
    /// Voronoi m/V; required for <see cref="ThermodynamicMatch.DensityEntropy"/>, optional otherwise (without it the
    /// deviations are not computed).</param>
    /// <param name="parallel">Parallelism; results are identical for any setting.</param>
    /// <exception cref="ArgumentOutOfRangeException">γ is not finite and &gt; 1.</exception>
    /// <exception cref="InvalidOperationException">The profile lacks what the source needs: a pressure for the ideal gas,
    /// a specific-energy quantity for <see cref="InternalEnergySource.Profile"/>.</exception>
    /// <exception cref="ArgumentException">The units differ, the point density has the wrong length or a value that is
    /// not finite and positive, it is missing for an entropy match, or the named energy quantity is absent or of the wrong dimension.</exception>
    public static ThermodynamicState Compute(PointSet points, IRadialProfile profile, ThermodynamicOptions? options = null,
        double[]? pointDensity = null, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(profile);
        var o = options ?? new ThermodynamicOptions();
        o.Validate();
        if (points.Units != profile.Units)
            throw new ArgumentException($"The points are in '{points.Units.Name}' units but the profile in '{profile.Units.Name}'.", nameof(points));
        int n = points.Count;
        string? pressureName = ScaleHeights.PressureQuantity(profile);
        string? energyName = null;
        if (o.Source == InternalEnergySource.Profile)
        {
            energyName = o.InternalEnergyQuantity ?? InternalEnergyQuantity(profile)
                ?? throw new InvalidOperationException("The profile carries no specific internal energy (no quantity with the dimension length^2/time^2, e.g. erg/g); use the ideal-gas source instead.");
            ProfileQuantity? named = null;
            foreach (var q in profile.Quantities) if (q.Name == energyName) named = q;
            if (named is null || !IsSpecificEnergy(named.Unit))
                throw new ArgumentException($"The profile quantity '{energyName}' {(named is null ? "does not exist" : $"has unit '{named.Unit.Name}', not a specific energy (length^2/time^2)")}.", nameof(options));
        }
        else if (pressureName is null)
            throw new InvalidOperationException("The profile carries no pressure (no quantity with the dimension of pressure), so an ideal-gas internal energy is undefined.");
        if (pointDensity is not null)
        {
            if (pointDensity.Length != n)
                throw new ArgumentException($"The point density has {pointDensity.Length} values for {n} points.", nameof(pointDensity));
            for (int i = 0; i < n; i++)
                if (!(pointDensity[i] > 0) || !double.IsFinite(pointDensity[i]))
                    throw new ArgumentException($"Point {i} has density estimate {pointDensity[i]}; expected finite and > 0.", nameof(pointDensity));
        }
        else if (o.Match == ThermodynamicMatch.DensityEntropy)
            throw new ArgumentException("Matching density and entropy needs each point's own density estimate (SPH or Voronoi m/V).", nameof(pointDensity));

        var quantities = profile.Quantities;
        var carried = new CarriedQuantity[quantities.Count];
        int pressureIndex = -1, energyIndex = -1;
        for (int q = 0; q < carried.Length; q++)
        {
            carried[q] = new CarriedQuantity(quantities[q], new double[n]);
            if (quantities[q].Name == pressureName) pressureIndex = q;
            if (quantities[q].Name == energyName) energyIndex = q;
        }
        var u = new double[n];
        var settings = parallel ?? ParallelSettings.Default;
        int chunk = ParallelLoop.ChunkSize(n, settings.MinimumChunk);
        int chunks = n == 0 ? 0 : (n + chunk - 1) / chunk;
        var partial = new DeviationSums[chunks];
        double g1 = o.Gamma - 1;
        bool entropy = o.Match == ThermodynamicMatch.DensityEntropy;
        ParallelLoop.For(n, settings, (start, end) =>
        {
            var sums = new DeviationSums();
            for (int i = start; i < end; i++)
            {
                double r = points.Radius(i);
                for (int q = 0; q < carried.Length; q++)
                    if (!profile.TryQuantity(quantities[q].Name, r, out carried[q].Values[i])) carried[q].Values[i] = double.NaN;
                double rho = profile.Density(r);
                double pressure = pressureIndex >= 0 ? carried[pressureIndex].Values[i] : double.NaN;
                double target = energyIndex >= 0 ? carried[energyIndex].Values[i] : pressure / (g1 * rho);
                if (!(rho > 0) || !(target > 0) || !double.IsFinite(target))
                {
                    u[i] = 0;
                    sums.Undefined++;
                    continue;
                }
                double reference = pressure > 0 ? pressure : g1 * rho * target;
                double own = pointDensity is null ? double.NaN : pointDensity[i];
                double ratio = own / rho;
                double value = entropy ? target * Math.Pow(ratio, g1) : target;
                u[i] = value;
                if (pointDensity is null) continue;
                double pressureRatio = g1 * own * value / reference;
                sums.Pressure.Add(pressureRatio - 1);
                // K_pt / K_ref = (P_pt / P_ref) (ρ / ρ_pt)^γ.
                sums.Entropy.Add(pressureRatio * Math.Pow(ratio, -o.Gamma) - 1);
                sums.Density.Add(ratio - 1);
            }
            partial[start / chunk] = sums;
        });
        var total = new DeviationSums();
        foreach (var p in partial) total.Merge(p);
        return new ThermodynamicState(o, u, carried, pressureName, energyName,
            total.Pressure.Result(), total.Entropy.Result(), total.Density.Result(), total.Undefined);
    }

    /// <summary>True when <paramref name="unit"/> has the dimension of a specific energy, length²/time² (e.g. erg/g).</summary>
    /// <exception cref="ArgumentNullException"><paramref name="unit"/> is null.</exception>
    public static bool IsSpecificEnergy(PhysicalUnit unit)
    {
        ArgumentNullException.ThrowIfNull(unit);
        return unit is { Length: 2, Mass: 0, Time: -2, Temperature: 0 };
    }

    /// <summary>Per-chunk sums of the three deviations, merged in chunk order (thread-count independent).</summary>
    private struct DeviationSums
    {
        public DeviationAccumulator Pressure, Entropy, Density;
        public int Undefined;

        public void Merge(DeviationSums other)
        {
            Pressure.Merge(other.Pressure);
            Entropy.Merge(other.Entropy);
            Density.Merge(other.Density);
            Undefined += other.Undefined;
        }
    }
}
