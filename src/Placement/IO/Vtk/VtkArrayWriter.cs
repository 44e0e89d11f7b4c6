using System.Globalization;
using System.Runtime.InteropServices;

namespace Placement.IO.Vtk;

/// <summary>Streams one VTK XML <c>DataArray</c> element in either encoding without holding the whole array as text.</summary>
/// <remarks>
/// Binary: the element body is the base64 encoding of one byte stream made of a UInt64 byte count followed by
/// the raw array bytes in the machine's byte order (the VTK XML file-format description, "Inline binary data",
/// uncompressed, header_type UInt64). Bytes are buffered in multiples of 3 so that '=' padding appears only at
/// the end. ASCII: values in shortest round-trip text, six per line.
/// </remarks>
internal sealed class VtkArrayWriter(TextWriter writer, VtkEncoding encoding)
{
    private const int ChunkBytes = 3 * 4096;
    private readonly byte[] _pending = new byte[ChunkBytes];
    private readonly char[] _chars = new char[ChunkBytes / 3 * 4];
    private readonly char[] _number = new char[40];
    private int _pendingCount;
    private long _valuesOnLine;

    /// <summary>Opens a DataArray of <paramref name="valueCount"/> values of <paramref name="vtkType"/> (size <paramref name="valueSize"/> bytes).</summary>
    /// <remarks>Field-data arrays also state their tuple count (<paramref name="tuples"/> ≥ 0), as VTK XML field data requires.</remarks>
    public void Begin(string vtkType, string? name, int components, long valueCount, int valueSize, long tuples = -1)
    {
        writer.Write($"        <DataArray type=\"{vtkType}\"");
        if (name is not null) writer.Write($" Name=\"{name}\"");
        if (tuples >= 0) writer.Write($" NumberOfTuples=\"{tuples.ToString(CultureInfo.InvariantCulture)}\"");
        if (components != 1) writer.Write($" NumberOfComponents=\"{components.ToString(CultureInfo.InvariantCulture)}\"");
        writer.Write(encoding == VtkEncoding.Ascii ? " format=\"ascii\">\n" : " format=\"binary\">\n");
        _pendingCount = 0;
        _valuesOnLine = 0;
        if (encoding == VtkEncoding.Base64Binary)
        {
            ulong byteCount = (ulong)valueCount * (ulong)valueSize;
            AppendBytes(MemoryMarshal.AsBytes(new ReadOnlySpan<ulong>(in byteCount)));
        }
    }

    /// <summary>Appends values in order.</summary>
    public void Append<T>(ReadOnlySpan<T> values) where T : unmanaged, ISpanFormattable
    {
        if (encoding == VtkEncoding.Base64Binary)
        {
            AppendBytes(MemoryMarshal.AsBytes(values));
            return;
        }
        foreach (var value in values)
        {
            value.TryFormat(_number, out int written, default, CultureInfo.InvariantCulture);
            writer.Write(_number, 0, written);
            writer.Write(++_valuesOnLine % 6 == 0 ? '\n' : ' ');
        }
    }

    /// <summary>Closes the DataArray element.</summary>
    public void End()
    {
        if (encoding == VtkEncoding.Base64Binary) FlushBytes();
        writer.Write("\n        </DataArray>\n");
    }

    private void AppendBytes(ReadOnlySpan<byte> bytes)
    {
        while (!bytes.IsEmpty)
        {
            int take = Math.Min(bytes.Length, ChunkBytes - _pendingCount);
            bytes[..take].CopyTo(_pending.AsSpan(_pendingCount));
            _pendingCount += take;
            bytes = bytes[take..];
            if (_pendingCount == ChunkBytes) FlushBytes();
        }
    }

    private void FlushBytes()
    {
        if (_pendingCount == 0) return;
        Convert.TryToBase64Chars(_pending.AsSpan(0, _pendingCount), _chars, out int written);
        writer.Write(_chars, 0, written);
        _pendingCount = 0;
    }
}
