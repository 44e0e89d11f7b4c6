namespace Placement.Numerics;

/// <summary>Right-hand side of a first-order ODE system dy/dt = f(t, y).</summary>
/// <param name="t">Independent variable.</param>
/// <param name="y">State.</param>
/// <param name="dydt">Output: derivative of the state, same length.</param>
public delegate void OdeSystem(double t, ReadOnlySpan<double> y, Span<double> dydt);
