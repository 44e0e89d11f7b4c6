using Placement.Geometry;
using Placement.Random;

namespace Placement.Samplers.Shells;

/// <summary>
/// The same equal-mass shells as <see cref="HealpixShellSampler"/>, with each shell's points independent and
/// uniform on the shell. Catalogue name <c>random-shells</c>.
/// </summary>
/// <remarks>Directions from <see cref="UnitSphere.RandomDirection"/> (uniform on the sphere); no rotation is needed.</remarks>
public sealed class RandomShellSampler : ShellSampler
{
    /// <inheritdoc />
    public override string Name => "random-shells";

    /// <inheritdoc />
    protected override string Summary =>
        "Equal-mass shells with points placed independently and uniformly at random on each shell: exact shell masses, Poisson noise within shells.";

    /// <inheritdoc />
    protected override void FillShell(ShellPlan plan, int shell, in Rotation3 rotation,
        ref KeyedRandom random, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(plan);
        double radius = plan.Layout.PointRadius[shell];
        for (int i = 0; i < output.Length; i++)
        {
            var (x, y, z) = UnitSphere.RandomDirection(ref random);
            output.X[i] = radius * x;
            output.Y[i] = radius * y;
            output.Z[i] = radius * z;
        }
    }
}
