using Placement.Units;

namespace Placement.Points;

/// <summary>
/// A set of N points in 3-D stored as structure-of-arrays, with per-point mass, target density and layer index.
/// </summary>
/// <remarks>
/// Layout: <c>X[i], Y[i], Z[i]</c> are the position of point i (length units of <see cref="Units"/>);
/// <c>Mass[i]</c> its mass (mass units; for mesh-generating points this may be filled later from cell
/// volumes); <c>TargetDensity[i]</c> the profile density ρ(|x_i|) at the point (mass/length³);
/// <c>Layer[i]</c> the shell or layer index the sampler put it in, −1 where a sampler has no layers, −2 for points of a
/// background medium around the body (<see cref="PointLayers"/>).
/// All arrays have exactly <see cref="Count"/> elements. The arrays are exposed directly so hot loops can
/// take spans of them; <see cref="CheckValidity"/> asserts the invariants.
/// Memory: 5 × 8 + 4 = 44 bytes per point.
/// </remarks>
public sealed class PointSet
{
    /// <summary>Allocates a point set of <paramref name="count"/> points with all fields zero and layer −1.</summary>
    /// <param name="count">Number of points, ≥ 0.</param>
    /// <param name="units">Units of positions, masses and densities.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="count"/> is negative.</exception>
    public PointSet(int count, UnitSystem units)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        ArgumentNullException.ThrowIfNull(units);
        Count = count;
        Units = units;
        X = new double[count];
        Y = new double[count];
        Z = new double[count];
        Mass = new double[count];
        TargetDensity = new double[count];
        Layer = new int[count];
        Array.Fill(Layer, -1);
        Provenance = new Provenance();
    }

    /// <summary>Number of points.</summary>
    public int Count { get; }

    /// <summary>Units of positions (length), masses (mass) and densities (mass/length³).</summary>
    public UnitSystem Units { get; }

    /// <summary>x coordinates, length units.</summary>
    public double[] X { get; }

    /// <summary>y coordinates, length units.</summary>
    public double[] Y { get; }

    /// <summary>z coordinates, length units.</summary>
    public double[] Z { get; }

    /// <summary>Point masses, mass units.</summary>
    public double[] Mass { get; }

    /// <summary>Target density ρ(|x|) of the profile at each point, mass/length³.</summary>
    public double[] TargetDensity { get; }

    /// <summary>Shell or layer index of each point, −1 where the sampler has no layers, −2 for background points (<see cref="PointLayers"/>).</summary>
    public int[] Layer { get; }

    /// <summary>What made this point set (sampler, parameters, seed, library version, profile fingerprint).</summary>
    public Provenance Provenance { get; set; }

    /// <summary>Distance of point <paramref name="i"/> from the origin.</summary>
    public double Radius(int i) => Math.Sqrt(X[i] * X[i] + Y[i] * Y[i] + Z[i] * Z[i]);

    /// <summary>Sum of all point masses (compensated summation).</summary>
    public double TotalMass()
    {
        double sum = 0, c = 0;
        foreach (double m in Mass)
        {
            double y = m - c;
            double t = sum + y;
            c = (t - sum) - y;
            sum = t;
        }
        return sum;
    }

    /// <summary>
    /// Asserts the invariants: all coordinates finite, masses finite and ≥ 0, target densities finite and ≥ 0,
    /// layers ≥ −2 (<see cref="PointLayers"/>).
    /// </summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the point and field.</exception>
    public void CheckValidity()
    {
        for (int i = 0; i < Count; i++)
        {
            if (!double.IsFinite(X[i]) || !double.IsFinite(Y[i]) || !double.IsFinite(Z[i]))
                throw new InvalidOperationException($"Point {i} has a non-finite position ({X[i]}, {Y[i]}, {Z[i]}).");
            if (!(Mass[i] >= 0) || !double.IsFinite(Mass[i]))
                throw new InvalidOperationException($"Point {i} has mass {Mass[i]}; expected finite and >= 0.");
            if (!(TargetDensity[i] >= 0) || !double.IsFinite(TargetDensity[i]))
                throw new InvalidOperationException($"Point {i} has target density {TargetDensity[i]}; expected finite and >= 0.");
            if (Layer[i] < PointLayers.Background)
                throw new InvalidOperationException($"Point {i} has layer {Layer[i]}; expected >= {PointLayers.Background}.");
        }
    }
}
