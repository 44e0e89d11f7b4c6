namespace Placement.Geometry;

/// <summary>A 3×3 rotation matrix in double precision, stored row by row (R00 R01 R02 / R10 … / R20 …).</summary>
/// <remarks>
/// Applied as v' = R v. Built from <see cref="UnitQuaternion.ToRotation"/>; <see cref="CheckValidity"/> asserts
/// RᵀR = I and det R = +1 to a tolerance.
/// </remarks>
/// <param name="R00">Row 0, column 0.</param>
/// <param name="R01">Row 0, column 1.</param>
/// <param name="R02">Row 0, column 2.</param>
/// <param name="R10">Row 1, column 0.</param>
/// <param name="R11">Row 1, column 1.</param>
/// <param name="R12">Row 1, column 2.</param>
/// <param name="R20">Row 2, column 0.</param>
/// <param name="R21">Row 2, column 1.</param>
/// <param name="R22">Row 2, column 2.</param>
public readonly record struct Rotation3(
    double R00, double R01, double R02,
    double R10, double R11, double R12,
    double R20, double R21, double R22)
{
    /// <summary>The identity matrix.</summary>
    public static Rotation3 Identity => new(1, 0, 0, 0, 1, 0, 0, 0, 1);

    /// <summary>Determinant of the matrix (+1 for a proper rotation).</summary>
    public double Determinant =>
        R00 * (R11 * R22 - R12 * R21) - R01 * (R10 * R22 - R12 * R20) + R02 * (R10 * R21 - R11 * R20);

    /// <summary>Trace R00 + R11 + R22 = 1 + 2 cos ω, where ω is the rotation angle.</summary>
    public double Trace => R00 + R11 + R22;

    /// <summary>Rotates the vector (x, y, z).</summary>
    public (double X, double Y, double Z) Apply(double x, double y, double z) =>
        (R00 * x + R01 * y + R02 * z, R10 * x + R11 * y + R12 * z, R20 * x + R21 * y + R22 * z);

    /// <summary>Largest absolute entry of RᵀR − I.</summary>
    public double OrthonormalityError()
    {
        double worst = 0;
        Span<double> m = [R00, R01, R02, R10, R11, R12, R20, R21, R22];
        for (int a = 0; a < 3; a++)
        {
            for (int b = 0; b < 3; b++)
            {
                double dot = m[a] * m[b] + m[3 + a] * m[3 + b] + m[6 + a] * m[6 + b];
                worst = Math.Max(worst, Math.Abs(dot - (a == b ? 1 : 0)));
            }
        }
        return worst;
    }

    /// <summary>Asserts that the matrix is orthonormal with determinant +1 within <paramref name="tolerance"/>.</summary>
    /// <param name="tolerance">Allowed absolute error of RᵀR − I and of det R − 1; default 1e−12.</param>
    /// <exception cref="InvalidOperationException">The matrix is not a proper rotation within the tolerance.</exception>
    public void CheckValidity(double tolerance = 1e-12)
    {
        double e = OrthonormalityError();
        if (!(e <= tolerance)) throw new InvalidOperationException($"Rotation is not orthonormal: max |RᵀR − I| = {e}, tolerance {tolerance}.");
        double d = Determinant;
        if (!(Math.Abs(d - 1) <= tolerance)) throw new InvalidOperationException($"Rotation has determinant {d}; expected +1 within {tolerance}.");
    }
}
