using System.Globalization;

namespace Placement.Profiles;

/// <summary>One problem found in tabulated profile data: the 0-based row, the column role, the value and what is wrong.</summary>
internal readonly record struct TableProblem(int Row, string Column, double Value, string Message);

/// <summary>The validity rules for tabulated profiles, shared by <see cref="TabulatedProfile"/> and the table reader.</summary>
internal static class ProfileTableChecks
{
    /// <summary>Checks coordinate (radius or mass) and density columns; returns the first problem or null.</summary>
    public static TableProblem? Check(ReadOnlySpan<double> coordinate, ReadOnlySpan<double> density, bool allowZeroOuter, bool allowSteps, string coordinateName)
    {
        int n = coordinate.Length;
        if (n < 2) return new TableProblem(Math.Max(0, n - 1), coordinateName, n, $"a profile needs at least two rows, got {n}");
        if (density.Length != n) return new TableProblem(0, "density", density.Length, "density and coordinate columns differ in length");
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(coordinate[i])) return new TableProblem(i, coordinateName, coordinate[i], $"{coordinateName} is not finite");
            if (!double.IsFinite(density[i])) return new TableProblem(i, "density", density[i], "density is not finite");
            if (density[i] < 0) return new TableProblem(i, "density", density[i], "density is negative");
            if (density[i] == 0)
            {
                if (i != n - 1) return new TableProblem(i, "density", 0, "zero density is allowed only at the outer edge (last row)");
                if (!allowZeroOuter) return new TableProblem(i, "density", 0, "zero density at the outer edge is not allowed by the options");
            }
        }
        if (coordinate[0] < 0) return new TableProblem(0, coordinateName, coordinate[0], $"{coordinateName} is negative");
        for (int i = 0; i + 1 < n; i++)
        {
            double a = coordinate[i], b = coordinate[i + 1];
            if (b < a) return new TableProblem(i + 1, coordinateName, b, string.Create(CultureInfo.InvariantCulture, $"{coordinateName} decreases (previous row has {a:R}); rows must be ordered outward"));
            if (b > a) continue;
            if (!allowSteps) return new TableProblem(i + 1, coordinateName, b, $"duplicated {coordinateName} (density steps are disabled in the options)");
            if (i == 0 || i + 1 == n - 1) return new TableProblem(i + 1, coordinateName, b, $"duplicated {coordinateName} at the first or last row (a density step needs rows on both sides)");
            if (i + 2 < n && coordinate[i + 2] == b) return new TableProblem(i + 2, coordinateName, b, $"{coordinateName} repeated more than twice");
            if (density[i] == density[i + 1]) return new TableProblem(i + 1, coordinateName, b, $"duplicated {coordinateName} with equal density (a repeated {coordinateName} marks a density step and needs two different densities)");
        }
        return null;
    }

    /// <summary>Checks a column of tabulated enclosed masses against the radii; returns the first problem or null.</summary>
    public static TableProblem? CheckMasses(ReadOnlySpan<double> radius, ReadOnlySpan<double> mass)
    {
        if (mass.Length != radius.Length) return new TableProblem(0, "mass", mass.Length, "mass and radius columns differ in length");
        for (int i = 0; i < mass.Length; i++)
        {
            if (!double.IsFinite(mass[i])) return new TableProblem(i, "mass", mass[i], "enclosed mass is not finite");
            if (mass[i] < 0) return new TableProblem(i, "mass", mass[i], "enclosed mass is negative");
            if (radius[i] == 0 && mass[i] != 0) return new TableProblem(i, "mass", mass[i], "enclosed mass at r = 0 must be 0");
            // Non-decreasing only: far out in a steep envelope successive masses can be equal to the table's precision.
            if (i > 0 && mass[i] < mass[i - 1])
                return new TableProblem(i, "mass", mass[i], "enclosed mass decreases outward");
            if (i > 0 && radius[i] == radius[i - 1] && mass[i] != mass[i - 1])
                return new TableProblem(i, "mass", mass[i], "enclosed mass differs between the two rows of a density step");
        }
        return null;
    }
}
