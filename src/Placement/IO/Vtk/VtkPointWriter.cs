using System.Text;
using Placement.Points;

namespace Placement.IO.Vtk;

/// <summary>
/// Writes a <see cref="PointTable"/> as a VTK XML unstructured grid (<c>.vtu</c>) for ParaView: the points,
/// one <c>VTK_VERTEX</c> cell per point, and every field as point data.
/// </summary>
/// <remarks>
/// Layout: <c>VTKFile type="UnstructuredGrid" version="1.0" header_type="UInt64"</c>, one <c>Piece</c> with
/// NumberOfPoints = NumberOfCells = N. Points: Float64 × 3. Cells: connectivity Int64 0…N−1, offsets Int64
/// 1…N, types UInt8 all 1 (VTK_VERTEX), so that cell-based filters (threshold, extract) act per point.
/// PointData: <c>id</c> (Int64), <c>mass</c>, <c>target_density</c> (Float64), <c>layer</c> (Int32) and every
/// extra column (Float64, NumberOfComponents = its component count). VTK XML has no unit field, so units and
/// provenance are written in an XML comment at the top of the file. Encoding: inline base64 binary by
/// default (<see cref="VtkEncoding"/>). Cell types and element names follow the VTK file-format
/// documentation (Kitware, "VTK File Formats", XML section). Written atomically through <see cref="AtomicFile"/>.
/// </remarks>
public static class VtkPointWriter
{
    /// <summary>VTK cell type number of a single vertex (VTK_VERTEX).</summary>
    public const byte VertexCellType = 1;

    private const int Block = 4096;

    /// <summary>Writes <paramref name="table"/> to <paramref name="path"/>.</summary>
    /// <param name="table">Points and extra columns; validated with <see cref="PointTable.CheckValidity"/> first.</param>
    /// <param name="path">Output file (conventionally <c>.vtu</c>).</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <param name="encoding">Base64 binary (default) or ASCII.</param>
    /// <exception cref="InvalidOperationException">The table breaks an invariant.</exception>
    /// <exception cref="OutputFileExistsException">The file exists and <paramref name="overwrite"/> is false.</exception>
    /// <exception cref="DirectoryNotFoundException">The target directory does not exist.</exception>
    public static void Write(PointTable table, string path, bool overwrite = false, VtkEncoding encoding = VtkEncoding.Base64Binary)
    {
        ArgumentNullException.ThrowIfNull(table);
        table.CheckValidity();
        AtomicFile.Write(path, overwrite, stream => WriteTo(table, stream, encoding));
    }

