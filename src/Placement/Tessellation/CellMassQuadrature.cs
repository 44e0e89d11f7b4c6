using Placement.Profiles;

namespace Placement.Tessellation;

/// <summary>
/// Mass ∫ρ dV of one convex cell for a spherically symmetric profile centred at the origin, by a signed
/// tetrahedral (cone) decomposition from the profile centre with the radial integral done exactly through M(r).
/// </summary>
/// <remarks>
/// <para>For a face f with outward unit normal n̂ at signed distance h_f = n̂·x from the origin, the cone from the
/// origin over f holds ∫ρ dV = (h_f / 4π) ∫_f M(|x|) / |x|³ dA, because along each ray the mass between the origin
/// and the face is M(|x|)/(4π) per steradian and dΩ = h_f dA/|x|³ (Gauss's divergence theorem applied to the
/// cone). Summing over faces with their signs gives the cell mass exactly; only the face integral is numerical.
/// Each face is fanned into triangles from its vertex average (the same triangles for both cells that share
/// the face, so interior faces cancel to rounding), each triangle split in four until its longest edge is at most
/// <c>angle</c> × its nearest vertex's distance from the origin (at most 6 levels), and integrated by Dunavant's
/// 7-point degree-5 rule (Dunavant 1985, Int. J. Numer. Meth. Eng. 21, 1129, table for p = 5).</para>
/// <para>Error: in a box a set's total mass depends only on the wall faces (interior faces cancel), so it
/// matches the profile mass in the box to about 1e-10 relative whatever the point noise or density steps. In a
/// ball the two cells of a shared face near the surface clip it by different tangent planes, so those faces do
/// not cancel exactly: measured 2e-7 relative for a density step at the profile edge (6000 points).
/// A single cell's mass has the face quadrature error: O(β⁶) relative for smooth ρ (β the angular size of a
/// quadrature triangle, at most 0.1 by default), O(β²) locally on faces crossing a density step (M is only
/// kinked there). Triangles wholly outside the profile radius, where M(r) = M(R), are integrated exactly through
/// their solid angle. Cost: 7 calls of M(r) per triangle, about 100 triangles per cell.</para>
/// </remarks>
internal static class CellMassQuadrature
{
    // h within this multiple of the lengths it is computed from is rounding (64 ulps).
    private const double RoundingH = 64 * 2.220446049250313e-16;

    private static readonly double[] W = [0.225, 0.132394152788506, 0.132394152788506, 0.132394152788506, 0.125939180544827, 0.125939180544827, 0.125939180544827];
    private const double A1 = 0.059715871789770, B1 = 0.470142064105115, A2 = 0.797426985353087, B2 = 0.101286507323456;
    private static readonly double[] L1 = [1.0 / 3, A1, B1, B1, A2, B2, B2];
    private static readonly double[] L2 = [1.0 / 3, B1, A1, B1, B2, A2, B2];

    /// <summary>Mass of the cell (rings built) whose generator is at (gx, gy, gz) in profile coordinates.</summary>
    public static double CellMass(ConvexCell cell, double gx, double gy, double gz, IRadialProfile profile, double angle)
    {
        var nx = cell.Nx; var ny = cell.Ny; var nz = cell.Nz; var d = cell.D;
        var start = cell.RingStart; var ring = cell.Ring;
        var vx = cell.Vx; var vy = cell.Vy; var vz = cell.Vz;
        double total = 0, outer = profile.OuterRadius;
        for (int p = 0; p < cell.PlaneCount; p++)
        {
            int s = start[p], e = start[p + 1];
            if (e - s < 3) continue;
            double norm = Math.Sqrt(nx[p] * nx[p] + ny[p] * ny[p] + nz[p] * nz[p]);
            double h = (d[p] + nx[p] * gx + ny[p] * gy + nz[p] * gz) / norm;
            // A face whose plane passes through the profile centre (the bisector of two points at one radius, e.g. of a
            // central cluster placed symmetrically) has h = 0 and no cone; computed, h is rounding, ~1e-16 of the lengths
            // involved. Such a face must count as h = 0: if the centre lies on it, M/r³ is unbounded there for a cusp, and
            // rounding times a quadrature of that singularity gave one central cell of an invented r^-2.4 cusp a mass of
            // 2.4e24 in a body of 5.75.
            if (Math.Abs(h) <= RoundingH * (Math.Abs(d[p]) / norm + Math.Sqrt(gx * gx + gy * gy + gz * gz))) continue;
            // Fan from the vertex average: both cells sharing a face then integrate the very same triangles,
            // so interior faces cancel to rounding whatever the integrand's smoothness.
            double ax = 0, ay = 0, az = 0;
            for (int k = s; k < e; k++) { ax += vx[ring[k]]; ay += vy[ring[k]]; az += vz[ring[k]]; }
            double inv = 1.0 / (e - s);
            ax = gx + ax * inv; ay = gy + ay * inv; az = gz + az * inv;
            double face = 0;
            for (int k = s; k < e; k++)
            {
                int t1 = ring[k], t2 = ring[k + 1 < e ? k + 1 : s];
                double bx = gx + vx[t1], by = gy + vy[t1], bz = gz + vz[t1], cx = gx + vx[t2], cy = gy + vy[t2], cz = gz + vz[t2];
                face += OutsideProfile(ax, ay, az, bx, by, bz, cx, cy, cz, outer)
                    ? profile.TotalMass * Math.Abs(SolidAngle(ax, ay, az, bx, by, bz, cx, cy, cz)) / Math.Abs(h)
                    : Triangle(ax, ay, az, bx, by, bz, cx, cy, cz, profile, angle, 0);
            }
            total += h * face;
        }
        return total / (4.0 * Math.PI);
    }

