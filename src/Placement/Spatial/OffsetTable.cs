using System.Collections.Concurrent;

namespace Placement.Spatial;

/// <summary>
/// Cell offsets (dx, dy, dz) in [−K, K]³ sorted by a lower bound on the distance from any point of the centre cell
/// to any point of the offset cell, so a search can visit cells nearest-first and stop early.
/// </summary>
/// <remarks>
/// The bound in units of the smallest cell edge h is √(Σᵢ max(|dᵢ| − 1, 0)²): along an axis the two cells are
/// separated by at least (|dᵢ| − 1) whole cells. Offsets beyond K are produced ring by ring by
/// <see cref="NeighbourSearch"/>. Tables are shared and immutable (one per K and periodicity).
/// </remarks>
internal sealed class OffsetTable
{
    private static readonly ConcurrentDictionary<int, OffsetTable> Cache = new();

    private OffsetTable(int k)
    {
        Reach = k;
        int side = 2 * k + 1;
        int count = side * side * side;
        var keys = new long[count];
        var packed = new int[count];
        int m = 0;
        for (int dz = -k; dz <= k; dz++)
            for (int dy = -k; dy <= k; dy++)
                for (int dx = -k; dx <= k; dx++)
                {
                    int ex = Math.Max(Math.Abs(dx) - 1, 0), ey = Math.Max(Math.Abs(dy) - 1, 0), ez = Math.Max(Math.Abs(dz) - 1, 0);
                    long key = ex * ex + ey * ey + ez * ez;
                    long exact = dx * dx + dy * dy + dz * dz;
                    // Primary key: the conservative bound; ties broken by the centre distance so nearer cells come first.
                    keys[m] = (key << 20) | exact;
                    packed[m] = ((dx + 512) << 20) | ((dy + 512) << 10) | (dz + 512);
                    m++;
                }
        Array.Sort(keys, packed);
        Dx = new int[count];
        Dy = new int[count];
        Dz = new int[count];
        BoundSquared = new double[count];
        for (int i = 0; i < count; i++)
        {
            Dx[i] = ((packed[i] >> 20) & 1023) - 512;
            Dy[i] = ((packed[i] >> 10) & 1023) - 512;
            Dz[i] = (packed[i] & 1023) - 512;
            BoundSquared[i] = keys[i] >> 20;
        }
    }

    /// <summary>Largest |d| in the table along any axis.</summary>
    public int Reach { get; }

    public int[] Dx { get; }

    public int[] Dy { get; }

    public int[] Dz { get; }

    /// <summary>Lower bound on the squared distance, in units of the smallest cell edge squared.</summary>
    public double[] BoundSquared { get; }

    public int Length => Dx.Length;

    /// <summary>The table for a grid whose longest axis has <paramref name="maxCells"/> cells.</summary>
    public static OffsetTable For(int maxCells, bool periodic)
    {
        // Non-periodic: offsets beyond the grid are useless. Periodic: images of the box may be needed, but only
        // small grids need reach beyond the cap; those continue ring by ring.
        int k = Math.Clamp(periodic ? maxCells + 1 : maxCells - 1, 1, 8);
        return Cache.GetOrAdd(k, static kk => new OffsetTable(kk));
    }
}
