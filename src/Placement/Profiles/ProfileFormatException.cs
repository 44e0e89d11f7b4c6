namespace Placement.Profiles;

/// <summary>A profile table could not be read: names the file, line, column and offending value.</summary>
public sealed class ProfileFormatException : FormatException
{
    /// <summary>Creates the exception; the message is "source:line: column 'c', value 'v': reason".</summary>
    /// <param name="source">File name or other description of the input.</param>
    /// <param name="line">1-based line number in the input (0 when the problem is not tied to a line).</param>
    /// <param name="column">Column name (or "#k" for the k-th cell when the name is unknown).</param>
    /// <param name="value">The offending text or value.</param>
    /// <param name="reason">What is wrong and what was expected.</param>
    public ProfileFormatException(string source, int line, string column, string value, string reason)
        : base($"{source}:{line}: column '{column}', value '{value}': {reason}")
    {
        SourceName = source;
        Line = line;
        Column = column;
        Value = value;
        Reason = reason;
    }

    /// <summary>Creates the exception with a plain message (no location).</summary>
    public ProfileFormatException() : this("", 0, "", "", "invalid profile table") { }

    /// <summary>Creates the exception with a plain message (no location).</summary>
    /// <param name="message">What went wrong.</param>
    public ProfileFormatException(string message) : this("", 0, "", "", message) { }

    /// <summary>Creates the exception with a plain message and an inner exception.</summary>
    /// <param name="message">What went wrong.</param>
    /// <param name="innerException">The cause.</param>
    public ProfileFormatException(string message, Exception innerException) : base(message, innerException)
    {
        SourceName = "";
        Column = "";
        Value = "";
        Reason = message;
    }

    /// <summary>File name or other description of the input.</summary>
    public string SourceName { get; }

    /// <summary>1-based line number (0 when not tied to a line).</summary>
    public int Line { get; }

    /// <summary>Column name.</summary>
    public string Column { get; }

    /// <summary>The offending text or value.</summary>
    public string Value { get; }

    /// <summary>What is wrong.</summary>
    public string Reason { get; }
}