    // ∫ M(|x|)/|x|³ dA over the triangle (a, b, c), adaptively split.
    private static double Triangle(double ax, double ay, double az, double bx, double by, double bz, double cx, double cy, double cz,
        IRadialProfile profile, double angle, int depth)
    {
        double e1 = Dist2(ax, ay, az, bx, by, bz), e2 = Dist2(bx, by, bz, cx, cy, cz), e3 = Dist2(cx, cy, cz, ax, ay, az);
        double edge2 = Math.Max(e1, Math.Max(e2, e3));
        double near2 = Math.Min(ax * ax + ay * ay + az * az, Math.Min(bx * bx + by * by + bz * bz, cx * cx + cy * cy + cz * cz));
        if (depth < 6 && edge2 > angle * angle * near2)
        {
            double abx = 0.5 * (ax + bx), aby = 0.5 * (ay + by), abz = 0.5 * (az + bz);
            double bcx = 0.5 * (bx + cx), bcy = 0.5 * (by + cy), bcz = 0.5 * (bz + cz);
            double cax = 0.5 * (cx + ax), cay = 0.5 * (cy + ay), caz = 0.5 * (cz + az);
            return Triangle(ax, ay, az, abx, aby, abz, cax, cay, caz, profile, angle, depth + 1)
                 + Triangle(abx, aby, abz, bx, by, bz, bcx, bcy, bcz, profile, angle, depth + 1)
                 + Triangle(cax, cay, caz, bcx, bcy, bcz, cx, cy, cz, profile, angle, depth + 1)
                 + Triangle(abx, aby, abz, bcx, bcy, bcz, cax, cay, caz, profile, angle, depth + 1);
        }
        double ux = bx - ax, uy = by - ay, uz = bz - az, wx = cx - ax, wy = cy - ay, wz = cz - az;
        double crx = uy * wz - uz * wy, cry = uz * wx - ux * wz, crz = ux * wy - uy * wx;
        double area = 0.5 * Math.Sqrt(crx * crx + cry * cry + crz * crz);
        double sum = 0;
        for (int q = 0; q < 7; q++)
        {
            double l1 = L1[q], l2 = L2[q], l0 = 1 - l1 - l2;
            double px = l0 * ax + l1 * bx + l2 * cx, py = l0 * ay + l1 * by + l2 * cy, pz = l0 * az + l1 * bz + l2 * cz;
            double r2 = px * px + py * py + pz * pz;
            double r = Math.Sqrt(r2);
            // M(r)/r³ → (4π/3)ρ(0) as r → 0; a quadrature point exactly at the origin uses that limit.
            sum += W[q] * (r > 0 ? profile.EnclosedMass(r) / (r2 * r) : 4.0 / 3.0 * Math.PI * profile.Density(0));
        }
        return area * sum;
    }

    // True when the whole triangle lies at r ≥ R (conservatively: nearest vertex minus longest edge), where M = M(R).
    private static bool OutsideProfile(double ax, double ay, double az, double bx, double by, double bz, double cx, double cy, double cz, double outer)
    {
        double near = Math.Sqrt(Math.Min(ax * ax + ay * ay + az * az, Math.Min(bx * bx + by * by + bz * bz, cx * cx + cy * cy + cz * cz)));
        double edge = Math.Sqrt(Math.Max(Dist2(ax, ay, az, bx, by, bz), Math.Max(Dist2(bx, by, bz, cx, cy, cz), Dist2(cx, cy, cz, ax, ay, az))));
        return near - edge >= outer;
    }

    // Signed solid angle of triangle (a, b, c) seen from the origin: Van Oosterom &amp; Strackee 1983,
    // IEEE Trans. Biomed. Eng. 30, 125: tan(Ω/2) = a·(b×c) / (|a||b||c| + (a·b)|c| + (a·c)|b| + (b·c)|a|).
    private static double SolidAngle(double ax, double ay, double az, double bx, double by, double bz, double cx, double cy, double cz)
    {
        double la = Math.Sqrt(ax * ax + ay * ay + az * az), lb = Math.Sqrt(bx * bx + by * by + bz * bz), lc = Math.Sqrt(cx * cx + cy * cy + cz * cz);
        double triple = ax * (by * cz - bz * cy) + ay * (bz * cx - bx * cz) + az * (bx * cy - by * cx);
        double denominator = la * lb * lc + (ax * bx + ay * by + az * bz) * lc + (ax * cx + ay * cy + az * cz) * lb + (bx * cx + by * cy + bz * cz) * la;
        return 2.0 * Math.Atan2(triple, denominator);
    }

    private static double Dist2(double ax, double ay, double az, double bx, double by, double bz)
    {
        double dx = ax - bx, dy = ay - by, dz = az - bz;
        return dx * dx + dy * dy + dz * dz;
    }
}
