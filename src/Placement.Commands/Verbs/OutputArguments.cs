using System.CommandLine;
using Placement.Commands.Reports;

namespace Placement.Commands.Verbs;

/// <summary>The output options shared by commands that write files: overwrite switch, quality report, figures.</summary>
internal sealed class OutputArguments
{
    public Option<bool> Overwrite { get; } = new("--overwrite")
    {
        Description = "Replace output files that already exist (without it an existing file is never touched).",
    };

    public Option<string?> Report { get; } = new("--report")
    {
        Description = "Write the quality report (Voronoi cell statistics against the profile and a Poisson baseline) as JSON to this file.",
    };

    public Option<string?> Plots { get; } = new("--plots")
    {
        Description = "Draw the quality figures (density profile, enclosed-mass error, ln(Vρ/m) histogram, slice) as PNG and SVG into this directory.",
    };

    public Option<bool> NoBaseline { get; } = new("--no-baseline")
    {
        Description = "Skip the Poisson baseline (halves the checking time; the report then has no reference column).",
    };

    public void AddTo(Command command, bool withReport = true)
    {
        command.Options.Add(Overwrite);
        if (!withReport) return;
        command.Options.Add(Report);
        command.Options.Add(Plots);
        command.Options.Add(NoBaseline);
    }

    /// <summary>Refuses up front when any output exists and overwriting was not asked for, so nothing is half done.</summary>
    public static void CheckWritable(bool overwrite, params string?[] paths)
    {
        foreach (string? path in paths)
        {
            if (string.IsNullOrEmpty(path)) continue;
            if (!overwrite && File.Exists(path))
                throw new CliException(ExitCodes.OutputRefused, $"output '{path}' exists; pass --overwrite to replace it.");
            string? dir = Path.GetDirectoryName(Path.GetFullPath(path));
            if (dir is not null && !Directory.Exists(dir))
                throw new CliException(ExitCodes.OutputRefused, $"the directory of output '{path}' does not exist: {dir}");
        }
    }

    /// <summary>Checks the report file and the figure files of <paramref name="parse"/>.</summary>
    public void CheckReportOutputs(ParseResult parse)
    {
        bool overwrite = parse.GetValue(Overwrite);
        CheckWritable(overwrite, parse.GetValue(Report));
        QualityRun.CheckPlotsWritable(parse.GetValue(Plots), overwrite);
    }

    public bool WantsQuality(ParseResult parse) => parse.GetValue(Report) is not null || parse.GetValue(Plots) is not null;
}
