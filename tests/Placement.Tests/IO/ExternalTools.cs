using System.Diagnostics;

namespace Placement.Tests.IO;

/// <summary>Locates the Debian reference tools (h5py under /usr/bin/python3, h5dump) and runs them.</summary>
/// <remarks>
/// When CI=true a missing tool makes the test fail (CI installs them in .ci/run); locally the test is skipped.
/// </remarks>
internal static class ExternalTools
{
    public const string Python = "/usr/bin/python3";
    public const string H5Dump = "/usr/bin/h5dump";

    public static bool OnCi => string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase);

    public static bool HasH5py { get; } = File.Exists(Python) && Run(Python, ["-c", "import h5py"]).ExitCode == 0;

    public static bool HasH5Dump { get; } = File.Exists(H5Dump);

    public static (int ExitCode, string Stdout, string Stderr) Run(string program, IEnumerable<string> args)
    {
        var info = new ProcessStartInfo(program) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in args) info.ArgumentList.Add(a);
        using var process = Process.Start(info) ?? throw new InvalidOperationException($"Could not start {program}.");
        var stderr = process.StandardError.ReadToEndAsync();
        string stdout = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, stdout, stderr.Result);
    }

    /// <summary>Fails (on CI) with a clear message when a tool that the test needs is missing.</summary>
    public static void Require(bool present, string what)
    {
        if (!present) Assert.Fail($"{what} is required (CI=true) but missing; .ci/run installs python3-h5py and hdf5-tools.");
    }
}

/// <summary>A fact that needs h5py: skipped locally when absent, run (and failing) on CI.</summary>
internal sealed class H5pyFactAttribute : FactAttribute
{
    public H5pyFactAttribute()
    {
        if (!ExternalTools.HasH5py && !ExternalTools.OnCi) Skip = $"h5py not found under {ExternalTools.Python} (Debian python3-h5py).";
    }
}

/// <summary>A fact that needs h5dump: skipped locally when absent, run (and failing) on CI.</summary>
internal sealed class H5DumpFactAttribute : FactAttribute
{
    public H5DumpFactAttribute()
    {
        if (!ExternalTools.HasH5Dump && !ExternalTools.OnCi) Skip = $"{ExternalTools.H5Dump} not found (Debian hdf5-tools).";
    }
}
