namespace Placement.Samplers;

/// <summary>The position arrays of one batch, handed to <see cref="IPointSampler.Fill"/>: x, y and z of its points.</summary>
/// <remarks>All three spans have the batch's length; coordinates are in the profile's length units.</remarks>
public readonly ref struct PointSpans
{
    /// <summary>Wraps three equally long spans.</summary>
    /// <exception cref="ArgumentException">The spans differ in length.</exception>
    public PointSpans(Span<double> x, Span<double> y, Span<double> z)
    {
        if (x.Length != y.Length || x.Length != z.Length)
            throw new ArgumentException($"Coordinate spans differ in length ({x.Length}, {y.Length}, {z.Length}).");
        X = x;
        Y = y;
        Z = z;
    }

    /// <summary>x coordinates.</summary>
    public Span<double> X { get; }

    /// <summary>y coordinates.</summary>
    public Span<double> Y { get; }

    /// <summary>z coordinates.</summary>
    public Span<double> Z { get; }

    /// <summary>Number of points.</summary>
    public int Length => X.Length;
}
