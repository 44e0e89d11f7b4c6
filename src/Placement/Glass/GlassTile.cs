using System.Buffers.Binary;
using System.Text;

namespace Placement.Glass;

/// <summary>
/// A glass: N points in the periodic unit cube [0, 1)³ with no long-range density fluctuations, made by
/// <see cref="GlassMaker"/>; can be saved to and loaded from a small binary cache file.
/// </summary>
/// <remarks>
/// Coordinates are dimensionless (the cube has side 1); samplers scale and tile them. Cache file layout (little
/// endian): 8 bytes magic <c>PLGLASS1</c>, int32 N, uint64 seed, int32 iterations, double final rms step (in
/// units of the mean spacing), then x[N], y[N], z[N] as doubles.
/// </remarks>
public sealed class GlassTile
{
    private static readonly byte[] Magic = Encoding.ASCII.GetBytes("PLGLASS1");

    /// <summary>Wraps existing coordinate arrays (not copied) in [0, 1)³.</summary>
    /// <exception cref="ArgumentException">Arrays differ in length, are empty, or hold a coordinate outside [0, 1).</exception>
    public GlassTile(double[] x, double[] y, double[] z, ulong seed, int iterations, double finalRmsStep)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(z);
        if (x.Length != y.Length || x.Length != z.Length) throw new ArgumentException("x, y and z must have the same length.", nameof(x));
        if (x.Length == 0) throw new ArgumentException("A glass tile needs at least one point.", nameof(x));
        for (int i = 0; i < x.Length; i++)
            if (!(x[i] >= 0 && x[i] < 1 && y[i] >= 0 && y[i] < 1 && z[i] >= 0 && z[i] < 1))
                throw new ArgumentException($"Point {i} = ({x[i]}, {y[i]}, {z[i]}) lies outside the unit cube [0, 1)^3.", nameof(x));
        X = x;
        Y = y;
        Z = z;
        Seed = seed;
        Iterations = iterations;
        FinalRmsStep = finalRmsStep;
    }

    /// <summary>Number of points in the tile.</summary>
    public int Count => X.Length;

    /// <summary>x coordinates in [0, 1).</summary>
    public double[] X { get; }

    /// <summary>y coordinates in [0, 1).</summary>
    public double[] Y { get; }

    /// <summary>z coordinates in [0, 1).</summary>
    public double[] Z { get; }

    /// <summary>Seed of the random start.</summary>
    public ulong Seed { get; }

    /// <summary>Relaxation steps taken.</summary>
    public int Iterations { get; }

    /// <summary>rms displacement of the last step, in units of the mean spacing N^(−1/3).</summary>
    public double FinalRmsStep { get; }

    /// <summary>Writes the tile to <paramref name="path"/> atomically (temporary file, then rename).</summary>
    /// <exception cref="IOException">The file exists and <paramref name="overwrite"/> is false.</exception>
    public void Save(string path, bool overwrite = false)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (File.Exists(path) && !overwrite) throw new IOException($"Glass cache '{path}' exists; refusing to overwrite it.");
        string dir = PrepareDirectory(path);
        string tmp = Path.Combine(dir, "." + Path.GetFileName(path) + "." + Guid.NewGuid().ToString("N")[..8] + ".tmp");
        try
        {
            using (var stream = new FileStream(tmp, FileMode.CreateNew, FileAccess.Write))
            using (var w = new BinaryWriter(stream))
            {
                w.Write(Magic);
                w.Write(Count);
                w.Write(Seed);
                w.Write(Iterations);
                w.Write(FinalRmsStep);
                foreach (var a in new[] { X, Y, Z })
                    foreach (double v in a) w.Write(v);
            }
            File.Move(tmp, path, overwrite);
        }
        finally
        {
            if (File.Exists(tmp)) File.Delete(tmp);
        }
    }

    /// <summary>
    /// Creates the directory a cache file at <paramref name="path"/> goes into and returns it; callers that make the tile
    /// first call it before the work, so an unusable path fails at once.
    /// </summary>
    /// <exception cref="IOException">The directory cannot be created; the message names the cache file.</exception>
    internal static string PrepareDirectory(string path)
    {
        string dir = Path.GetDirectoryName(Path.GetFullPath(path))!;
        try
        {
            Directory.CreateDirectory(dir);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Without this the command line reported only "input file not found: <directory>".
            throw new IOException($"Glass cache '{path}' cannot be written: its directory '{dir}' cannot be created ({e.Message}).", e);
        }
        return dir;
    }

    /// <summary>Reads a tile written by <see cref="Save"/>.</summary>
    /// <exception cref="InvalidDataException">The file is not a glass cache, or is truncated or corrupt.</exception>
    public static GlassTile Load(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        byte[] data = File.ReadAllBytes(path);
        const int header = 8 + 4 + 8 + 4 + 8;
        if (data.Length < header || !data.AsSpan(0, 8).SequenceEqual(Magic))
            throw new InvalidDataException($"'{path}' is not a Placement glass cache (missing PLGLASS1 header).");
        int n = BinaryPrimitives.ReadInt32LittleEndian(data.AsSpan(8));
        ulong seed = BinaryPrimitives.ReadUInt64LittleEndian(data.AsSpan(12));
        int iterations = BinaryPrimitives.ReadInt32LittleEndian(data.AsSpan(20));
        double rms = BinaryPrimitives.ReadDoubleLittleEndian(data.AsSpan(24));
        if (n <= 0 || data.Length != header + 24L * n)
            throw new InvalidDataException($"'{path}': header says {n} points but the file has {data.Length} bytes (expected {header + 24L * n}).");
        var arrays = new double[3][];
        for (int a = 0; a < 3; a++)
        {
            arrays[a] = new double[n];
            for (int i = 0; i < n; i++)
                arrays[a][i] = BinaryPrimitives.ReadDoubleLittleEndian(data.AsSpan(header + 8 * (a * n + i)));
        }
        try
        {
            return new GlassTile(arrays[0], arrays[1], arrays[2], seed, iterations, rms);
        }
        catch (ArgumentException ex)
        {
            throw new InvalidDataException($"'{path}': {ex.Message}", ex);
        }
    }
}
