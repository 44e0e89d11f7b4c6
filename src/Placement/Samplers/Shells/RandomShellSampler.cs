using Placement.Geometry;
using Placement.Random;

namespace Placement.Samplers.Shells;

/// <summary>
/// The same equal-mass shells as <see cref="HealpixShellSampler"/>, with each shell's points independent and
/// uniform on the shell. Catalogue name <c>random-shells</c>.
/// </summary>
/// <remarks>Direction: z = 1 − 2u, φ = 2πv with u, v ~ U(0,1) (uniform on the sphere by Archimedes' hat-box theorem).</remarks>
public sealed class RandomShellSampler : ShellSampler
{
    /// <inheritdoc />
    public override string Name => "random-shells";

    /// <inheritdoc />
    protected override string Summary =>
        "Equal-mass shells with points placed independently and uniformly at random on each shell: exact shell masses, Poisson noise within shells.";

    /// <inheritdoc />
    protected override void FillShell(SamplingRequest request, ShellLayout layout, int shell, in Rotation3 rotation,
        ref KeyedRandom random, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(layout);
        double radius = layout.PointRadius[shell];
        for (int i = 0; i < output.Length; i++)
        {
            double z = 1 - 2 * random.NextDouble();
            (double s, double c) = Math.SinCos(2 * Math.PI * random.NextDouble());
            double rho = radius * Math.Sqrt((1 - z) * (1 + z));
            output.X[i] = rho * c;
            output.Y[i] = rho * s;
            output.Z[i] = radius * z;
        }
    }
}
