using System.Runtime.CompilerServices;
using Placement.Geometry;

namespace Placement.Samplers.Healpix;

/// <summary>HEALPix RING-order pixel centres for any N_side ≥ 1, from the published formulas.</summary>
/// <remarks>
/// Górski et al. 2005, ApJ 622, 759 (arXiv:astro-ph/0409513): N_pix = 12 N_side², 4N_side − 1 rings.
/// North cap ring i &lt; N_side: z = 1 − i²/(3N_side²), φ = (π/(2i))(j − ½), j = 1…4i. Belt N_side ≤ i ≤ 3N_side:
/// z = 4/3 − 2i/(3N_side), φ = (π/(2N_side))(j − s), s = 1 if i + N_side is odd, else ½. South cap: mirror.
/// sin θ is taken from √(t(2 − t)) with t = 1 − |z| computed exactly in the caps, so precision holds near the poles.
/// Each ring's equal-area band runs between z = 1 − 2p/N_pix values of its first and one-past-last pixel p.
/// </remarks>
public static class HealpixGeometry
{
    /// <summary>Largest N_side accepted (12 N_side² must fit an array).</summary>
    public const int MaxNSide = 13_000;

    /// <summary>Number of pixels, 12 N_side².</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="nSide"/> is outside [1, <see cref="MaxNSide"/>].</exception>
    public static long PixelCount(int nSide)
    {
        CheckNSide(nSide);
        return 12L * nSide * nSide;
    }

    /// <summary>Number of rings, 4 N_side − 1.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="nSide"/> is outside [1, <see cref="MaxNSide"/>].</exception>
    public static int RingCount(int nSide)
    {
        CheckNSide(nSide);
        return 4 * nSide - 1;
    }

    /// <summary>Ring <paramref name="i"/> (1 … 4N_side − 1) of the N_side sphere.</summary>
    /// <exception cref="ArgumentOutOfRangeException">N_side or the ring index is out of range.</exception>
    public static HealpixRing Ring(int nSide, int i)
    {
        CheckNSide(nSide);
        if (i < 1 || i > 4 * nSide - 1) throw new ArgumentOutOfRangeException(nameof(i), i, $"Ring index must be in [1, {4 * nSide - 1}].");
        return RingUnchecked(nSide, i);
    }

    /// <summary>Writes the unit vectors of all 12 N_side² pixel centres in RING order.</summary>
    /// <exception cref="ArgumentOutOfRangeException">N_side is out of range.</exception>
    /// <exception cref="ArgumentException">A span is shorter than 12 N_side².</exception>
    public static void PixelCentres(int nSide, Span<double> x, Span<double> y, Span<double> z)
    {
        long n = PixelCount(nSide);
        if (x.Length < n || y.Length < n || z.Length < n) throw new ArgumentException($"Output spans need {n} elements.");
        WriteSphere(nSide, 1.0, Rotation3.Identity, x, y, z);
    }

    internal static void CheckNSide(int nSide)
    {
        if (nSide < 1 || nSide > MaxNSide) throw new ArgumentOutOfRangeException(nameof(nSide), nSide, $"N_side must be in [1, {MaxNSide}].");
    }

    internal static HealpixRing RingUnchecked(int nSide, int i)
    {
        double n = nSide;
        double npix = 12.0 * n * n;
        int southIndex = 4 * nSide - i;
        if (i < nSide || southIndex < nSide)
        {
            // Polar cap: t = 1 − |z| = k²/(3 N_side²) exactly; sin θ = √(t(2 − t)).
            bool north = i < nSide;
            int k = north ? i : southIndex;
            double t = (double)k * k / (3.0 * n * n);
            long first = north ? 2L * k * (k - 1) : 12L * nSide * nSide - 2L * k * (k + 1);
            double step = Math.PI / (2.0 * k);
            double zTop = 1 - 2.0 * first / npix, zBottom = 1 - 2.0 * (first + 4L * k) / npix;
            return new HealpixRing(i, first, k, north ? 1 - t : t - 1, Math.Sqrt(t * (2 - t)), 0.5 * step, step, zTop, zBottom);
        }
        else
        {
            // z = 4/3 − 2i/(3N_side) = 2(2N_side − i)/(3N_side): exact integer numerator, one rounding, and exactly
            // antisymmetric between ring i and its mirror 4N_side − i, so the centres sum to zero.
            double zz = 2.0 * (2 * nSide - i) / (3.0 * n);
            long first = 2L * nSide * (nSide - 1) + 4L * nSide * (i - nSide);
            double step = Math.PI / (2.0 * n);
            double shift = ((i + nSide) & 1) == 1 ? 0.0 : 0.5; // φ = step (j − s), j = 1 … : first φ = step (1 − s)
            double zTop = 1 - 2.0 * first / npix, zBottom = 1 - 2.0 * (first + 4L * nSide) / npix;
            return new HealpixRing(i, first, nSide, zz, Math.Sqrt((1 - zz) * (1 + zz)), shift * step, step, zTop, zBottom);
        }
    }

