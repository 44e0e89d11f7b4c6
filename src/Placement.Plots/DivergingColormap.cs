using ScottPlot;

namespace Placement.Plots;

/// <summary>A blue–grey–red diverging colour map for signed errors: blue below zero, light grey at zero, red above.</summary>
/// <remarks>
/// Piecewise-linear in RGB through five anchors chosen here (dark blue, light blue, light grey, light red,
/// dark red). The centre is light grey rather than white so that points with near-zero error stay visible on
/// a white background.
/// </remarks>
internal sealed class DivergingColormap : IColormap
{
    private static readonly (double At, byte R, byte G, byte B)[] Anchors =
    [
        (0.00, 0x1F, 0x3F, 0x99),
        (0.25, 0x6A, 0x9F, 0xD8),
        (0.50, 0xCF, 0xCF, 0xCF),
        (0.75, 0xF0, 0x8A, 0x6C),
        (1.00, 0x9E, 0x10, 0x1F),
    ];

    public string Name => "Placement diverging";

    public Color GetColor(double position)
    {
        double p = double.IsNaN(position) ? 0.5 : Math.Clamp(position, 0, 1);
        int k = 1;
        while (k < Anchors.Length - 1 && p > Anchors[k].At) k++;
        var (a0, r0, g0, b0) = Anchors[k - 1];
        var (a1, r1, g1, b1) = Anchors[k];
        double f = (p - a0) / (a1 - a0);
        return new Color(Mix(r0, r1, f), Mix(g0, g1, f), Mix(b0, b1, f));
    }

    private static byte Mix(byte a, byte b, double f) => (byte)Math.Round(a + (b - a) * f);
}
