using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace Placement.Spatial;

/// <summary>
/// A growable structure-of-arrays list of neighbours (sorted slot, squared distance, offset vector), filled by
/// <see cref="PointGrid.CollectInShell"/> and reused across queries so hot loops allocate nothing.
/// </summary>
public sealed class NeighbourBuffer
{
    private int[] _slot;
    private double[] _d2, _dx, _dy, _dz;

    /// <summary>Creates a buffer with room for <paramref name="capacity"/> neighbours before it grows.</summary>
    public NeighbourBuffer(int capacity = 128)
    {
        capacity = Math.Max(capacity, 4);
        _slot = new int[capacity];
        _d2 = new double[capacity]; _dx = new double[capacity]; _dy = new double[capacity]; _dz = new double[capacity];
    }

    /// <summary>Number of neighbours held.</summary>
    public int Count { get; private set; }

    /// <summary>Sorted grid slots of the neighbours.</summary>
    public Span<int> Slot => _slot.AsSpan(0, Count);

    /// <summary>Squared distances, length².</summary>
    public Span<double> DistanceSquared => _d2.AsSpan(0, Count);

    /// <summary>x of neighbour (image) minus x of the query, length units.</summary>
    public Span<double> Dx => _dx.AsSpan(0, Count);

    /// <summary>y difference, length units.</summary>
    public Span<double> Dy => _dy.AsSpan(0, Count);

    /// <summary>z difference, length units.</summary>
    public Span<double> Dz => _dz.AsSpan(0, Count);

    /// <summary>Empties the buffer (keeps its memory).</summary>
    public void Clear() => Count = 0;

    /// <summary>Appends one neighbour.</summary>
    public void Add(int slot, double distanceSquared, double dx, double dy, double dz)
    {
        int i = Count;
        if (i == _slot.Length) Grow();
        _slot[i] = slot; _d2[i] = distanceSquared; _dx[i] = dx; _dy[i] = dy; _dz[i] = dz;
        Count = i + 1;
    }

    /// <summary>Sorts the neighbours by increasing squared distance (insertion sort: buffers are short).</summary>
    public void SortByDistance()
    {
        var d2 = _d2; var slot = _slot; var dx = _dx; var dy = _dy; var dz = _dz;
        for (int i = 1; i < Count; i++)
        {
            double k = d2[i];
            if (d2[i - 1] <= k) continue;
            int s = slot[i]; double x = dx[i], y = dy[i], z = dz[i];
            int j = i - 1;
            while (j >= 0 && d2[j] > k)
            {
                d2[j + 1] = d2[j]; slot[j + 1] = slot[j]; dx[j + 1] = dx[j]; dy[j + 1] = dy[j]; dz[j + 1] = dz[j];
                j--;
            }
            d2[j + 1] = k; slot[j + 1] = s; dx[j + 1] = x; dy[j + 1] = y; dz[j + 1] = z;
        }
    }

    /// <summary>
    /// Appends, without branches, the points of slots [from, to) of the coordinate arrays (a grid's or a tree's sorted
    /// copy) shifted by (ox, oy, oz) (query subtracted) whose squared distance lies in [inner², outer²), except slot
    /// <paramref name="skip"/>.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal void AppendRange(double[] xs, double[] ys, double[] zs, int from, int to, double ox, double oy, double oz, double inner2, double outer2, int skip)
    {
        if (from >= to) return;
        Span<int> run = [from, to];
        AppendRuns(xs, ys, zs, run, 1, ox, oy, oz, inner2, outer2, skip);
    }