    /// <summary>Writes the XML to a stream (no atomicity: callers go through <see cref="Write"/>).</summary>
    internal static void WriteTo(PointTable table, Stream stream, VtkEncoding encoding)
    {
        using var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" };
        PointSet p = table.Points;
        int n = p.Count;
        var arrays = new VtkArrayWriter(w, encoding);

        w.Write("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        WriteComment(w, table);
        string byteOrder = BitConverter.IsLittleEndian ? "LittleEndian" : "BigEndian";
        w.Write($"<VTKFile type=\"UnstructuredGrid\" version=\"1.0\" byte_order=\"{byteOrder}\" header_type=\"UInt64\">\n");
        w.Write("  <UnstructuredGrid>\n");
        WritePointMasses(arrays, w, table);
        w.Write($"    <Piece NumberOfPoints=\"{n}\" NumberOfCells=\"{n}\">\n");

        w.Write("      <PointData Scalars=\"mass\">\n");
        WriteIds(arrays, table);
        WriteScalar(arrays, PointColumnNames.Mass, p.Mass);
        WriteScalar(arrays, PointColumnNames.TargetDensity, p.TargetDensity);
        arrays.Begin("Int32", PointColumnNames.Layer, 1, n, sizeof(int));
        arrays.Append<int>(p.Layer);
        arrays.End();
        foreach (var column in table.Columns)
        {
            if (column.ComponentCount == 1) WriteScalar(arrays, column.Name, column.Components[0]);
            else WriteInterleaved(arrays, column.Name, column.Components);
        }
        w.Write("      </PointData>\n");

        w.Write("      <Points>\n");
        WriteInterleaved(arrays, null, [p.X, p.Y, p.Z]);
        w.Write("      </Points>\n");

        w.Write("      <Cells>\n");
        WriteCells(arrays, n);
        w.Write("      </Cells>\n");

        w.Write("    </Piece>\n  </UnstructuredGrid>\n</VTKFile>\n");
    }

    private static void WriteComment(StreamWriter w, PointTable table)
    {
        var text = new StringBuilder();
        foreach (var (key, value) in FileHeaderLines.For(table, "placement-points-vtu"))
            text.Append("  ").Append(key).Append(": ").Append(value).Append('\n');
        var u = table.Points.Units;
        text.Append($"  units: position [{u.LengthUnitName}], mass [{u.MassUnitName}], target_density [{u.DensityUnitName}], id [1], layer [1]");
        foreach (var column in table.Columns) text.Append($", {column.Name} [{column.Unit}]");
        if (table.PointMasses.Count > 0)
            text.Append($", field data point_mass_mass [{u.MassUnitName}], point_mass_softening_length [{u.LengthUnitName}], "
                + $"point_mass_position [{u.LengthUnitName}], point_mass_velocity [{QuantityDimension.Velocity.UnitName(u)}] (rows as in point_mass lines)");
        text.Append("\n  cells: one VTK_VERTEX per point\n");
        // "--" may not appear inside an XML comment (XML 1.0, section 2.5).
        w.Write("<!--\n");
        string body = text.ToString();
        while (body.Contains("--", StringComparison.Ordinal)) body = body.Replace("--", "- -", StringComparison.Ordinal);
        w.Write(body);
        w.Write("-->\n");
    }

    /// <summary>Point masses as VTK field data (one tuple per point mass); their names are in the header comment.</summary>
    private static void WritePointMasses(VtkArrayWriter arrays, StreamWriter w, PointTable table)
    {
        var list = table.PointMasses;
        int k = list.Count;
        if (k == 0) return;
        var mass = new double[k];
        var soft = new double[k];
        var position = new double[3][];
        var velocity = new double[3][];
        for (int c = 0; c < 3; c++) { position[c] = new double[k]; velocity[c] = new double[k]; }
        for (int i = 0; i < k; i++)
        {
            var p = list[i];
            mass[i] = p.Mass; soft[i] = p.SofteningLength;
            position[0][i] = p.X; position[1][i] = p.Y; position[2][i] = p.Z;
            velocity[0][i] = p.Vx; velocity[1][i] = p.Vy; velocity[2][i] = p.Vz;
        }
        w.Write("    <FieldData>\n");
        WriteField(arrays, "point_mass_mass", [mass]);
        WriteField(arrays, "point_mass_softening_length", [soft]);
        WriteField(arrays, "point_mass_position", position);
        WriteField(arrays, "point_mass_velocity", velocity);
        w.Write("    </FieldData>\n");
    }

    private static void WriteField(VtkArrayWriter arrays, string name, double[][] components)
    {
        int k = components[0].Length, n = components.Length;
        var flat = n == 1 ? components[0] : Hdf5.Hdf5PointWriter.Interleave(components);
        arrays.Begin("Float64", name, n, (long)k * n, sizeof(double), tuples: k);
        arrays.Append<double>(flat);
        arrays.End();
    }

    private static void WriteIds(VtkArrayWriter arrays, PointTable table)
    {
        int n = table.Count;
        arrays.Begin("Int64", PointColumnNames.Id, 1, n, sizeof(long));
        if (table.Ids is not null)
        {
            arrays.Append<long>(table.Ids);
        }
        else
        {
            AppendSequence(arrays, n, 0);
        }
        arrays.End();
    }

    private static void WriteScalar(VtkArrayWriter arrays, string name, double[] values)
    {
        arrays.Begin("Float64", name, 1, values.Length, sizeof(double));
        arrays.Append<double>(values);
        arrays.End();
    }

    private static void WriteInterleaved(VtkArrayWriter arrays, string? name, IReadOnlyList<double[]> components)
    {
        int k = components.Count, n = components[0].Length;
        arrays.Begin("Float64", name, k, (long)n * k, sizeof(double));
        var buffer = new double[Block * k];
        for (int start = 0; start < n; start += Block)
        {
            int count = Math.Min(Block, n - start);
            for (int c = 0; c < k; c++)
            {
                var source = components[c];
                for (int i = 0, j = c; i < count; i++, j += k) buffer[j] = source[start + i];
            }
            arrays.Append<double>(buffer.AsSpan(0, count * k));
        }
        arrays.End();
    }

    private static void WriteCells(VtkArrayWriter arrays, int n)
    {
        arrays.Begin("Int64", "connectivity", 1, n, sizeof(long));
        AppendSequence(arrays, n, 0);
        arrays.End();
        arrays.Begin("Int64", "offsets", 1, n, sizeof(long));
        AppendSequence(arrays, n, 1);
        arrays.End();
        arrays.Begin("UInt8", "types", 1, n, sizeof(byte));
        var types = new byte[Math.Min(Block, Math.Max(n, 1))];
        Array.Fill(types, VertexCellType);
        for (int start = 0; start < n; start += types.Length)
            arrays.Append<byte>(types.AsSpan(0, Math.Min(types.Length, n - start)));
        arrays.End();
    }

    /// <summary>Appends first, first+1, …, first+n−1 as Int64 in blocks.</summary>
    private static void AppendSequence(VtkArrayWriter arrays, int n, long first)
    {
        var block = new long[Block];
        for (int start = 0; start < n; start += Block)
        {
            int count = Math.Min(Block, n - start);
            for (int i = 0; i < count; i++) block[i] = first + start + i;
            arrays.Append<long>(block.AsSpan(0, count));
        }
    }
}
