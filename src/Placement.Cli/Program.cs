using Placement.Commands;

namespace Placement.Cli;

/// <summary>Process entry point of the <c>placement</c> tool: the whole command set lives in Placement.Commands.</summary>
public static class Program
{
    /// <summary>Runs the tool with the process's standard streams.</summary>
    public static int Main(string[] args) => CliApp.Run(args, Console.Out, Console.Error);
}
