namespace Placement.Sph;

/// <summary>The SPH smoothing kernels the library implements (Dehnen &amp; Aly 2012, MNRAS 425, 1068, Table 1).</summary>
public enum SphKernelKind
{
    /// <summary>Cubic B-spline (M4), support H, C = 16/π.</summary>
    CubicSpline,

    /// <summary>Quintic B-spline (M6), support H, C = 2187/(40π).</summary>
    QuinticSpline,

    /// <summary>Wendland C2 in 3-D, support H, C = 21/(2π).</summary>
    WendlandC2,

    /// <summary>Wendland C4 in 3-D, support H, C = 495/(32π).</summary>
    WendlandC4,
}
