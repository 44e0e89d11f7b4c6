using System.Globalization;
using Placement.Geometry;
using Placement.Random;

namespace Placement.Samplers.Shells;

/// <summary>
/// Base of the samplers that put equal-mass points on the concentric shells of a <see cref="ShellLayout"/>; a
/// derived sampler decides only where on its shell each point goes.
/// </summary>
/// <remarks>
/// Randomness: shell k (layer k; the central cluster is layer 0) draws from <see cref="KeyedRandom"/>(seed, k);
/// its first three numbers make the shell's uniform random rotation (Shoemake 1992), the rest are the
/// derived sampler's. Every shell is one batch, so the result does not depend on the thread count.
/// </remarks>
public abstract class ShellSampler : IPointSampler
{
    /// <summary>Name of the aspect parameter shared by every shell sampler.</summary>
    public const string AspectParameter = "aspect";

    /// <summary>Name of the parameter that switches the search for density jumps the points cannot resolve.</summary>
    public const string FindStepsParameter = "find-steps";

    /// <inheritdoc />
    public abstract string Name { get; }

    /// <summary>One or two sentences for <see cref="SamplerDescription.Summary"/>.</summary>
    protected abstract string Summary { get; }

    /// <summary>Parameters of the derived sampler, besides <c>aspect</c>.</summary>
    protected virtual IReadOnlyList<SamplerParameter> ExtraParameters => [];

    /// <inheritdoc />
    public SamplerDescription Describe()
    {
        var list = new List<SamplerParameter>
        {
            new(AspectParameter, SamplerParameterKind.Real, "1", "",
                "Target radial shell thickness over tangential point spacing (1 gives near-cubic cells).", minimum: 0.05, maximum: 20),
            new(FindStepsParameter, SamplerParameterKind.Boolean, "true", "",
                "End shells on density jumps too narrow for the points to resolve (e.g. a composition change over one table row), not only on declared steps (repeated radii)."),
        };
        list.AddRange(ExtraParameters);
        return new SamplerDescription(Name, Summary, list);
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The parameters do not belong to this sampler.</exception>
    public SamplingPlan Plan(SamplingRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var values = request.ParametersFor(Describe());
        var layout = ShellLayout.Build(request.Profile, request.Count, values.GetDouble(AspectParameter), values.GetBoolean(FindStepsParameter));
        var plan = new ShellPlan(layout, values);
        var inv = CultureInfo.InvariantCulture;
        plan.Notes.Add(string.Create(inv,
            $"{layout.ShellCount} shells of 12 N_side^2 points, N_side {NSideRange(layout)}; central cluster of {layout.CentreCount} point(s); exactly {layout.Count} points of mass {layout.PointMass:G6}."));
        if (layout.Steps.Count > 0)
            plan.Notes.Add(string.Create(inv, $"Shell boundaries on density steps at r = {string.Join(", ", layout.Steps.Select(s => s.Radius.ToString("G6", inv) + (s.Declared ? " (declared)" : string.Create(inv, $" (found: {s.InnerDensity / s.OuterDensity:G3}x over {s.Width:G3})"))))} ({request.Profile.Units.LengthUnitName})."));
        return plan;
    }

    // "a–b (innermost c, outermost d)": shells grow toward the middle of a centrally concentrated body and shrink again in
    // its envelope, so the two ends alone understate the largest shells.
    private static string NSideRange(ShellLayout layout)
    {
        if (layout.ShellCount == 0) return "none";
        var n = layout.NSide;
        int lo = int.MaxValue, hi = 0;
        for (int i = 0; i < layout.ShellCount; i++) { lo = Math.Min(lo, n[i]); hi = Math.Max(hi, n[i]); }
        return string.Create(CultureInfo.InvariantCulture, $"{lo}-{hi} (innermost {n[0]}, outermost {n[layout.ShellCount - 1]})");
    }

    /// <inheritdoc />
    /// <exception cref="ArgumentException">The plan is not a <see cref="ShellPlan"/>.</exception>
    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        ArgumentNullException.ThrowIfNull(request);
        if (plan is not ShellPlan shells) throw new ArgumentException("Expected the plan made by this sampler's Plan.", nameof(plan));
        var layout = shells.Layout;
        var rng = new KeyedRandom(request.Seed, (ulong)batch);
        var rotation = UnitQuaternion.Random(ref rng).ToRotation();
        if (batch == 0)
        {
            FillCentre(layout, rotation, output);
            return;
        }
        FillShell(shells, batch - 1, rotation, ref rng, output);
    }

    /// <summary>
    /// Writes the 12 N_side² points of shell <paramref name="shell"/> (0-based; layer shell + 1) at radius
    /// <see cref="ShellLayout.PointRadius"/>[shell]; called concurrently for different shells.
    /// </summary>
    /// <param name="plan">The plan: shells and parsed parameters.</param>
    /// <param name="shell">0-based shell index.</param>
    /// <param name="rotation">The shell's uniform random rotation.</param>
    /// <param name="random">The shell's random stream, already past the rotation's draws.</param>
    /// <param name="output">The shell's coordinate spans.</param>
    protected abstract void FillShell(ShellPlan plan, int shell, in Rotation3 rotation,
        ref KeyedRandom random, PointSpans output);

    private static void FillCentre(ShellLayout layout, in Rotation3 rotation, PointSpans output)
    {
        int c = output.Length;
        if (c == 1)
        {
            output.X[0] = output.Y[0] = output.Z[0] = 0;
            return;
        }
        double golden = Math.PI * (3 - Math.Sqrt(5));
        for (int j = 0; j < c; j++)
        {
            double z = 1 - (2.0 * j + 1) / c;
            double s = Math.Sqrt((1 - z) * (1 + z));
            (double sp, double cp) = Math.SinCos(j * golden);
            var (px, py, pz) = rotation.Apply(s * cp, s * sp, z);
            output.X[j] = layout.CentreRadius * px;
            output.Y[j] = layout.CentreRadius * py;
            output.Z[j] = layout.CentreRadius * pz;
        }
    }
}
