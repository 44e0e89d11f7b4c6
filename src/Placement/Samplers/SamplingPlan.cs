using System.Globalization;
using Placement.Profiles;

namespace Placement.Samplers;

/// <summary>
/// What a sampler will produce: the exact point count and its division into batches, plus notes for the user.
/// Samplers derive from it to carry their own layout (shell radii, lattice geometry) into <see cref="IPointSampler.Fill"/>.
/// </summary>
public class SamplingPlan
{
    /// <summary>Creates a plan; batches must tile [0, count) in order.</summary>
    /// <param name="count">Exact number of points the sampler will write.</param>
    /// <param name="batches">Contiguous batches in order of <see cref="PlannedBatch.Start"/>.</param>
    /// <exception cref="ArgumentException">The batches do not tile [0, count) or a batch mass is negative or not finite.</exception>
    public SamplingPlan(int count, IReadOnlyList<PlannedBatch> batches)
    {
        ArgumentNullException.ThrowIfNull(batches);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        Count = count;
        Batches = batches;
        try
        {
            CheckBatches();
        }
        catch (InvalidOperationException e)
        {
            throw new ArgumentException(e.Message, nameof(batches), e);
        }
    }

    /// <summary>Exact number of points.</summary>
    public int Count { get; }

    /// <summary>Batches in point order; each is filled by one <see cref="IPointSampler.Fill"/> call.</summary>
    public IReadOnlyList<PlannedBatch> Batches { get; }

    /// <summary>Remarks for the user (e.g. requested vs actual count); empty when there is nothing to say.</summary>
    public IList<string> Notes { get; } = new List<string>();

    /// <summary>Total mass of the plan, Σ count × mass per point (compensated summation), in mass units.</summary>
    public double TotalMass()
    {
        double sum = 0, c = 0;
        foreach (var b in Batches)
        {
            double y = b.Count * b.MassPerPoint - c;
            double t = sum + y;
            c = (t - sum) - y;
            sum = t;
        }
        return sum;
    }

    /// <summary>Asserts the plan's invariants: batches tile [0, Count) in order, masses finite and ≥ 0.</summary>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the batch.</exception>
    public virtual void CheckValidity() => CheckBatches();

    /// <summary>
    /// Asserts the plan's invariants, including those that need the profile it was made for (derived plans check
    /// e.g. shell boundary masses); the base checks batches and that the planned mass equals M within
    /// <paramref name="relativeTolerance"/>.
    /// </summary>
    /// <exception cref="InvalidOperationException">An invariant is broken.</exception>
    public virtual void CheckValidity(IRadialProfile profile, double relativeTolerance = 1e-12)
    {
        ArgumentNullException.ThrowIfNull(profile);
        CheckValidity();
        double total = TotalMass();
        if (!(Math.Abs(total - profile.TotalMass) <= relativeTolerance * profile.TotalMass))
            throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                $"The plan's mass {total:R} differs from the profile's {profile.TotalMass:R} by more than {relativeTolerance} relative."));
    }

    private void CheckBatches()
    {
        long next = 0;
        for (int k = 0; k < Batches.Count; k++)
        {
            var b = Batches[k];
            if (b.Start != next || b.Count < 0)
                throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                    $"Batch {k} covers [{b.Start}, {(long)b.Start + b.Count}); expected it to start at {next} with count >= 0."));
            if (!(b.MassPerPoint >= 0) || !double.IsFinite(b.MassPerPoint))
                throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture, $"Batch {k} has mass per point {b.MassPerPoint}; expected finite and >= 0."));
            next += b.Count;
        }
        if (next != Count)
            throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture, $"Batches cover {next} points; the plan says {Count}."));
    }
}
