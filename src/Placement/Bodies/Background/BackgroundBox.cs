namespace Placement.Bodies.Background;

/// <summary>The box a background medium fills, with its uniform density and pressure, as recorded in point files.</summary>
/// <remarks>Values in the point set's unit system: lengths, mass/length³, mass/(length·time²). The medium's points carry
/// layer <see cref="Points.PointLayers.Background"/>.</remarks>
/// <param name="MinX">Lower x of the box, length units.</param>
/// <param name="MinY">Lower y, length units.</param>
/// <param name="MinZ">Lower z, length units.</param>
/// <param name="MaxX">Upper x, length units.</param>
/// <param name="MaxY">Upper y, length units.</param>
/// <param name="MaxZ">Upper z, length units.</param>
/// <param name="Periodic">True for a periodic box.</param>
/// <param name="Density">Background density, mass/length³.</param>
/// <param name="Pressure">Background pressure, mass/(length·time²).</param>
public sealed record BackgroundBox(double MinX, double MinY, double MinZ, double MaxX, double MaxY, double MaxZ,
    bool Periodic, double Density, double Pressure)
{
    /// <summary>Asserts a non-empty finite box, positive finite density and finite non-negative pressure.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names it.</exception>
    public void CheckValidity()
    {
        if (!(MaxX > MinX && MaxY > MinY && MaxZ > MinZ) || !double.IsFinite(MaxX - MinX) || !double.IsFinite(MaxY - MinY) || !double.IsFinite(MaxZ - MinZ))
            throw new InvalidOperationException($"Background box [{MinX}, {MaxX}]×[{MinY}, {MaxY}]×[{MinZ}, {MaxZ}] must be finite with max > min.");
        if (!(Density > 0) || !double.IsFinite(Density)) throw new InvalidOperationException($"Background density {Density} must be positive and finite.");
        if (!(Pressure >= 0) || !double.IsFinite(Pressure)) throw new InvalidOperationException($"Background pressure {Pressure} must be >= 0 and finite.");
    }
}
