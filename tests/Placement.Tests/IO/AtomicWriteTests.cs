using Placement.IO;
using Placement.IO.Csv;
using Placement.IO.Hdf5;
using Placement.IO.Vtk;

namespace Placement.Tests.IO;

public class AtomicWriteTests
{
    public static TheoryData<string> Extensions => new() { ".h5", ".csv", ".vtu" };

    [Theory]
    [MemberData(nameof(Extensions))]
    public void Write_ExistingFileWithoutOverwrite_ThrowsNamingThePath_AndLeavesTheFileUntouched(string extension)
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("out" + extension);
        File.WriteAllText(path, "precious");
        var e = Assert.Throws<OutputFileExistsException>(() => PointFiles.Write(TestTables.Make(10), path));
        Assert.Contains(path, e.Message, StringComparison.Ordinal);
        Assert.Equal(path, e.FilePath);
        Assert.Equal("precious", File.ReadAllText(path));
        Assert.Equal(["out" + extension], dir.Entries());
    }

    [Theory]
    [MemberData(nameof(Extensions))]
    public void Write_ExistingFileWithOverwrite_ReplacesIt_AndLeavesNoTemporaryFile(string extension)
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("out" + extension);
        File.WriteAllText(path, "old");
        PointFiles.Write(TestTables.Make(10), path, overwrite: true);
        Assert.NotEqual("old", File.ReadAllText(path));
        Assert.True(new FileInfo(path).Length > 100);
        Assert.Equal(["out" + extension], dir.Entries());
    }

    [Fact]
    public void Write_WriterThrowsMidway_LeavesNoOutputAndNoTemporaryFile()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("partial.bin");
        var e = Assert.Throws<InvalidOperationException>(() => AtomicFile.Write(path, false, stream =>
        {
            stream.Write(new byte[10_000]);
            throw new InvalidOperationException("boom");
        }));
        Assert.Equal("boom", e.Message);
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void Write_WriterThrowsMidway_ExistingFileIsLeftUntouchedEvenWithOverwrite()
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("keep.h5");
        File.WriteAllText(path, "precious");
        Assert.Throws<IOException>(() => AtomicFile.Write(path, true, stream =>
            Hdf5PointWriter.WriteTo(TestTables.Make(5000), new FailingStream(stream, 50_000))));
        Assert.Equal("precious", File.ReadAllText(path));
        Assert.Equal(["keep.h5"], dir.Entries());
    }

    public static TheoryData<string> RealWriters => new() { "h5", "csv", "vtu" };

    [Theory]
    [MemberData(nameof(RealWriters))]
    public void RealWriter_StreamFailsAfterSomeBytes_LeavesNoOutputAndNoTemporaryFile(string format)
    {
        using var dir = TestTables.TempDir();
        string path = dir.File("points." + format);
        var table = TestTables.Make(5000);
        Action<Stream> write = format switch
        {
            "h5" => s => Hdf5PointWriter.WriteTo(table, new FailingStream(s, 20_000)),
            "csv" => s => CsvPointWriter.WriteTo(table, new FailingStream(s, 20_000)),
            _ => s => VtkPointWriter.WriteTo(table, new FailingStream(s, 20_000), VtkEncoding.Base64Binary),
        };
        Assert.Throws<IOException>(() => AtomicFile.Write(path, false, write));
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void Write_InvalidTable_ThrowsBeforeCreatingAnything()
    {
        using var dir = TestTables.TempDir();
        var table = TestTables.Make(10);
        table.Points.X[3] = double.NaN;
        var e = Assert.Throws<InvalidOperationException>(() => PointFiles.Write(table, dir.File("bad.h5")));
        Assert.Contains("Point 3", e.Message, StringComparison.Ordinal);
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void Write_MissingDirectory_Throws_AndUnknownExtensionIsRejected()
    {
        using var dir = TestTables.TempDir();
        Assert.Throws<DirectoryNotFoundException>(() => PointFiles.Write(TestTables.Make(2), dir.File("no/such/dir/p.h5")));
        var e = Assert.Throws<ArgumentException>(() => PointFiles.Write(TestTables.Make(2), dir.File("p.txt")));
        Assert.Contains(".txt", e.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => AtomicFile.Write(dir.Path, true, _ => { }));
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void FormatOf_MapsExtensionsCaseInsensitively()
    {
        Assert.Equal(PointFileFormat.Hdf5, PointFiles.FormatOf("a/b.H5"));
        Assert.Equal(PointFileFormat.Hdf5, PointFiles.FormatOf("b.hdf5"));
        Assert.Equal(PointFileFormat.Csv, PointFiles.FormatOf("b.CSV"));
        Assert.Equal(PointFileFormat.Vtu, PointFiles.FormatOf("b.vtu"));
    }

    /// <summary>Passes writes through until a byte budget is spent, then throws like a full disk would.</summary>
    private sealed class FailingStream(Stream inner, long budget) : Stream
    {
        private long _written;

        public override bool CanRead => inner.CanRead;
        public override bool CanSeek => inner.CanSeek;
        public override bool CanWrite => true;
        public override long Length => inner.Length;
        public override long Position { get => inner.Position; set => inner.Position = value; }
        public override void Flush() => inner.Flush();
        public override int Read(byte[] buffer, int offset, int count) => inner.Read(buffer, offset, count);
        public override long Seek(long offset, SeekOrigin origin) => inner.Seek(offset, origin);
        public override void SetLength(long value) => inner.SetLength(value);

        public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            _written += buffer.Length;
            if (_written > budget) throw new IOException("simulated: no space left on device");
            inner.Write(buffer);
        }
    }
}
