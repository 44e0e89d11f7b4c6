namespace Placement.Bodies;

/// <summary>
/// A point mass that is not a gas point: a softened stellar core left by core replacement, or a companion star,
/// planet or black hole. Positions, velocities, mass and softening length are in the unit system of the point
/// set it travels with (length, length/time, mass).
/// </summary>
/// <remarks>
/// The softening length h is the radius beyond which the point mass's gravity is exactly Newtonian (a kernel of
/// compact support; the kernel itself is documented where the softened potential is computed). h = 0 means an
/// unsoftened point mass.
/// </remarks>
/// <param name="Name">Short identifier, e.g. "core" or "companion" (letters, digits, '_' and '-').</param>
/// <param name="Mass">Mass, mass units; positive and finite.</param>
/// <param name="SofteningLength">Softening length h, length units; zero or positive and finite.</param>
/// <param name="X">Position x, length units.</param>
/// <param name="Y">Position y, length units.</param>
/// <param name="Z">Position z, length units.</param>
/// <param name="Vx">Velocity x, length/time units.</param>
/// <param name="Vy">Velocity y, length/time units.</param>
/// <param name="Vz">Velocity z, length/time units.</param>
public sealed record PointMass(string Name, double Mass, double SofteningLength,
    double X = 0, double Y = 0, double Z = 0, double Vx = 0, double Vy = 0, double Vz = 0)
{
    /// <summary>Asserts the invariants: a non-empty identifier name, positive finite mass, finite non-negative softening, finite state.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the field and value.</exception>
    public void CheckValidity()
    {
        if (string.IsNullOrEmpty(Name) || !Name.All(c => char.IsAsciiLetterOrDigit(c) || c is '_' or '-'))
            throw new InvalidOperationException($"Point mass name '{Name}' must be non-empty and use only letters, digits, '_' and '-'.");
        if (!(Mass > 0) || !double.IsFinite(Mass))
            throw new InvalidOperationException($"Point mass '{Name}': mass {Mass} must be positive and finite.");
        if (!(SofteningLength >= 0) || !double.IsFinite(SofteningLength))
            throw new InvalidOperationException($"Point mass '{Name}': softening length {SofteningLength} must be zero or positive and finite.");
        foreach (double v in new[] { X, Y, Z, Vx, Vy, Vz })
            if (!double.IsFinite(v))
                throw new InvalidOperationException($"Point mass '{Name}': position and velocity must be finite (got ({X}, {Y}, {Z}), ({Vx}, {Vy}, {Vz})).");
    }
}
