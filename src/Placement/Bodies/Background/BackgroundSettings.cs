namespace Placement.Bodies.Background;

/// <summary>What background medium to place around a body: the box, its uniform density and pressure, and the spacing law.</summary>
/// <remarks>All values in the body's unit system: lengths, mass/length³, mass/(length·time²).</remarks>
public sealed record BackgroundSettings
{
    /// <summary>Full side L of the cubic box, length units.</summary>
    public required double BoxSide { get; init; }

    /// <summary>Uniform background density ρ_bg, mass/length³; positive.</summary>
    public required double Density { get; init; }

    /// <summary>Uniform background pressure, mass/(length·time²); ≥ 0.</summary>
    public double Pressure { get; init; }

    /// <summary>True for a periodic box (points in [min, max) on every axis), false for solid walls.</summary>
    public bool Periodic { get; init; }

    /// <summary>
    /// Relative growth g of the spacing from one background shell to the next: s_(k+1) = (1 + g) s_k. Default 0.1; 0 keeps the
    /// surface spacing everywhere.
    /// </summary>
    public double SpacingGrowth { get; init; } = 0.1;

    /// <summary>Spacing of the first background shell, length units; NaN (default) measures it from the body's outermost points.</summary>
    public double SurfaceSpacing { get; init; } = double.NaN;

    /// <summary>Largest spacing allowed, length units; infinity (default) lets it grow up to the box edge.</summary>
    public double MaximumSpacing { get; init; } = double.PositiveInfinity;

    /// <summary>Asserts the ranges of every field.</summary>
    /// <exception cref="ArgumentException">A field is out of range; the message names it and its value.</exception>
    public void Validate()
    {
        if (!(BoxSide > 0) || !double.IsFinite(BoxSide)) throw new ArgumentException($"Background box side {BoxSide} must be positive and finite.");
        if (!(Density > 0) || !double.IsFinite(Density)) throw new ArgumentException($"Background density {Density} must be positive and finite.");
        if (!(Pressure >= 0) || !double.IsFinite(Pressure)) throw new ArgumentException($"Background pressure {Pressure} must be >= 0 and finite.");
        if (!(SpacingGrowth >= 0 && SpacingGrowth <= 10)) throw new ArgumentException($"Background spacing growth {SpacingGrowth} must lie in [0, 10].");
        if (!double.IsNaN(SurfaceSpacing) && !(SurfaceSpacing > 0 && double.IsFinite(SurfaceSpacing)))
            throw new ArgumentException($"Background surface spacing {SurfaceSpacing} must be positive and finite (or NaN to measure it).");
        if (!(MaximumSpacing > 0)) throw new ArgumentException($"Background maximum spacing {MaximumSpacing} must be positive.");
    }
}
