using Placement.Commands;

namespace Placement.Commands.Tests;

/// <summary>Runs the tool in process and captures what it prints.</summary>
internal static class CliRunner
{
    public static (int ExitCode, string Output, string Error) Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        int code = CliApp.Run(args, output, error, interactive: false);
        return (code, output.ToString(), error.ToString());
    }
}
