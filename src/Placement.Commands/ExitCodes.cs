namespace Placement.Commands;

/// <summary>Process exit codes of the <c>placement</c> tool (documented in <c>placement --help</c> and the README).</summary>
public static class ExitCodes
{
    /// <summary>Success.</summary>
    public const int Ok = 0;

    /// <summary>The job ran but a quality threshold the user asked for was not met.</summary>
    public const int QualityThresholdFailed = 1;

    /// <summary>Bad command-line arguments (unknown option, missing value, value out of range).</summary>
    public const int Usage = 2;

    /// <summary>An input file could not be read or is malformed (the message names file, line, column, value).</summary>
    public const int BadInput = 3;

    /// <summary>An output could not be written, or exists and <c>--overwrite</c> was not given. Nothing was written.</summary>
    public const int OutputRefused = 4;

    /// <summary>An unexpected internal error (a bug: please report it with the message).</summary>
    public const int Internal = 70;

    /// <summary>Text for <c>--help</c>.</summary>
    public const string HelpText =
        "Exit codes: 0 ok, 1 quality threshold not met, 2 bad arguments, 3 bad input file, 4 output refused or not writable, 70 internal error.";
}
