using System.Runtime.CompilerServices;

namespace Placement.Sph;

/// <summary>
/// An SPH smoothing kernel in 3-D written with its compact support H: W(r, H) = C / H³ · w(r / H), w(q) = 0 for q ≥ 1.
/// </summary>
/// <remarks>
/// Forms, normalisations C and the ratios H/h (h = 2σ, σ the kernel's standard deviation per dimension,
/// σ² = (1/3)∫ r² W d³r) are those of Dehnen &amp; Aly 2012, MNRAS 425, 1068, Table 1:
/// <list type="table">
/// <item><term>cubic spline</term><description>w = (1−q)³ − 4(½−q)³₊, C = 16/π, H/h = 1.825742</description></item>
/// <item><term>quintic spline</term><description>w = (1−q)⁵ − 6(⅔−q)⁵₊ + 15(⅓−q)⁵₊, C = 2187/(40π), H/h = 2.195775</description></item>
/// <item><term>Wendland C2</term><description>w = (1−q)⁴(1+4q), C = 21/(2π), H/h = 1.936492</description></item>
/// <item><term>Wendland C4</term><description>w = (1−q)⁶(1+6q+35q²/3), C = 495/(32π), H/h = 2.207940</description></item>
/// </list>
/// The Wendland kernels' self-contribution correction ρ ← ρ − ε m W(0, H) with ε_C2 = 0.0294 (N_H/100)^−0.977 and
/// ε_C4 = 0.01342 (N_H/100)^−1.579 is from the same paper (eqs. 18–19). Immutable and thread-safe.
/// </remarks>
public sealed class SphKernel
{
    private SphKernel(SphKernelKind kind, string name, double normalisation, double supportOverH)
    {
        Kind = kind;
        Name = name;
        Normalisation = normalisation;
        SupportOverSmoothingLength = supportOverH;
    }

    /// <summary>Cubic B-spline kernel.</summary>
    public static SphKernel CubicSpline { get; } = new(SphKernelKind.CubicSpline, "cubic-spline", 16.0 / Math.PI, 1.825742);

    /// <summary>Quintic B-spline kernel.</summary>
    public static SphKernel QuinticSpline { get; } = new(SphKernelKind.QuinticSpline, "quintic-spline", 2187.0 / (40.0 * Math.PI), 2.195775);

    /// <summary>Wendland C2 kernel.</summary>
    public static SphKernel WendlandC2 { get; } = new(SphKernelKind.WendlandC2, "wendland-c2", 21.0 / (2.0 * Math.PI), 1.936492);

    /// <summary>Wendland C4 kernel.</summary>
    public static SphKernel WendlandC4 { get; } = new(SphKernelKind.WendlandC4, "wendland-c4", 495.0 / (32.0 * Math.PI), 2.207940);

    /// <summary>All built-in kernels.</summary>
    public static IReadOnlyList<SphKernel> All { get; } = [CubicSpline, QuinticSpline, WendlandC2, WendlandC4];

    /// <summary>Which kernel this is.</summary>
    public SphKernelKind Kind { get; }

    /// <summary>Catalogue name, e.g. <c>wendland-c2</c>.</summary>
    public string Name { get; }

    /// <summary>The normalisation C of W = C/H³ w(r/H) in 3-D.</summary>
    public double Normalisation { get; }

    /// <summary>H/h with h = 2σ (Dehnen &amp; Aly 2012, Table 1), to convert a smoothing length h into the support H.</summary>
    public double SupportOverSmoothingLength { get; }

    /// <summary>Looks a kernel up by <see cref="Name"/> (case-insensitive).</summary>
    /// <exception cref="ArgumentException">No kernel has that name.</exception>
    public static SphKernel FromName(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        foreach (var k in All)
            if (string.Equals(k.Name, name.Trim(), StringComparison.OrdinalIgnoreCase)) return k;
        throw new ArgumentException($"Unknown SPH kernel '{name}'; expected one of: {string.Join(", ", All.Select(k => k.Name))}.", nameof(name));
    }

    /// <summary>The dimensionless kernel shape w(q) for q = r/H ≥ 0 (0 for q ≥ 1).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double Shape(double q)
    {
        if (q >= 1.0) return 0.0;
        double a = 1.0 - q;
        switch (Kind)
        {
            case SphKernelKind.CubicSpline:
                {
                    double w = a * a * a;
                    if (q < 0.5) { double b = 0.5 - q; w -= 4.0 * b * b * b; }
                    return w;
                }
            case SphKernelKind.QuinticSpline:
                {
                    double a2 = a * a;
                    double w = a2 * a2 * a;
                    if (q < 2.0 / 3.0) { double b = 2.0 / 3.0 - q; double b2 = b * b; w -= 6.0 * b2 * b2 * b; }
                    if (q < 1.0 / 3.0) { double c = 1.0 / 3.0 - q; double c2 = c * c; w += 15.0 * c2 * c2 * c; }
                    return w;
                }
            case SphKernelKind.WendlandC2:
                {
                    double a2 = a * a;
                    return a2 * a2 * (1.0 + 4.0 * q);
                }
            default:
                {
                    double a2 = a * a;
                    return a2 * a2 * a2 * (1.0 + 6.0 * q + 35.0 / 3.0 * q * q);
                }
        }
    }

    /// <summary>The derivative dw/dq of the kernel shape for q ≥ 0 (0 for q ≥ 1).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double ShapeDerivative(double q)
    {
        if (q >= 1.0) return 0.0;
        double a = 1.0 - q;
        switch (Kind)
        {
            case SphKernelKind.CubicSpline:
                {
                    double d = -3.0 * a * a;
                    if (q < 0.5) { double b = 0.5 - q; d += 12.0 * b * b; }
                    return d;
                }
            case SphKernelKind.QuinticSpline:
                {
                    double a2 = a * a;
                    double d = -5.0 * a2 * a2;
                    if (q < 2.0 / 3.0) { double b = 2.0 / 3.0 - q; double b2 = b * b; d += 30.0 * b2 * b2; }
                    if (q < 1.0 / 3.0) { double c = 1.0 / 3.0 - q; double c2 = c * c; d -= 75.0 * c2 * c2; }
                    return d;
                }
            case SphKernelKind.WendlandC2:
                return -20.0 * q * a * a * a;
            default:
                {
                    double a2 = a * a;
                    return -56.0 / 3.0 * q * (1.0 + 5.0 * q) * a2 * a2 * a;
                }
        }
    }

    /// <summary>W(r, H) = C/H³ w(r/H), in 1/length³ of whatever length unit r and H share.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="support"/> is not positive.</exception>
    public double Value(double r, double support)
    {
        if (!(support > 0)) throw new ArgumentOutOfRangeException(nameof(support), support, "Kernel support H must be > 0.");
        return Normalisation / (support * support * support) * Shape(r / support);
    }

    /// <summary>
    /// Fraction ε of the self-contribution m W(0,H) to subtract for N_H neighbours (Dehnen &amp; Aly 2012, eqs. 18–19);
    /// 0 for the B-splines, which the paper gives no correction for.
    /// </summary>
    public double SelfContributionCorrection(double neighbourNumber) => Kind switch
    {
        SphKernelKind.WendlandC2 => 0.0294 * Math.Pow(neighbourNumber / 100.0, -0.977),
        SphKernelKind.WendlandC4 => 0.01342 * Math.Pow(neighbourNumber / 100.0, -1.579),
        _ => 0.0,
    };
}