    /// <summary>
    /// <see cref="AppendRange"/> over several slot runs ([runs[2k], runs[2k + 1]) for k &lt; <paramref name="count"/>),
    /// with one capacity check for all of them.
    /// </summary>
    internal void AppendRuns(double[] xs, double[] ys, double[] zs, ReadOnlySpan<int> runs, int count, double ox, double oy, double oz,
        double inner2, double outer2, int skip)
    {
        int total = 0;
        for (int k = 0; k < count; k++)
        {
            int from = runs[2 * k], to = runs[2 * k + 1];
            if (from < 0 || from > to || (uint)to > (uint)xs.Length || (uint)to > (uint)ys.Length || (uint)to > (uint)zs.Length)
                throw new InvalidOperationException("Slot range out of bounds.");
            total += to - from;
        }
        // Eight slots of slack: the vector paths store whole groups of four or eight at the write position.
        while (Count + total + 8 > _slot.Length) Grow();
        int lanes = SimdLanes.Doubles;
        if (lanes == 8 && Vector512.IsHardwareAccelerated && Avx512F.VL.IsSupported)
        {
            Count = AppendRunsCompressed(xs, ys, zs, runs, count, ox, oy, oz, inner2, outer2, skip);
            return;
        }
        if (lanes >= 4 && Avx2.IsSupported)
        {
            Count = AppendRunsPacked(xs, ys, zs, runs, count, ox, oy, oz, inner2, outer2, skip);
            return;
        }
        int c = Count;
        for (int k = 0; k < count; k++) c = AppendScalar(xs, ys, zs, runs[2 * k], runs[2 * k + 1], ox, oy, oz, inner2, outer2, skip, c);
        Count = c;
    }

    // Slots [from, to) one point at a time, written from position c on (unconditionally, advancing only for a point in
    // the shell: no unpredictable branch); returns the new count.
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private int AppendScalar(double[] xs, double[] ys, double[] zs, int from, int to, double ox, double oy, double oz, double inner2, double outer2,
        int skip, int c)
    {
        ref double px = ref MemoryMarshal.GetArrayDataReference(xs);
        ref double py = ref MemoryMarshal.GetArrayDataReference(ys);
        ref double pz = ref MemoryMarshal.GetArrayDataReference(zs);
        ref int slot = ref MemoryMarshal.GetArrayDataReference(_slot);
        ref double d2s = ref MemoryMarshal.GetArrayDataReference(_d2);
        ref double dxs = ref MemoryMarshal.GetArrayDataReference(_dx);
        ref double dys = ref MemoryMarshal.GetArrayDataReference(_dy);
        ref double dzs = ref MemoryMarshal.GetArrayDataReference(_dz);
        for (int s = from; s < to; s++)
        {
            double dx = Unsafe.Add(ref px, s) + ox, dy = Unsafe.Add(ref py, s) + oy, dz = Unsafe.Add(ref pz, s) + oz;
            double d2 = dx * dx + dy * dy + dz * dz;
            Unsafe.Add(ref slot, c) = s; Unsafe.Add(ref d2s, c) = d2;
            Unsafe.Add(ref dxs, c) = dx; Unsafe.Add(ref dys, c) = dy; Unsafe.Add(ref dzs, c) = dz;
            c += (d2 < outer2 ? 1 : 0) & (d2 >= inner2 ? 1 : 0) & (s != skip ? 1 : 0);
        }
        return c;
    }

    // Left-packing permutations for four lanes: for each mask of lanes to keep, the kept lanes first, in order. As eight
    // 32-bit indices (a double is two) for the coordinates, and as four for the slots.
    private static readonly int[] PackDoubles = BuildPackTable(2);
    private static readonly int[] PackInts = BuildPackTable(1);

    private static int[] BuildPackTable(int width)
    {
        var table = new int[16 * 8];
        for (int mask = 0; mask < 16; mask++)
        {
            int k = 0;
            for (int lane = 0; lane < 4; lane++)
            {
                if ((mask & (1 << lane)) == 0) continue;
                for (int w = 0; w < width; w++) table[8 * mask + width * k + w] = width * lane + w;
                k++;
            }
        }
        return table;
    }

