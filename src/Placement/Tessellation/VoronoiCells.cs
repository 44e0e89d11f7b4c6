using System.Globalization;

namespace Placement.Tessellation;

/// <summary>
/// The Voronoi cells of a point set within a domain: per-cell geometry as structure-of-arrays, indexed like the
/// input points.
/// </summary>
/// <remarks>
/// <para>Layout (length units L of the points): <c>Volume[i]</c> (L³); <c>CentroidX/Y/Z[i]</c> (L);
/// <c>FaceCount[i]</c>; <c>CentroidOffset[i]</c> = |centroid − generator| (L); <c>MaxFaceAngleRatio[i]</c> =
/// max over faces shared with generators of √(A_f/π)/h_f, h_f the generator–face distance (dimensionless; common
/// practice in moving-mesh codes, see the project's reference notes §6); <c>CutByDomain[i]</c> true when a face
/// lies on a wall or the sphere surface; <c>Mass[i]</c> (mass units, only when a mass profile was given).
/// Memory: 8 + 24 + 4 + 8 + 8 + 1 = 53 bytes per cell, 8 more with masses.</para>
/// <para>With <see cref="TessellationOptions.KeepFaces"/>, face j of cell i for j in
/// [<c>FaceStart[i]</c>, <c>FaceStart[i+1]</c>) has neighbour <c>FaceNeighbour[j]</c> (a point index, or a
/// <see cref="CellFaceCodes"/> wall code) and area <c>FaceArea[j]</c> (L²): 12 bytes per face.</para>
/// </remarks>
public sealed class VoronoiCells
{
    internal VoronoiCells(int count, TessellationDomain domain, bool keepFaces, bool masses)
    {
        Count = count;
        Domain = domain;
        // Not cleared: every cell's builder writes each of these (a tessellation that fails returns no cells, and the
        // tessellator that owns them rewrites all before returning them again).
        Volume = GC.AllocateUninitializedArray<double>(count);
        CentroidX = GC.AllocateUninitializedArray<double>(count);
        CentroidY = GC.AllocateUninitializedArray<double>(count);
        CentroidZ = GC.AllocateUninitializedArray<double>(count);
        FaceCount = GC.AllocateUninitializedArray<int>(count);
        CentroidOffset = GC.AllocateUninitializedArray<double>(count);
        MaxFaceAngleRatio = GC.AllocateUninitializedArray<double>(count);
        CutByDomain = GC.AllocateUninitializedArray<bool>(count);
        Mass = masses ? GC.AllocateUninitializedArray<double>(count) : null;
        if (keepFaces) FaceStart = new int[count + 1];
    }

    /// <summary>Number of cells (= number of points).</summary>
    public int Count { get; }

    /// <summary>The domain the cells fill.</summary>
    public TessellationDomain Domain { get; }

    /// <summary>Cell volumes, L³.</summary>
    public double[] Volume { get; }

    /// <summary>Centroid x, L (in a periodic box possibly outside the box, next to its generator).</summary>
    public double[] CentroidX { get; }

    /// <summary>Centroid y, L.</summary>
    public double[] CentroidY { get; }

    /// <summary>Centroid z, L.</summary>
    public double[] CentroidZ { get; }

    /// <summary>Number of faces larger than the face-area tolerance (walls included).</summary>
    public int[] FaceCount { get; }

    /// <summary>Distance from generator to centroid, L.</summary>
    public double[] CentroidOffset { get; }

    /// <summary>Largest √(A_f/π)/h_f over faces shared with generators (walls excluded); 0 when there is none.</summary>
    public double[] MaxFaceAngleRatio { get; }

    /// <summary>True when the cell has a face on the domain boundary.</summary>
    public bool[] CutByDomain { get; }

    /// <summary>Cell masses ∫ρ dV (mass units) when a mass profile was given, else null.</summary>
    public double[]? Mass { get; }

    /// <summary>Start of each cell's faces in the face arrays (length Count + 1), or null when faces were not kept.</summary>
    public int[]? FaceStart { get; }

    /// <summary>Neighbour of each kept face: a point index or a <see cref="CellFaceCodes"/> code; null when not kept.</summary>
    public int[]? FaceNeighbour { get; internal set; }

    /// <summary>Area of each kept face, L²; null when not kept.</summary>
    public double[]? FaceArea { get; internal set; }

    /// <summary>Diagnostics: bisecting planes tested against cells, in total.</summary>
    public long PlanesTested { get; internal set; }

    /// <summary>Diagnostics: planes that cut a cell, in total.</summary>
    public long PlanesCut { get; internal set; }

    /// <summary>Sum of all cell volumes (compensated), L³.</summary>
    public double TotalVolume() => CompensatedSum(Volume);

