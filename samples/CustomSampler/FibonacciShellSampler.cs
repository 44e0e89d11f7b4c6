using Placement.Samplers;

namespace CustomSampler;

/// <summary>
/// An example plug-in: equal-mass shells whose points follow a Fibonacci (golden-angle) spiral on each shell instead
/// of HEALPix pixel centres. Shell radii and counts: one shell of n points per √n-thick mass layer, so cells are
/// roughly cubic. Written for the sample; the golden-angle spiral is a standard construction (e.g. González 2010,
/// Math. Geosci. 42, 49).
/// </summary>
public sealed class FibonacciShellSampler : IPointSampler
{
    private static readonly double GoldenAngle = Math.PI * (3 - Math.Sqrt(5));

    public string Name => "fibonacci-shells";

    public SamplerDescription Describe() => new(Name,
        "Equal-mass shells with points on a golden-angle spiral (sample plug-in).",
        [new("shell-points", SamplerParameterKind.Integer, "0", "points", "Points per shell; 0 picks about (N)^(2/3).", minimum: 0, maximum: 10_000_000)]);

    public SamplingPlan Plan(SamplingRequest request)
    {
        var values = request.ParametersFor(Describe());
        int n = request.Count;
        int perShell = values.GetInt32("shell-points");
        if (perShell <= 0) perShell = Math.Max(1, (int)Math.Round(Math.Pow(n, 2.0 / 3.0)));
        double m = request.Profile.TotalMass / n;
        var batches = new List<PlannedBatch>();
        for (int start = 0, layer = 0; start < n; start += perShell, layer++)
        {
            int count = Math.Min(perShell, n - start);
            // The shell sits at the radius enclosing the middle of its mass: exact enclosed mass at shell boundaries.
            double r = request.Profile.RadiusOfEnclosedMass(m * (start + 0.5 * count));
            batches.Add(new PlannedBatch(start, count, layer, m, r));
        }
        return new SamplingPlan(n, batches);
    }

    public void Fill(SamplingRequest request, SamplingPlan plan, int batch, PointSpans output)
    {
        var b = plan.Batches[batch];
        double twist = batch * 0.7; // turn consecutive shells against each other
        for (int i = 0; i < output.Length; i++)
        {
            double z = 1 - (2 * i + 1.0) / output.Length;
            double s = Math.Sqrt((1 - z) * (1 + z));
            double phi = GoldenAngle * i + twist;
            output.X[i] = b.Radius * s * Math.Cos(phi);
            output.Y[i] = b.Radius * s * Math.Sin(phi);
            output.Z[i] = b.Radius * z;
        }
    }
}
