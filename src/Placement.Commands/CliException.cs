namespace Placement.Commands;

/// <summary>An error the tool reports as one clear line with a specific exit code.</summary>
public sealed class CliException : Exception
{
    /// <summary>Creates the error with its exit code.</summary>
    public CliException(int exitCode, string message) : base(message) => ExitCode = exitCode;

    /// <summary>Creates the error with its exit code and cause.</summary>
    public CliException(int exitCode, string message, Exception inner) : base(message, inner) => ExitCode = exitCode;

    /// <summary>The process exit code to return (see <see cref="ExitCodes"/>).</summary>
    public int ExitCode { get; }
}