    /// <summary>
    /// The body of <see cref="AppendRuns"/> four points at a time (AVX2): squared distances of a group, a mask of those
    /// in the shell, and the kept lanes left-packed into the buffers by one permutation each (the usual SIMD stream
    /// compaction), so no point costs a branch or five scalar stores. Results, order included, are the scalar loop's.
    /// </summary>
    private int AppendRunsPacked(double[] xs, double[] ys, double[] zs, ReadOnlySpan<int> runs, int count, double ox, double oy, double oz,
        double inner2, double outer2, int skip)
    {
        ref double px = ref MemoryMarshal.GetArrayDataReference(xs);
        ref double py = ref MemoryMarshal.GetArrayDataReference(ys);
        ref double pz = ref MemoryMarshal.GetArrayDataReference(zs);
        ref int slot = ref MemoryMarshal.GetArrayDataReference(_slot);
        ref double d2s = ref MemoryMarshal.GetArrayDataReference(_d2);
        ref double dxs = ref MemoryMarshal.GetArrayDataReference(_dx);
        ref double dys = ref MemoryMarshal.GetArrayDataReference(_dy);
        ref double dzs = ref MemoryMarshal.GetArrayDataReference(_dz);
        ref int packD = ref MemoryMarshal.GetArrayDataReference(PackDoubles);
        ref int packI = ref MemoryMarshal.GetArrayDataReference(PackInts);
        var vox = Vector256.Create(ox); var voy = Vector256.Create(oy); var voz = Vector256.Create(oz);
        var vin = Vector256.Create(inner2); var vout = Vector256.Create(outer2);
        var lanes = Vector128.Create(0, 1, 2, 3);
        int length = Math.Min(xs.Length, Math.Min(ys.Length, zs.Length));
        int c = Count;
        for (int k = 0; k < count; k++)
        {
            int to = runs[2 * k + 1];
            int s = runs[2 * k];
            for (; s < to; s += 4)
            {
                if (s + 4 > length)
                {
                    // The arrays' last group: scalar.
                    c = AppendScalar(xs, ys, zs, s, to, ox, oy, oz, inner2, outer2, skip, c);
                    break;
                }
                var vx = Vector256.LoadUnsafe(ref px, (nuint)s) + vox;
                var vy = Vector256.LoadUnsafe(ref py, (nuint)s) + voy;
                var vz = Vector256.LoadUnsafe(ref pz, (nuint)s) + voz;
                var d2v = vx * vx + vy * vy + vz * vz;
                int left = to - s;
                uint keep = Vector256.LessThan(d2v, vout).ExtractMostSignificantBits()
                    & Vector256.GreaterThanOrEqual(d2v, vin).ExtractMostSignificantBits()
                    & (left >= 4 ? 0xFu : (1u << left) - 1);
                uint self = (uint)(skip - s);
                keep &= self < 4 ? ~(1u << (int)self) : 0xFu;
                var perm = Vector256.LoadUnsafe(ref packD, (nuint)(8 * keep));
                Avx2.PermuteVar8x32(d2v.AsSingle(), perm).AsDouble().StoreUnsafe(ref d2s, (nuint)c);
                Avx2.PermuteVar8x32(vx.AsSingle(), perm).AsDouble().StoreUnsafe(ref dxs, (nuint)c);
                Avx2.PermuteVar8x32(vy.AsSingle(), perm).AsDouble().StoreUnsafe(ref dys, (nuint)c);
                Avx2.PermuteVar8x32(vz.AsSingle(), perm).AsDouble().StoreUnsafe(ref dzs, (nuint)c);
                var slots = Vector128.Create(s) + lanes;
                Avx.PermuteVar(slots.AsSingle(), Vector128.LoadUnsafe(ref packI, (nuint)(8 * keep))).AsInt32().StoreUnsafe(ref slot, (nuint)c);
                c += BitOperations.PopCount(keep);
            }
        }
        return c;
    }

