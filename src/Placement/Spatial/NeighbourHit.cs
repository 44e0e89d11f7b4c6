namespace Placement.Spatial;

/// <summary>One neighbour found by a <see cref="NeighbourSearch"/> or a <see cref="KdTreeSearch"/>.</summary>
/// <param name="Slot">Sorted slot of the point in its <see cref="PointGrid"/> (original index: <c>grid.SortedIndex[Slot]</c>).</param>
/// <param name="DistanceSquared">Squared distance from the query to the neighbour (or its periodic image), length².</param>
/// <param name="Dx">x of the neighbour (image) minus x of the query, length units.</param>
/// <param name="Dy">y difference, length units.</param>
/// <param name="Dz">z difference, length units.</param>
public readonly record struct NeighbourHit(int Slot, double DistanceSquared, double Dx, double Dy, double Dz);
