namespace Placement.Profiles;

/// <summary>What <see cref="CoreReplacement.Apply"/> replaces: the cut radius, the softening of the new core and the index of the gas continued inward.</summary>
/// <param name="CutRadius">Radius r_c inside which the profile is replaced, length units; 0 &lt; r_c &lt; R.</param>
public sealed record CoreReplacementOptions(double CutRadius)
{
    /// <summary>Default <see cref="SofteningRatio"/>: h = r_c, so the core's gravity is exactly Newtonian at and beyond the cut.</summary>
    public const double DefaultSofteningRatio = 1.0;

    /// <summary>Default polytropic index of the replaced gas.</summary>
    public const double DefaultIndex = 3.0;

    /// <summary>Softening length h of the core (spline kernel support, <see cref="Bodies.SplineSoftening"/>), length units; when null, h = <see cref="SofteningRatio"/> · r_c. Must satisfy 0 &lt; h ≤ r_c.</summary>
    public double? SofteningLength { get; init; }

    /// <summary>h / r_c used when <see cref="SofteningLength"/> is null; in (0, 1]. Default 1.</summary>
    /// <remarks>
    /// h ≤ r_c keeps the core's gravity Newtonian outside the cut, so the untouched envelope stays in the equilibrium it had.
    /// From memory (not confirmed here), the published method ties the softening length to the cut radius (Ohlmann et al.
    /// 2017, A&amp;A 599, A5); h = r_c is our own default, the largest softening that leaves the envelope untouched.
    /// </remarks>
    public double SofteningRatio { get; init; } = DefaultSofteningRatio;

    /// <summary>Polytropic index n of the gas inside the cut, P = Kρ^(1+1/n); 0 &lt; n ≤ 10. Default 3.</summary>
    /// <remarks>
    /// Any n works when a solution exists; a stiffer gas (smaller n) holds less mass inside the cut and so needs a heavier
    /// core. <see cref="CoreReplacement.LocalIndex"/> gives the index of the profile's own structure at the cut
    /// (n = 1/(d ln P/d ln ρ − 1)); with it, a polytrope of that index is reproduced without a core.
    /// </remarks>
    public double Index { get; init; } = DefaultIndex;

    /// <summary>The softening length these options give, length units.</summary>
    public double ResolvedSofteningLength => SofteningLength ?? SofteningRatio * CutRadius;
}
