using System.CommandLine;

namespace Placement.Commands.Verbs;

/// <summary>The overwrite switch shared by every command that writes files.</summary>
internal static class OutputArguments
{
    public static Option<bool> Overwrite() => new("--overwrite")
    {
        Description = "Replace output files that already exist (without it an existing file is never touched).",
    };

    /// <summary>Refuses up front when any output exists and overwriting was not asked for, so nothing is half done.</summary>
    public static void CheckWritable(bool overwrite, params string?[] paths)
    {
        foreach (string? path in paths)
        {
            if (string.IsNullOrEmpty(path)) continue;
            if (!overwrite && (File.Exists(path) || Directory.Exists(path) && Directory.EnumerateFileSystemEntries(path).Any() && !path.EndsWith('/')))
                throw new CliException(ExitCodes.OutputRefused, $"output '{path}' exists; pass --overwrite to replace it.");
            string? dir = Path.GetDirectoryName(Path.GetFullPath(path));
            if (dir is not null && !Directory.Exists(dir))
                throw new CliException(ExitCodes.OutputRefused, $"the directory of output '{path}' does not exist: {dir}");
        }
    }
}