    /// <summary>
    /// <see cref="AppendRunsPacked"/> eight points at a time with AVX-512, the kept lanes left-packed by the hardware's
    /// compress instruction (in registers, then one store per buffer). Results, order included, are the scalar loop's.
    /// </summary>
    private int AppendRunsCompressed(double[] xs, double[] ys, double[] zs, ReadOnlySpan<int> runs, int count, double ox, double oy, double oz,
        double inner2, double outer2, int skip)
    {
        ref double px = ref MemoryMarshal.GetArrayDataReference(xs);
        ref double py = ref MemoryMarshal.GetArrayDataReference(ys);
        ref double pz = ref MemoryMarshal.GetArrayDataReference(zs);
        ref int slot = ref MemoryMarshal.GetArrayDataReference(_slot);
        ref double d2s = ref MemoryMarshal.GetArrayDataReference(_d2);
        ref double dxs = ref MemoryMarshal.GetArrayDataReference(_dx);
        ref double dys = ref MemoryMarshal.GetArrayDataReference(_dy);
        ref double dzs = ref MemoryMarshal.GetArrayDataReference(_dz);
        var vox = Vector512.Create(ox); var voy = Vector512.Create(oy); var voz = Vector512.Create(oz);
        var vin = Vector512.Create(inner2); var vout = Vector512.Create(outer2);
        var lanes = Vector512.Create(0L, 1, 2, 3, 4, 5, 6, 7);
        var slotLanes = Vector256.Create(0, 1, 2, 3, 4, 5, 6, 7);
        int length = Math.Min(xs.Length, Math.Min(ys.Length, zs.Length));
        int c = Count;
        for (int k = 0; k < count; k++)
        {
            int to = runs[2 * k + 1];
            int s = runs[2 * k];
            for (; s < to; s += 8)
            {
                if (s + 8 > length)
                {
                    // The arrays' last group: scalar.
                    c = AppendScalar(xs, ys, zs, s, to, ox, oy, oz, inner2, outer2, skip, c);
                    break;
                }
                var vx = Vector512.LoadUnsafe(ref px, (nuint)s) + vox;
                var vy = Vector512.LoadUnsafe(ref py, (nuint)s) + voy;
                var vz = Vector512.LoadUnsafe(ref pz, (nuint)s) + voz;
                var d2v = vx * vx + vy * vy + vz * vz;
                // Lanes inside the run and not the query itself.
                var valid = Vector512.LessThan(lanes, Vector512.Create((long)(to - s))) & ~Vector512.Equals(lanes, Vector512.Create((long)skip - s));
                var keep = Vector512.LessThan(d2v, vout) & Vector512.GreaterThanOrEqual(d2v, vin) & valid.AsDouble();
                Avx512F.Compress(Vector512<double>.Zero, keep, d2v).StoreUnsafe(ref d2s, (nuint)c);
                Avx512F.Compress(Vector512<double>.Zero, keep, vx).StoreUnsafe(ref dxs, (nuint)c);
                Avx512F.Compress(Vector512<double>.Zero, keep, vy).StoreUnsafe(ref dys, (nuint)c);
                Avx512F.Compress(Vector512<double>.Zero, keep, vz).StoreUnsafe(ref dzs, (nuint)c);
                var keepSlots = Avx512F.ConvertToVector256Int32(keep.AsInt64());
                Avx512F.VL.Compress(Vector256<int>.Zero, keepSlots, Vector256.Create(s) + slotLanes).StoreUnsafe(ref slot, (nuint)c);
                c += BitOperations.PopCount(keep.ExtractMostSignificantBits());
            }
        }
        return c;
    }

    private void Grow()
    {
        int n = _slot.Length * 2;
        Array.Resize(ref _slot, n);
        Array.Resize(ref _d2, n); Array.Resize(ref _dx, n); Array.Resize(ref _dy, n); Array.Resize(ref _dz, n);
    }
}
