using System.Runtime.InteropServices;
using BenchmarkDotNet.Attributes;
using Placement.IO;
using Placement.IO.Csv;
using Placement.IO.Hdf5;
using Placement.IO.Vtk;
using Placement.Points;
using Placement.Random;
using Placement.Units;

namespace Placement.Benchmarks;

/// <summary>
/// Cost of writing (and reading back) point files, against the floor of writing the same arrays as raw bytes
/// through the same atomic path (temporary file, flush to disk, rename).
/// </summary>
[MemoryDiagnoser]
public class IoBenchmarks
{
    private PointTable _table = null!;
    private string _dir = "";
    private string _h5 = "";

    [ParamsSource(nameof(Counts))]
    public int N { get; set; }

    public static IEnumerable<int> Counts => Program.Sizes(10_000, 1_000_000);

    [GlobalSetup]
    public void Setup()
    {
        var points = new PointSet(N, UnitSystem.Cgs);
        var rng = new KeyedRandom(5, 0);
        var volume = new double[N];
        for (int i = 0; i < N; i++)
        {
            points.X[i] = rng.NextDouble();
            points.Y[i] = rng.NextDouble();
            points.Z[i] = rng.NextDouble();
            points.Mass[i] = 1.0 / N;
            points.TargetDensity[i] = rng.NextDouble();
            volume[i] = rng.NextDouble() / N;
        }
        _table = new PointTable(points).Add(PointColumnNames.CellVolume, volume, QuantityDimension.Volume);
        _dir = Path.Combine(Path.GetTempPath(), "placement-io-bench-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(_dir);
        _h5 = Path.Combine(_dir, "read.h5");
        Hdf5PointWriter.Write(_table, _h5);
    }

    [GlobalCleanup]
    public void Cleanup() => Directory.Delete(_dir, recursive: true);

    [Benchmark(Baseline = true)]
    public void RawBytesFloor() => AtomicFile.Write(Path.Combine(_dir, "raw.bin"), true, stream =>
    {
        var p = _table.Points;
        foreach (var array in new[] { p.X, p.Y, p.Z, p.Mass, p.TargetDensity, _table.Columns[0].Components[0] })
            stream.Write(MemoryMarshal.AsBytes(array.AsSpan()));
        stream.Write(MemoryMarshal.AsBytes(p.Layer.AsSpan()));
    });

    [Benchmark]
    public void WriteHdf5() => Hdf5PointWriter.Write(_table, Path.Combine(_dir, "w.h5"), overwrite: true);

    [Benchmark]
    public int ReadHdf5() => Hdf5PointReader.Read(_h5).Count;

    [Benchmark]
    public void WriteVtuBinary() => VtkPointWriter.Write(_table, Path.Combine(_dir, "w.vtu"), overwrite: true);

    [Benchmark]
    public void WriteCsv() => CsvPointWriter.Write(_table, Path.Combine(_dir, "w.csv"), overwrite: true);
}
