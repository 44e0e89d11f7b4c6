using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Running;
using BenchmarkDotNet.Toolchains.InProcess.Emit;

namespace Placement.Benchmarks;

/// <summary>
/// Entry point. <c>--smoke</c> runs every benchmark once, in process, at its smallest size, so CI proves they
/// still run; anything else is passed to BenchmarkDotNet (e.g. <c>--filter *Healpix*</c>).
/// </summary>
public static class Program
{
    /// <summary>True while running in smoke mode; benchmarks use it to pick their smallest sizes.</summary>
    public static bool Smoke { get; private set; }

    public static int Main(string[] args)
    {
        if (args.Contains("--smoke"))
        {
            Smoke = true;
            Environment.SetEnvironmentVariable("PLACEMENT_BENCH_SMOKE", "1");
            var config = ManualConfig.CreateMinimumViable()
                .AddJob(Job.Dry.WithToolchain(InProcessEmitToolchain.Instance))
                .WithOptions(ConfigOptions.DisableOptimizationsValidator);
            var rest = args.Where(a => a != "--smoke").ToArray();
            var summaries = BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly)
                .Run(rest.Length == 0 ? ["--filter", "*"] : rest, config);
            bool failed = summaries.Any(s => s.HasCriticalValidationErrors || s.Reports.Any(r => !r.Success));
            Console.WriteLine(failed ? "benchmark smoke run: FAILED" : "benchmark smoke run: ok");
            return failed ? 1 : 0;
        }
        // Medians are what the project quotes (these machines are noisy); show them beside the mean.
        var full = DefaultConfig.Instance.AddColumn(BenchmarkDotNet.Columns.StatisticColumn.Median);
        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args, full);
        return 0;
    }

    /// <summary>Sizes for a benchmark parameter: the full list, or only the smallest one in smoke mode.</summary>
    public static IEnumerable<int> Sizes(params int[] sizes) =>
        Environment.GetEnvironmentVariable("PLACEMENT_BENCH_SMOKE") == "1" ? [sizes.Min()] : sizes;
}
