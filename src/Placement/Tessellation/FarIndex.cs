using Placement.Spatial;

namespace Placement.Tessellation;

/// <summary>
/// A k-d tree over the generators of a grid tessellation, with each generator's slot in it, for the far shells of the
/// few cells that reach far beyond their neighbours (see <see cref="CellBuilder"/>). Built on first use.
/// </summary>
internal sealed class FarIndex
{
    public FarIndex(double[] x, double[] y, double[] z)
    {
        Tree = new KdTree(x, y, z);
        SlotOf = new int[x.Length];
        var index = Tree.SortedIndex;
        for (int s = 0; s < index.Length; s++) SlotOf[index[s]] = s;
    }

    public KdTree Tree { get; }

    /// <summary>Tree slot of each generator (original index).</summary>
    public int[] SlotOf { get; }
}