    /// <summary>Writes every pixel centre of the N_side sphere, scaled to <paramref name="radius"/> and rotated.</summary>
    internal static void WriteSphere(int nSide, double radius, in Rotation3 rotation, Span<double> x, Span<double> y, Span<double> z)
    {
        int rings = 4 * nSide - 1;
        for (int i = 1; i <= rings; i++)
        {
            var ring = RingUnchecked(nSide, i);
            int first = checked((int)ring.FirstPixel);
            int count = ring.PixelCount;
            WriteRing(ring, radius, rotation, x.Slice(first, count), y.Slice(first, count), z.Slice(first, count));
        }
    }

    /// <summary>Number of azimuth steps between exact sin/cos evaluations in the ring recurrence.</summary>
    private const int ReseedInterval = 32;

    /// <summary>
    /// Writes one ring's pixel centres at <paramref name="radius"/>, rotated. Azimuths come from an angle-addition
    /// recurrence re-seeded with exact sin/cos every 32 steps (error ≲ 32 ulp), and each computed angle serves
    /// all four quadrants by the π/2 symmetry: (c, s) → (−s, c) → (−c, −s) → (s, −c).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void WriteRing(in HealpixRing ring, double radius, in Rotation3 r, Span<double> x, Span<double> y, Span<double> z)
    {
        int q = ring.QuarterCount;
        double rho = radius * ring.SinTheta, h = radius * ring.Z;
        // Rotated point = ρ(c·col0 + s·col1) + h·col2, with col_k the columns of R.
        double ax = rho * r.R00, bx = rho * r.R01, cx = h * r.R02;
        double ay = rho * r.R10, by = rho * r.R11, cy = h * r.R12;
        double az = rho * r.R20, bz = rho * r.R21, cz = h * r.R22;
        (double sd, double cd) = Math.SinCos(ring.PhiStep);
        var x0 = x[..q]; var x1 = x.Slice(q, q); var x2 = x.Slice(2 * q, q); var x3 = x.Slice(3 * q, q);
        var y0 = y[..q]; var y1 = y.Slice(q, q); var y2 = y.Slice(2 * q, q); var y3 = y.Slice(3 * q, q);
        var z0 = z[..q]; var z1 = z.Slice(q, q); var z2 = z.Slice(2 * q, q); var z3 = z.Slice(3 * q, q);
        double c = 0, s = 0;
        for (int k = 0; k < q; k++)
        {
            if (k % ReseedInterval == 0)
            {
                (s, c) = Math.SinCos(ring.FirstPhi + k * ring.PhiStep);
            }
            else
            {
                double cn = c * cd - s * sd;
                s = s * cd + c * sd;
                c = cn;
            }
            double px = ax * c + bx * s, qx = bx * c - ax * s;
            double py = ay * c + by * s, qy = by * c - ay * s;
            double pz = az * c + bz * s, qz = bz * c - az * s;
            x0[k] = cx + px; x1[k] = cx + qx; x2[k] = cx - px; x3[k] = cx - qx;
            y0[k] = cy + py; y1[k] = cy + qy; y2[k] = cy - py; y3[k] = cy - qy;
            z0[k] = cz + pz; z1[k] = cz + qz; z2[k] = cz - pz; z3[k] = cz - qz;
        }
    }
}
