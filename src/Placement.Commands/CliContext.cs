using Spectre.Console;

namespace Placement.Commands;

/// <summary>
/// Where a command writes: standard output and error, whether the user asked for quiet or JSON output, and
/// a progress reporter that draws Spectre.Console bars on a terminal and plain lines otherwise.
/// </summary>
public sealed class CliContext
{
    /// <summary>Creates a context over the given writers.</summary>
    public CliContext(TextWriter output, TextWriter error, bool interactive)
    {
        Output = output;
        Error = error;
        Interactive = interactive;
    }

    /// <summary>Standard output (reports, tables, JSON).</summary>
    public TextWriter Output { get; }

    /// <summary>Standard error (progress lines, warnings, errors).</summary>
    public TextWriter Error { get; }

    /// <summary>True when standard output is a terminal (progress bars and colours allowed).</summary>
    public bool Interactive { get; }

    /// <summary>Assemblies that contribute samplers and writers next to the built-in ones.</summary>
    public IReadOnlyList<System.Reflection.Assembly> Plugins { get; init; } = [];

    /// <summary>Suppress progress and informational lines.</summary>
    public bool Quiet { get; set; }

    /// <summary>Write machine-readable JSON to standard output instead of tables.</summary>
    public bool Json { get; set; }

    /// <summary>An ANSI console over <see cref="Output"/> for tables (no colours when not interactive).</summary>
    public IAnsiConsole Console => _console ??= CreateConsole();

    private IAnsiConsole CreateConsole()
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(Output),
            Ansi = Interactive ? AnsiSupport.Detect : AnsiSupport.No,
            ColorSystem = Interactive ? ColorSystemSupport.Detect : ColorSystemSupport.NoColors,
            Interactive = Interactive ? InteractionSupport.Detect : InteractionSupport.No,
        });
        // Redirected output has no width; 80 columns would fold every table, so give files and pipes room.
        if (!Interactive) console.Profile.Width = 160;
        return console;
    }

    private IAnsiConsole? _console;

    /// <summary>Writes an informational line to standard error unless quiet.</summary>
    public void Info(string message)
    {
        if (!Quiet) Error.WriteLine(message);
    }

    /// <summary>
    /// Runs <paramref name="work"/> as one named stage: a Spectre.Console progress bar on a terminal, a plain
    /// "stage … done (seconds)" line otherwise, nothing when quiet.
    /// </summary>
    public T Stage<T>(string name, Func<IProgress<double>, T> work)
    {
        ArgumentNullException.ThrowIfNull(work);
        var clock = System.Diagnostics.Stopwatch.StartNew();
        if (Quiet) return work(new Progress<double>());
        if (Interactive && !Json)
        {
            T result = default!;
            AnsiConsole.Progress().AutoClear(false).Columns(
                    new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn())
                .Start(ctx =>
                {
                    var task = ctx.AddTask(name, maxValue: 1.0);
                    result = work(new SyncProgress(f => task.Value = Math.Clamp(f, 0, 1)));
                    task.Value = 1.0;
                });
            return result;
        }
        Error.WriteLine($"{name} ...");
        T value = work(new SyncProgress(_ => { }));
        Error.WriteLine($"{name} done ({clock.Elapsed.TotalSeconds:F2} s)");
        return value;
    }

    /// <summary>A progress sink that calls back on the reporting thread (Progress&lt;T&gt; posts to a context).</summary>
    private sealed class SyncProgress(Action<double> report) : IProgress<double>
    {
        public void Report(double value) => report(value);
    }
}
