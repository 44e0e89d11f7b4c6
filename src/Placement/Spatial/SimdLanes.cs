using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace Placement.Spatial;

/// <summary>
/// How many doubles the tessellation's vector loops (neighbour gathering, vertex classification, the farthest-vertex
/// rescan) handle per step: 8 with AVX-512 (F and VL, 512-bit vectors accelerated), 4 with AVX2, 1 otherwise. Every
/// width gives the same results bit for bit; tests lower it to compare the paths on one machine.
/// </summary>
internal static class SimdLanes
{
    /// <summary>The widest width this machine supports.</summary>
    public static int Best { get; } =
        Vector512.IsHardwareAccelerated && Avx512F.VL.IsSupported ? 8 : Avx2.IsSupported && Vector256.IsHardwareAccelerated ? 4 : 1;

    /// <summary>The width in use (at most <see cref="Best"/>; 8, 4 or 1).</summary>
    public static int Doubles { get; set; } = Best;
}
