namespace Placement.Glass;

/// <summary>
/// A cell list of points in the periodic unit cube: points bucketed into g³ cells of side ≥ the interaction
/// range, so all neighbours within range of a point lie in its own and the 26 surrounding cells (with wrap).
/// </summary>
/// <remarks>
/// Layout: <see cref="CellStart"/>[c] … <see cref="CellStart"/>[c + 1] − 1 index into <see cref="Order"/>, which lists
/// point indices cell by cell (counting sort, stable, so the layout depends only on the positions).
/// Rebuilt in O(N) each time points move.
/// </remarks>
internal sealed class PeriodicCellGrid
{
    public PeriodicCellGrid(int count, double range)
    {
        CellsPerSide = Math.Max(1, (int)Math.Floor(1.0 / range));
        // Fewer than 3 cells per side would visit the same cell twice through the wrap.
        if (CellsPerSide < 3) CellsPerSide = 1;
        int cells = CellsPerSide * CellsPerSide * CellsPerSide;
        CellStart = new int[cells + 1];
        Order = new int[count];
        CellOf = new int[count];
    }

    public int CellsPerSide { get; }

    public int[] CellStart { get; }

    public int[] Order { get; }

    public int[] CellOf { get; }

    public void Build(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z)
    {
        int g = CellsPerSide;
        Array.Clear(CellStart);
        for (int i = 0; i < x.Length; i++)
        {
            int c = (Index(z[i], g) * g + Index(y[i], g)) * g + Index(x[i], g);
            CellOf[i] = c;
            CellStart[c + 1]++;
        }
        for (int c = 0; c < CellStart.Length - 1; c++) CellStart[c + 1] += CellStart[c];
        Span<int> fill = CellStart.Length <= 4096 ? stackalloc int[CellStart.Length] : new int[CellStart.Length];
        CellStart.CopyTo(fill);
        for (int i = 0; i < x.Length; i++) Order[fill[CellOf[i]]++] = i;
    }

    private static int Index(double v, int g)
    {
        int k = (int)(v * g);
        return k < 0 ? 0 : k >= g ? g - 1 : k;
    }
}
