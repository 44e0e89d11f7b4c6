namespace Placement.Numerics;

/// <summary>Embedded Runge–Kutta 5(4) stepper of Dormand and Prince with per-component error control.</summary>
/// <remarks>
/// Coefficients of Dormand &amp; Prince 1980 (J. Comput. Appl. Math. 6, 19), as tabulated by Hairer, Nørsett &amp;
/// Wanner, Solving ODEs I, 2nd ed., Table 5.2. The fifth-order solution is propagated (local extrapolation);
/// the difference to the embedded fourth-order solution estimates the local error. The error norm is the
/// maximum over components of |err_i| / (atol_i + rtol · max(|y_i|, |y_new,i|)); a step is acceptable when the norm
/// is ≤ 1, and <see cref="NextStep"/> proposes h · clamp(0.9 · norm^(−1/5), 0.2, 5) (Hairer et al., §II.4).
/// One instance is not thread-safe (it owns its stage buffers).
/// </remarks>
public sealed class DormandPrince45
{
    private const double A21 = 1.0 / 5;
    private const double A31 = 3.0 / 40, A32 = 9.0 / 40;
    private const double A41 = 44.0 / 45, A42 = -56.0 / 15, A43 = 32.0 / 9;
    private const double A51 = 19372.0 / 6561, A52 = -25360.0 / 2187, A53 = 64448.0 / 6561, A54 = -212.0 / 729;
    private const double A61 = 9017.0 / 3168, A62 = -355.0 / 33, A63 = 46732.0 / 5247, A64 = 49.0 / 176, A65 = -5103.0 / 18656;
    private const double B1 = 35.0 / 384, B3 = 500.0 / 1113, B4 = 125.0 / 192, B5 = -2187.0 / 6784, B6 = 11.0 / 84;
    private const double E1 = 71.0 / 57600, E3 = -71.0 / 16695, E4 = 71.0 / 1920, E5 = -17253.0 / 339200, E6 = 22.0 / 525, E7 = -1.0 / 40;

    private readonly OdeSystem _f;
    private readonly double[] _k1, _k2, _k3, _k4, _k5, _k6, _k7, _tmp;
    private readonly double[] _atol;
    private readonly double _rtol;

    /// <summary>Creates a stepper for a system of the given dimension.</summary>
    /// <param name="dimension">Number of state components, ≥ 1.</param>
    /// <param name="system">The right-hand side.</param>
    /// <param name="relativeTolerance">Relative tolerance per step, in [1e-15, 1).</param>
    /// <param name="absoluteTolerances">Absolute tolerance per component (≥ 0), length <paramref name="dimension"/>.</param>
    /// <exception cref="ArgumentNullException">A reference argument is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A size or tolerance is out of range.</exception>
    public DormandPrince45(int dimension, OdeSystem system, double relativeTolerance, ReadOnlySpan<double> absoluteTolerances)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentOutOfRangeException.ThrowIfLessThan(dimension, 1);
        if (!(relativeTolerance >= 1e-15 && relativeTolerance < 1))
            throw new ArgumentOutOfRangeException(nameof(relativeTolerance), relativeTolerance, "Relative tolerance must lie in [1e-15, 1).");
        if (absoluteTolerances.Length != dimension)
            throw new ArgumentOutOfRangeException(nameof(absoluteTolerances), absoluteTolerances.Length, "One absolute tolerance per component is required.");
        foreach (double a in absoluteTolerances)
            if (!(a >= 0)) throw new ArgumentOutOfRangeException(nameof(absoluteTolerances), a, "Absolute tolerances must be ≥ 0.");
        _f = system;
        _rtol = relativeTolerance;
        _atol = absoluteTolerances.ToArray();
        _k1 = new double[dimension]; _k2 = new double[dimension]; _k3 = new double[dimension]; _k4 = new double[dimension];
        _k5 = new double[dimension]; _k6 = new double[dimension]; _k7 = new double[dimension]; _tmp = new double[dimension];
    }

    /// <summary>Number of state components.</summary>
    public int Dimension => _k1.Length;

    /// <summary>Number of right-hand-side evaluations so far.</summary>
    public long Evaluations { get; private set; }

    /// <summary>Takes one step of size h from (t, y); writes the fifth-order solution and returns the error norm.</summary>
    /// <param name="t">Start of the step.</param>
    /// <param name="y">State at t.</param>
    /// <param name="h">Step size (may be negative).</param>
    /// <param name="yNew">Output: state at t + h.</param>
    /// <returns>Scaled local error norm; the step meets the tolerance when it is ≤ 1.</returns>
    public double Step(double t, ReadOnlySpan<double> y, double h, Span<double> yNew)
    {
        int n = _k1.Length;
        _f(t, y, _k1);
        for (int i = 0; i < n; i++) _tmp[i] = y[i] + h * A21 * _k1[i];
        _f(t + h / 5, _tmp, _k2);
        for (int i = 0; i < n; i++) _tmp[i] = y[i] + h * (A31 * _k1[i] + A32 * _k2[i]);
        _f(t + 3 * h / 10, _tmp, _k3);
        for (int i = 0; i < n; i++) _tmp[i] = y[i] + h * (A41 * _k1[i] + A42 * _k2[i] + A43 * _k3[i]);
        _f(t + 4 * h / 5, _tmp, _k4);
        for (int i = 0; i < n; i++) _tmp[i] = y[i] + h * (A51 * _k1[i] + A52 * _k2[i] + A53 * _k3[i] + A54 * _k4[i]);
        _f(t + 8 * h / 9, _tmp, _k5);
        for (int i = 0; i < n; i++) _tmp[i] = y[i] + h * (A61 * _k1[i] + A62 * _k2[i] + A63 * _k3[i] + A64 * _k4[i] + A65 * _k5[i]);
        _f(t + h, _tmp, _k6);
        for (int i = 0; i < n; i++) yNew[i] = y[i] + h * (B1 * _k1[i] + B3 * _k3[i] + B4 * _k4[i] + B5 * _k5[i] + B6 * _k6[i]);
        _f(t + h, yNew, _k7);
        Evaluations += 7;
        double norm = 0;
        for (int i = 0; i < n; i++)
        {
            double err = h * (E1 * _k1[i] + E3 * _k3[i] + E4 * _k4[i] + E5 * _k5[i] + E6 * _k6[i] + E7 * _k7[i]);
            double scale = _atol[i] + _rtol * Math.Max(Math.Abs(y[i]), Math.Abs(yNew[i]));
            double r = scale > 0 ? Math.Abs(err) / scale : (err == 0 ? 0 : double.PositiveInfinity);
            if (!(r <= norm)) norm = r;
        }
        return norm;
    }

    /// <summary>Proposes the next step size after a step of size h with error norm <paramref name="errorNorm"/>.</summary>
    /// <param name="h">The step just taken.</param>
    /// <param name="errorNorm">Its error norm from <see cref="Step"/>.</param>
    public static double NextStep(double h, double errorNorm)
    {
        if (double.IsNaN(errorNorm)) return 0.2 * h;
        double factor = errorNorm == 0 ? 5 : 0.9 * Math.Pow(errorNorm, -0.2);
        return h * Math.Clamp(factor, 0.2, 5.0);
    }
}