    /// <summary>Cell radius (3V/4π)^{1/3} of cell <paramref name="i"/>, L.</summary>
    public double CellRadius(int i) => Math.Cbrt(3.0 * Volume[i] / (4.0 * Math.PI));

    /// <summary>
    /// Asserts the invariants: volumes finite and positive; centroids finite and within the cell's reach of the
    /// generator; face counts ≥ 4; for boxes the volumes sum to the box volume within
    /// <paramref name="relativeTolerance"/>; for balls the sum lies in [V_ball(1 − tol), V_ball(1 + δ)³(1 + tol)];
    /// with kept faces, every face's neighbour lists the cell back with the same area (within 1e-6 V^{2/3}, plus
    /// 4√A_f δR in a ball, where the two cells' tangent planes differ).
    /// </summary>
    /// <param name="x">Generator x, the points tessellated.</param>
    /// <param name="y">Generator y.</param>
    /// <param name="z">Generator z.</param>
    /// <param name="relativeTolerance">Tolerance on the volume sum, relative. Default 1e-10.</param>
    /// <param name="sphereTolerance">The δ the tessellation used for ball domains.</param>
    /// <exception cref="InvalidOperationException">An invariant is broken; the message names the cell.</exception>
    public void CheckValidity(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z,
        double relativeTolerance = 1e-10, double sphereTolerance = 1e-4)
    {
        if (x.Length != Count || y.Length != Count || z.Length != Count)
            throw new InvalidOperationException($"Expected {Count} generators, got {x.Length}, {y.Length}, {z.Length}.");
        for (int i = 0; i < Count; i++)
        {
            double v = Volume[i];
            if (!(v > 0) || !double.IsFinite(v)) throw new InvalidOperationException($"Cell {i} has volume {v}; expected finite and > 0.");
            if (FaceCount[i] < 4) throw new InvalidOperationException($"Cell {i} has {FaceCount[i]} faces; a polyhedron has at least 4.");
            double dx = CentroidX[i] - x[i], dy = CentroidY[i] - y[i], dz = CentroidZ[i] - z[i];
            double off = Math.Sqrt(dx * dx + dy * dy + dz * dz);
            if (!double.IsFinite(off) || Math.Abs(off - CentroidOffset[i]) > 1e-9 * (off + Math.Cbrt(v)))
                throw new InvalidOperationException($"Cell {i}: centroid offset {CentroidOffset[i]} disagrees with the centroid ({off}).");
        }
        double sum = TotalVolume(), target = Domain.Volume;
        if (Domain.Kind == DomainKind.Sphere)
        {
            double upper = target * Math.Pow(1 + sphereTolerance, 3) * (1 + relativeTolerance);
            if (sum < target * (1 - relativeTolerance) || sum > upper)
                throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                    $"Cell volumes sum to {sum:R}; a ball approximated to δ = {sphereTolerance} needs [{target:R}, {upper:R}]."));
        }
        else if (Math.Abs(sum - target) > relativeTolerance * target)
        {
            throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                $"Cell volumes sum to {sum:R}, the box volume is {target:R} (relative error {(sum - target) / target:E3})."));
        }
        if (FaceStart is null || FaceNeighbour is null || FaceArea is null) return;
        for (int i = 0; i < Count; i++)
        {
            double scale = Math.Pow(Volume[i], 2.0 / 3.0);
            for (int f = FaceStart[i]; f < FaceStart[i + 1]; f++)
            {
                int j = FaceNeighbour[f];
                if (j < 0 || j == i) continue;
                bool found = false;
                for (int g = FaceStart[j]; g < FaceStart[j + 1]; g++)
                {
                    if (FaceNeighbour[g] != i) continue;
                    // In a ball the two cells' tangent planes differ: a shared face may differ by a strip of width δR.
                    double slack = Domain.Kind == DomainKind.Sphere ? 4 * Math.Sqrt(FaceArea[f]) * sphereTolerance * Domain.Radius : 0;
                    if (Math.Abs(FaceArea[g] - FaceArea[f]) <= 1e-6 * scale + slack) { found = true; break; }
                }
                // A face below one cell's area threshold (FaceAreaTolerance · V^(2/3), different for the two cells) may be kept
                // by one side only: a missing face counts as area 0 within the same tolerance as a shared pair.
                if (!found && FaceArea[f] > 1e-6 * Math.Max(scale, Math.Pow(Volume[j], 2.0 / 3.0)))
                    throw new InvalidOperationException($"Cell {i} has a face with {j} (area {FaceArea[f]}) that cell {j} does not list back.");
            }
        }
    }

    internal static double CompensatedSum(ReadOnlySpan<double> values)
    {
        double sum = 0, c = 0;
        foreach (double v in values)
        {
            double yy = v - c;
            double t = sum + yy;
            c = (t - sum) - yy;
            sum = t;
        }
        return sum;
    }
}
