namespace Placement.IO;

/// <summary>Thrown when an output file already exists and overwriting was not asked for.</summary>
public sealed class OutputFileExistsException : IOException
{
    /// <summary>Creates the exception for <paramref name="path"/>.</summary>
    /// <param name="path">Full path of the existing file.</param>
    public OutputFileExistsException(string path)
        : base($"Output file '{path}' already exists; it was left untouched. Pass overwrite: true (or choose another path) to replace it.")
    {
        FilePath = path;
    }

    /// <summary>Creates the exception with a default message.</summary>
    public OutputFileExistsException() : this("") { }

    /// <summary>Creates the exception with a message and inner exception.</summary>
    /// <param name="message">Message.</param>
    /// <param name="innerException">Cause.</param>
    public OutputFileExistsException(string message, Exception innerException) : base(message, innerException)
    {
        FilePath = "";
    }

    /// <summary>Full path of the existing file.</summary>
    public string FilePath { get; }
}
