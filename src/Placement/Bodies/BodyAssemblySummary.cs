using Placement.Bodies.Background;

namespace Placement.Bodies;

/// <summary>What <see cref="BodyAssembly"/> added to a placed body, for the report's body section.</summary>
/// <param name="PointMasses">Every point mass in the final (centre-of-mass) frame: cores and companions.</param>
/// <param name="Shift">The centre of mass (position, velocity) that was subtracted from everything; zero shift when none was applied.</param>
/// <param name="ResidualOffset">|Σ m x| / M after the shift, length units.</param>
/// <param name="ResidualVelocity">|Σ m v| / M after the shift, length/time units.</param>
/// <param name="Background">The background medium, or null.</param>
public sealed record BodyAssemblySummary(IReadOnlyList<PointMass> PointMasses, CentreOfMass Shift, double ResidualOffset,
    double ResidualVelocity, BackgroundSummary? Background);
