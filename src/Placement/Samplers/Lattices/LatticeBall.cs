using Placement.Geometry;

namespace Placement.Samplers.Lattices;

/// <summary>
/// The points of a shifted lattice inside a ball |p + shift| ≤ radius, enumerated plane by plane (basis b, index k)
/// and row by row (j), with each row's i range found in closed form. Counting and filling share the same range
/// arithmetic, so they agree exactly.
/// </summary>
internal readonly struct LatticeBall(Lattice lattice, double sx, double sy, double sz, double radius)
{
    public Lattice Lattice { get; } = lattice;

    public double Radius { get; } = radius;

    /// <summary>Planes k of basis point b that can hold points: k with |z| ≤ radius.</summary>
    public (int Lo, int Hi) Planes(int b)
    {
        var (_, _, bz) = Lattice.Basis(b);
        return Range(Radius, sz, Lattice.CellZ, bz);
    }

    /// <summary>Rows j of plane (b, k) and the plane's z (before the shift is removed: z includes it).</summary>
    public (int Lo, int Hi, double Z, double Rho) Rows(int b, int k)
    {
        var (_, by, bz) = Lattice.Basis(b);
        double z = Lattice.CellZ * (k + bz) + sz;
        double rho2 = Radius * Radius - z * z;
        if (rho2 < 0) return (1, 0, z, 0);
        double rho = Math.Sqrt(rho2);
        var (lo, hi) = Range(rho, sy, Lattice.CellY, by);
        return (lo, hi, z, rho);
    }

    /// <summary>The i range of row j in plane (b, k), and the row's y (shift included).</summary>
    public (int Lo, int Hi, double Y) Columns(int b, int j, double z)
    {
        var (bx, by, _) = Lattice.Basis(b);
        double y = Lattice.CellY * (j + by) + sy;
        double rho2 = Radius * Radius - z * z - y * y;
        if (rho2 < 0) return (1, 0, y);
        var (lo, hi) = Range(Math.Sqrt(rho2), sx, Lattice.CellX, bx);
        return (lo, hi, y);
    }

    /// <summary>x of column i of basis b (shift included).</summary>
    public double X(int b, int i) => Lattice.CellX * (i + Lattice.Basis(b).X) + sx;

    /// <summary>Number of points in plane (b, k).</summary>
    public long CountPlane(int b, int k)
    {
        var (jLo, jHi, z, _) = Rows(b, k);
        long n = 0;
        for (int j = jLo; j <= jHi; j++)
        {
            var (iLo, iHi, _) = Columns(b, j, z);
            if (iHi >= iLo) n += iHi - iLo + 1;
        }
        return n;
    }

    /// <summary>Number of points in the ball.</summary>
    public long Count()
    {
        long n = 0;
        for (int b = 0; b < Lattice.BasisCount; b++)
        {
            var (kLo, kHi) = Planes(b);
            for (int k = kLo; k <= kHi; k++) n += CountPlane(b, k);
        }
        return n;
    }

    /// <summary>Integers n with |cell (n + frac) + shift| ≤ half.</summary>
    private static (int Lo, int Hi) Range(double half, double shift, double cell, double frac)
    {
        double lo = Math.Ceiling((-half - shift) / cell - frac);
        double hi = Math.Floor((half - shift) / cell - frac);
        return ((int)lo, (int)hi);
    }
}
