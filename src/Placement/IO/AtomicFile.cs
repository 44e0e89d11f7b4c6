namespace Placement.IO;

/// <summary>
/// Writes an output file atomically: into a temporary file in the same directory, then renamed over the
/// target, so readers never see a half-written file and a failure leaves nothing behind.
/// </summary>
/// <remarks>
/// The temporary file is <c>.NAME.RANDOM.tmp</c> beside the target (same directory, hence the same file
/// system, so the final rename is atomic on POSIX systems and on NTFS). It is flushed to disk before the
/// rename. If the writer throws, the temporary file is deleted and the exception propagates; an existing
/// target is never touched unless <c>overwrite</c> is true. Every Placement writer (HDF5, CSV, VTK, plots)
/// goes through this class.
/// </remarks>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="path"/> atomically through <paramref name="write"/>.</summary>
    /// <param name="path">Target file path.</param>
    /// <param name="overwrite">Replace an existing file; when false an existing file raises <see cref="OutputFileExistsException"/>.</param>
    /// <param name="write">Writes the whole content to the given stream (seekable, positioned at 0).</param>
    /// <exception cref="ArgumentException"><paramref name="path"/> is empty or names a directory.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    public static void Write(string path, bool overwrite, Action<Stream> write)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(path);
        ArgumentNullException.ThrowIfNull(write);
        string full = Path.GetFullPath(path);
        if (Directory.Exists(full))
            throw new ArgumentException($"Output path '{full}' is a directory; expected a file name.", nameof(path));
        string directory = Path.GetDirectoryName(full) ?? throw new ArgumentException($"Output path '{full}' has no directory.", nameof(path));
        if (!Directory.Exists(directory))
            throw new DirectoryNotFoundException($"Cannot write '{full}': directory '{directory}' does not exist.");
        if (!overwrite && File.Exists(full)) throw new OutputFileExistsException(full);

        string temp = TemporaryPathFor(full);
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, 1 << 16))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }
            try
            {
                File.Move(temp, full, overwrite);
            }
            catch (IOException e) when (!overwrite && File.Exists(full))
            {
                // Another process created the target between our check and the rename.
                throw new OutputFileExistsException($"Output file '{full}' appeared while it was being written; it was left untouched.", e);
            }
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    /// <summary>The temporary name used for <paramref name="fullPath"/>: hidden, same directory, random suffix.</summary>
    internal static string TemporaryPathFor(string fullPath) =>
        Path.Combine(Path.GetDirectoryName(fullPath)!, "." + Path.GetFileName(fullPath) + "." + Guid.NewGuid().ToString("N")[..12] + ".tmp");

    private static void TryDelete(string temp)
    {
        try
        {
            File.Delete(temp);
        }
        catch (IOException)
        {
            // Best effort: the original exception matters more than a failed clean-up.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
