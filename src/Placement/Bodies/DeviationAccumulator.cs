namespace Placement.Bodies;

/// <summary>Running sum of squares, largest magnitude and count of relative deviations (merged in a fixed order by callers).</summary>
internal struct DeviationAccumulator
{
    private double _sumSquares;
    private double _max;
    private int _count;

    public void Add(double deviation)
    {
        _sumSquares += deviation * deviation;
        _max = Math.Max(_max, Math.Abs(deviation));
        _count++;
    }

    public void Merge(DeviationAccumulator other)
    {
        _sumSquares += other._sumSquares;
        _max = Math.Max(_max, other._max);
        _count += other._count;
    }

    public readonly RelativeDeviation Result() =>
        _count == 0 ? RelativeDeviation.None : new RelativeDeviation(Math.Sqrt(_sumSquares / _count), _max, _count);
}
