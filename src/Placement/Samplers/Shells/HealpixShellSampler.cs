using Placement.Geometry;
using Placement.Random;
using Placement.Samplers.Healpix;

namespace Placement.Samplers.Shells;

/// <summary>
/// Equal-area shells: the points of each shell are the HEALPix RING pixel centres of its N_side, each shell
/// turned by its own uniform random rotation. Catalogue name <c>healpix-shells</c>.
/// </summary>
/// <remarks>
/// Pixel centres from Górski et al. 2005 (ApJ 622, 759), see <see cref="HealpixGeometry"/>; shells from
/// <see cref="ShellLayout"/>; rotations from Shoemake 1992. Within a shell, points are in RING order.
/// </remarks>
public sealed class HealpixShellSampler : ShellSampler
{
    /// <summary>Name of the parameter that switches the per-shell rotations.</summary>
    public const string RotateParameter = "rotate";

    /// <inheritdoc />
    public override string Name => "healpix-shells";

    /// <inheritdoc />
    protected override string Summary =>
        "Equal-mass shells whose points are HEALPix pixel centres (equal-area, iso-latitude rings), each shell turned by an independent random rotation; quietest start for SPH and moving-mesh codes.";

    /// <inheritdoc />
    protected override IReadOnlyList<SamplerParameter> ExtraParameters =>
    [
        new(RotateParameter, SamplerParameterKind.Boolean, "true", "",
            "Turn every shell by an independent uniform random rotation (false keeps all shells aligned, poles on the z axis)."),
    ];

    /// <inheritdoc />
    protected override void FillShell(ShellPlan plan, int shell, in Rotation3 rotation,
        ref KeyedRandom random, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var r = plan.Parameters.GetBoolean(RotateParameter) ? rotation : Rotation3.Identity;
        HealpixGeometry.WriteSphere(plan.Layout.NSide[shell], plan.Layout.PointRadius[shell], r, output.X, output.Y, output.Z);
    }
}
