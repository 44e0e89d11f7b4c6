namespace Placement.Plots;

/// <summary>Argument checks shared by the figure builders.</summary>
internal static class PlotGuards
{
    public static void SameLength(double[]? a, string aName, double[]? b, string bName)
    {
        ArgumentNullException.ThrowIfNull(a, aName);
        ArgumentNullException.ThrowIfNull(b, bName);
        if (a.Length != b.Length)
            throw new ArgumentException($"{aName} has {a.Length} values but {bName} has {b.Length}; expected equal lengths.", bName);
    }

    /// <summary>Keeps the pairs where both values are finite (after any log transform).</summary>
    public static (double[] X, double[] Y, int[] Index) FinitePairs(double[] x, double[] y)
    {
        var xs = new List<double>(x.Length);
        var ys = new List<double>(x.Length);
        var index = new List<int>(x.Length);
        for (int i = 0; i < x.Length; i++)
        {
            if (!double.IsFinite(x[i]) || !double.IsFinite(y[i])) continue;
            xs.Add(x[i]);
            ys.Add(y[i]);
            index.Add(i);
        }
        return (xs.ToArray(), ys.ToArray(), index.ToArray());
    }
}
