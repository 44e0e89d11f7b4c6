using System.Runtime.CompilerServices;

namespace Placement.Random;

/// <summary>
/// A small, fast pseudo-random stream (xoshiro256**) whose state is derived from (seed, stream key), so that
/// every shell, point block or cell can draw its own reproducible numbers whatever thread runs it.
/// </summary>
/// <remarks>
/// Generator: xoshiro256** (Blackman &amp; Vigna, "Scrambled linear pseudorandom number generators",
/// ACM TOMS 47, 2021). Seeding: SplitMix64 (Steele, Lea &amp; Flood, OOPSLA 2014) applied to the seed mixed
/// with the key, as those authors recommend. A struct: copy it only on purpose.
/// </remarks>
public struct KeyedRandom
{
    private ulong _s0, _s1, _s2, _s3;

    /// <summary>Creates the stream for <paramref name="key"/> under <paramref name="seed"/>.</summary>
    public KeyedRandom(ulong seed, ulong key)
    {
        ulong sm = seed ^ Mix(key + 0x9E3779B97F4A7C15UL);
        _s0 = SplitMix(ref sm);
        _s1 = SplitMix(ref sm);
        _s2 = SplitMix(ref sm);
        _s3 = SplitMix(ref sm);
        if ((_s0 | _s1 | _s2 | _s3) == 0) _s0 = 1;
    }

    /// <summary>Next 64 random bits.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ulong NextUInt64()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform double in [0, 1) with 53 random bits.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    /// <summary>Uniform double in (0, 1], safe for logarithms.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double NextDoubleNonZero() => ((NextUInt64() >> 11) + 1) * (1.0 / (1UL << 53));

    /// <summary>Standard normal deviate (Box–Muller; one of the pair is discarded to keep the stream simple).</summary>
    public double NextGaussian()
    {
        double u1 = NextDoubleNonZero();
        double u2 = NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>A stateless 64-bit hash of (seed, key) for one-off draws: SplitMix64's finaliser.</summary>
    public static ulong Hash(ulong seed, ulong key) => Mix(seed ^ Mix(key + 0x9E3779B97F4A7C15UL));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static ulong SplitMix(ref ulong x)
    {
        x += 0x9E3779B97F4A7C15UL;
        return Mix(x);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static ulong Mix(ulong z)
    {
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
