namespace Placement.Tessellation;

/// <summary>Growable (neighbour, area) list for the faces of one chunk of cells, in processing order.</summary>
internal sealed class FaceBuffer
{
    public int[] Neighbour = new int[1024];
    public double[] Area = new double[1024];
    public int Count;

    public void Add(int neighbour, double area)
    {
        if (Count == Neighbour.Length)
        {
            Array.Resize(ref Neighbour, Count * 2);
            Array.Resize(ref Area, Count * 2);
        }
        Neighbour[Count] = neighbour;
        Area[Count] = area;
        Count++;
    }
}
