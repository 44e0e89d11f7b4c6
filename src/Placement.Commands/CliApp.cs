using System.CommandLine;
using System.Reflection;
using Placement.Commands.Verbs;

namespace Placement.Commands;

/// <summary>Builds the <c>placement</c> command tree and runs it; the whole tool is one call to <see cref="Run"/>.</summary>
public static class CliApp
{
    /// <summary>Global option: no progress or informational lines.</summary>
    public static Option<bool> QuietOption { get; } = new("--quiet", "-q")
    {
        Description = "Print no progress or informational lines (errors still go to standard error).",
        Recursive = true,
    };

    /// <summary>Global option: machine-readable JSON on standard output.</summary>
    public static Option<bool> JsonOption { get; } = new("--json")
    {
        Description = "Write machine-readable JSON to standard output instead of tables.",
        Recursive = true,
    };

    /// <summary>Builds the root command with every sub-command.</summary>
    public static RootCommand Build(CliContext context)
    {
        var root = new RootCommand(
            "placement: place points or SPH particles in 3-D so they follow a radial mass profile, and measure how well they do.\n"
            + ExitCodes.HelpText);
        root.Options.Add(QuietOption);
        root.Options.Add(JsonOption);
        foreach (var command in CommandCatalog.Create(context)) root.Subcommands.Add(command);
        return root;
    }

    /// <summary>Parses <paramref name="args"/>, runs the chosen command and returns its exit code.</summary>
    /// <param name="args">Command-line arguments.</param>
    /// <param name="output">Standard output.</param>
    /// <param name="error">Standard error.</param>
    /// <param name="interactive">Whether output is a terminal; detected when null.</param>
    /// <param name="plugins">Assemblies whose public samplers and writers join the built-in ones (the MSBuild SDK passes the user's project).</param>
    public static int Run(string[] args, TextWriter output, TextWriter error, bool? interactive = null, IReadOnlyList<Assembly>? plugins = null)
    {
        ArgumentNullException.ThrowIfNull(args);
        var context = new CliContext(output, error, interactive ?? (!Console.IsOutputRedirected && Environment.GetEnvironmentVariable("CI") != "true"))
        {
            Plugins = plugins ?? [],
        };
        var root = Build(context);
        var parse = root.Parse(args);
        context.Quiet = parse.GetValue(QuietOption);
        context.Json = parse.GetValue(JsonOption);
        if (parse.Errors.Count > 0)
        {
            foreach (var e in parse.Errors) error.WriteLine($"placement: {e.Message}");
            error.WriteLine("Run 'placement --help' for usage.");
            return ExitCodes.Usage;
        }
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false });
        }
        catch (Exception ex)
        {
            return Report(ex, error);
        }
    }

    /// <summary>Turns an exception into one clear message and an exit code.</summary>
    internal static int Report(Exception ex, TextWriter error)
    {
        // The library's parameter names (" (Parameter 'path')", appended by ArgumentException and carried into the
        // messages commands rethrow) mean nothing on the command line.
        error = new ParameterNameFilter(error);
        while (ex is AggregateException { InnerExceptions.Count: 1 } agg) ex = agg.InnerExceptions[0];
        switch (ex)
        {
            case CliException cli:
                error.WriteLine($"placement: {cli.Message}");
                return cli.ExitCode;
            case FileNotFoundException fnf:
                error.WriteLine($"placement: input file not found: {fnf.FileName ?? fnf.Message}");
                return ExitCodes.BadInput;
            case DirectoryNotFoundException dnf:
                error.WriteLine($"placement: {dnf.Message}");
                return ExitCodes.BadInput;
            case FormatException or InvalidDataException:
                error.WriteLine($"placement: {ex.Message}");
                return ExitCodes.BadInput;
            case ArgumentException arg:
                error.WriteLine($"placement: {arg.Message}");
                return ExitCodes.Usage;
            case UnauthorizedAccessException or IOException:
                error.WriteLine($"placement: {ex.Message}");
                return ExitCodes.OutputRefused;
            default:
                error.WriteLine($"placement: internal error: {ex.GetType().Name}: {ex.Message}");
                return ExitCodes.Internal;
        }
    }

    /// <summary>Writes error lines without the " (Parameter 'name')" suffixes of argument exceptions.</summary>
    private sealed class ParameterNameFilter(TextWriter inner) : TextWriter
    {
        public override System.Text.Encoding Encoding => inner.Encoding;

        public override void Write(char value) => inner.Write(value);

        public override void WriteLine(string? value) =>
            inner.WriteLine(value is null ? null : System.Text.RegularExpressions.Regex.Replace(value, @" \(Parameter '[^']*'\)", ""));
    }
}
