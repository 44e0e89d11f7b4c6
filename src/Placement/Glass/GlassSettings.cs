namespace Placement.Glass;

/// <summary>Settings of the damped repulsive relaxation that makes a periodic glass tile.</summary>
public sealed record GlassSettings
{
    /// <summary>Interaction range in units of the mean spacing a = N^(−1/3) (default 2).</summary>
    public double RangeInSpacings { get; init; } = 2.0;

    /// <summary>Largest number of relaxation steps (default 400).</summary>
    public int MaxIterations { get; init; } = 400;

    /// <summary>Stop when the rms displacement of a step falls below this fraction of a (default 1e-4).</summary>
    public double Tolerance { get; init; } = 1e-4;

    /// <summary>Fraction of the previous step kept in the next (0 = pure gradient descent; default 0.8).</summary>
    public double Momentum { get; init; } = 0.8;

    /// <summary>Largest displacement of one point in one step, in units of a (default 0.1).</summary>
    public double MaxStepInSpacings { get; init; } = 0.1;
}
