namespace Placement.IO;

/// <summary>Thrown when a file is not a Placement point file, or is one but is incomplete or inconsistent.</summary>
public sealed class PointFileFormatException : Exception
{
    /// <summary>Creates the exception for a file and a description of what is wrong.</summary>
    /// <param name="path">Path of the file.</param>
    /// <param name="problem">What is wrong and what was expected.</param>
    /// <param name="innerException">Underlying error, if any.</param>
    public PointFileFormatException(string path, string problem, Exception? innerException = null)
        : base($"'{path}': {problem}", innerException)
    {
        FilePath = path;
        Problem = problem;
    }

    /// <summary>Creates the exception with a default message.</summary>
    public PointFileFormatException() : this("", "not a Placement point file") { }

    /// <summary>Creates the exception with a message.</summary>
    /// <param name="message">Message.</param>
    public PointFileFormatException(string message) : this("", message) { }

    /// <summary>Creates the exception with a message and inner exception.</summary>
    /// <param name="message">Message.</param>
    /// <param name="innerException">Cause.</param>
    public PointFileFormatException(string message, Exception innerException) : this("", message, innerException) { }

    /// <summary>Path of the offending file.</summary>
    public string FilePath { get; }

    /// <summary>What is wrong with the file.</summary>
    public string Problem { get; }
}
