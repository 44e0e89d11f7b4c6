using Placement.Parallelism;
using Placement.Profiles;
using Placement.Tessellation;

namespace Placement.Relaxation;

/// <summary>
/// The derivatives of Voronoi cell volumes with respect to the generators, the faces' centroids and the
/// density-weighted cell centroids, rebuilt from a tessellation's face lists; buffers are reused across calls.
/// </summary>
/// <remarks>
/// <para>Volume derivative (exact, first order): moving generator j by δ moves the bisector face between cells i and j
/// by s(p) = (x_j − p)·δ / d_ij along its normal at each face point p, so
/// ∂V_i/∂x_j = A_ij (x_j − c_ij) / d_ij for a neighbour j and ∂V_i/∂x_i = Σ_j A_ij (c_ij − x_i) / d_ij, where A_ij and
/// c_ij are the shared face's area and centroid and d_ij = |x_j − x_i| (derived by differentiating the bisector plane
/// 2p·(x_j − x_i) = |x_j|² − |x_i|²; checked against finite differences of the tessellation in the tests). Faces on the
/// domain boundary do not depend on the generators.</para>
/// <para>Geometry: the tessellation keeps each cell's neighbour list and face areas, not its vertices. Each face
/// polygon is therefore rebuilt in its bisector plane by clipping a square with the half-planes of the cell's other
/// neighbours (2-D Sutherland–Hodgman clipping) and, for a ball domain, with tangent planes of the ball at the polygon's
/// outermost vertex until it lies within R(1 + δ) (for a box, with its walls); its area agrees with the tessellation's to rounding for cells not cut
/// by the domain.</para>
/// <para>Weighted centroid (for Lloyd iterations with a weight w(r)): ∫ w x dV / ∫ w dV over the tetrahedra from the
/// generator to a fan of each face, with w interpolated linearly between its values at the tetrahedron's vertices, for
/// which ∫ w x dV = (V/20)(Σ_k w_k x_k + Σ_k w_k Σ_k x_k) exactly. For a cell cut by the domain the part between the
/// generator faces and the boundary (volume and first moment from the tessellation minus the tetrahedra) is weighted
/// by w at its own centroid.</para>
/// <para>Layout: per face (indexed like <see cref="VoronoiCells.FaceNeighbour"/>): centroid and neighbour derivative,
/// 48 bytes, and the index of the same face in the neighbour's list (4 bytes); per cell: self derivative and weighted
/// centroid, 48 bytes. Cells are processed in fixed chunks, each writing only its own entries, so the results are
/// identical for any thread count.</para>
/// </remarks>
public sealed class VoronoiCellGradients
{
    private double[] _faceCx = [], _faceCy = [], _faceCz = [], _faceArea = [];
    private double[] _nbGx = [], _nbGy = [], _nbGz = [];
    private int[] _reverse = [];
    private double[] _selfGx = [], _selfGy = [], _selfGz = [];
    private double[] _wcx = [], _wcy = [], _wcz = [];
    private int[] _faceStart = [], _faceNeighbour = [];

    /// <summary>Number of cells of the last update.</summary>
    public int Count { get; private set; }

    /// <summary>Start of each cell's faces (the tessellation's <see cref="VoronoiCells.FaceStart"/>).</summary>
    public ReadOnlySpan<int> FaceStart => _faceStart;

    /// <summary>Neighbour of each face (a point index, or a negative <see cref="CellFaceCodes"/> code).</summary>
    public ReadOnlySpan<int> FaceNeighbour => _faceNeighbour;

    /// <summary>Face centroid x, length units (NaN for faces on the domain boundary).</summary>
    public ReadOnlySpan<double> FaceCentroidX => _faceCx.AsSpan(0, _faceNeighbour.Length);

    /// <summary>Face centroid y, length units.</summary>
    public ReadOnlySpan<double> FaceCentroidY => _faceCy.AsSpan(0, _faceNeighbour.Length);

    /// <summary>Face centroid z, length units.</summary>
    public ReadOnlySpan<double> FaceCentroidZ => _faceCz.AsSpan(0, _faceNeighbour.Length);

    /// <summary>Area of each rebuilt face polygon, length² (0 for faces on the domain boundary).</summary>
    public ReadOnlySpan<double> FaceArea => _faceArea.AsSpan(0, _faceNeighbour.Length);

    /// <summary>∂V_i/∂x_j (x component, length²) for face f of cell i shared with generator j = FaceNeighbour[f]; 0 on boundary faces.</summary>
    public ReadOnlySpan<double> NeighbourGradientX => _nbGx.AsSpan(0, _faceNeighbour.Length);

    /// <summary>∂V_i/∂x_j, y component.</summary>
    public ReadOnlySpan<double> NeighbourGradientY => _nbGy.AsSpan(0, _faceNeighbour.Length);

    /// <summary>∂V_i/∂x_j, z component.</summary>
    public ReadOnlySpan<double> NeighbourGradientZ => _nbGz.AsSpan(0, _faceNeighbour.Length);

    /// <summary>Index of the same face in the neighbour's list (−1 for boundary faces or when the neighbour does not list it back).</summary>
    public ReadOnlySpan<int> ReverseFace => _reverse.AsSpan(0, _faceNeighbour.Length);

    /// <summary>∂V_i/∂x_i, x component (length²).</summary>
    public ReadOnlySpan<double> SelfGradientX => _selfGx.AsSpan(0, Count);

    /// <summary>∂V_i/∂x_i, y component.</summary>
    public ReadOnlySpan<double> SelfGradientY => _selfGy.AsSpan(0, Count);

    /// <summary>∂V_i/∂x_i, z component.</summary>
    public ReadOnlySpan<double> SelfGradientZ => _selfGz.AsSpan(0, Count);

    /// <summary>Weighted centroid x of each cell (length units), or the plain centroid when no weight was given.</summary>
    public ReadOnlySpan<double> WeightedCentroidX => _wcx.AsSpan(0, Count);

    /// <summary>Weighted centroid y.</summary>
    public ReadOnlySpan<double> WeightedCentroidY => _wcy.AsSpan(0, Count);

    /// <summary>Weighted centroid z.</summary>
    public ReadOnlySpan<double> WeightedCentroidZ => _wcz.AsSpan(0, Count);

    /// <summary>Rebuilds the faces of <paramref name="cells"/> and computes the derivatives and weighted centroids.</summary>
    /// <param name="x">Generator x (the points that were tessellated), length units.</param>
    /// <param name="y">Generator y.</param>
    /// <param name="z">Generator z.</param>
    /// <param name="cells">Their tessellation, computed with <see cref="TessellationOptions.KeepFaces"/>, in a box or a ball domain.</param>
    /// <param name="weight">Profile whose density gives the Lloyd weight w = ρ(|x|)^<paramref name="weightExponent"/>; null for plain centroids.</param>
    /// <param name="weightExponent">Exponent of the weight (5/3 makes the generator density follow ρ in 3-D; Du, Faber &amp; Gunzburger 1999).</param>
    /// <param name="parallel">Parallelism; results are identical for any setting.</param>
    /// <exception cref="ArgumentException">The cells kept no faces, the domain is periodic, or the coordinate arrays do not match the cells.</exception>
    public void Update(double[] x, double[] y, double[] z, VoronoiCells cells, IRadialProfile? weight = null, double weightExponent = 5.0 / 3.0,
        ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(z);
        ArgumentNullException.ThrowIfNull(cells);
        if (cells.FaceStart is null || cells.FaceNeighbour is null || cells.FaceArea is null)
            throw new ArgumentException("The tessellation must be computed with TessellationOptions.KeepFaces.", nameof(cells));
        if (cells.Domain.Kind == DomainKind.PeriodicBox)
            throw new ArgumentException("Periodic domains are not supported (a face may be shared with the cell's own image).", nameof(cells));
        int n = cells.Count;
        if (x.Length != n || y.Length != n || z.Length != n)
            throw new ArgumentException($"Expected {n} generators, got {x.Length}, {y.Length}, {z.Length}.", nameof(x));
        Count = n;
        _faceStart = cells.FaceStart;
        _faceNeighbour = cells.FaceNeighbour;
        int faces = _faceNeighbour.Length;
        Ensure(ref _faceCx, faces); Ensure(ref _faceCy, faces); Ensure(ref _faceCz, faces); Ensure(ref _faceArea, faces);
        Ensure(ref _nbGx, faces); Ensure(ref _nbGy, faces); Ensure(ref _nbGz, faces);
        if (_reverse.Length < faces) _reverse = new int[faces];
        Ensure(ref _selfGx, n); Ensure(ref _selfGy, n); Ensure(ref _selfGz, n);
        Ensure(ref _wcx, n); Ensure(ref _wcy, n); Ensure(ref _wcz, n);
        ParallelLoop.For(n, parallel, (s, e) =>
        {
            var polygon = new FacePolygon();
            for (int i = s; i < e; i++) Cell(i, x, y, z, cells, polygon, weight, weightExponent);
        });
    }

    private static void Ensure(ref double[] a, int length)
    {
        if (a.Length < length) a = new double[Math.Max(length, a.Length + a.Length / 2)];
    }

    private void Cell(int i, double[] x, double[] y, double[] z, VoronoiCells cells, FacePolygon polygon, IRadialProfile? weight, double exponent)
    {
        var start = _faceStart; var nb = _faceNeighbour;
        double gx = x[i], gy = y[i], gz = z[i];
        int s = start[i], e = start[i + 1];
        var domain = cells.Domain;
        bool ball = domain.Kind == DomainKind.Sphere;
        double bcx = domain.CenterX - gx, bcy = domain.CenterY - gy, bcz = domain.CenterZ - gz; // ball centre relative to the generator
        double reach = ball ? domain.Radius + Math.Sqrt(bcx * bcx + bcy * bcy + bcz * bcz)
            : Math.Sqrt(Math.Max(Sq(domain.MinX - gx), Sq(domain.MaxX - gx)) + Math.Max(Sq(domain.MinY - gy), Sq(domain.MaxY - gy)) + Math.Max(Sq(domain.MinZ - gz), Sq(domain.MaxZ - gz)));
        double far = 0;
        for (int f = s; f < e; f++)
        {
            int j = nb[f];
            if (j >= 0) far = Math.Max(far, Sq(x[j] - gx) + Sq(y[j] - gy) + Sq(z[j] - gz));
        }
        far = Math.Sqrt(far);
        double w0 = weight is null ? 1 : Weight(weight, Math.Sqrt(gx * gx + gy * gy + gz * gz), exponent);
        double sgx = 0, sgy = 0, sgz = 0, volume = 0, mx = 0, my = 0, mz = 0, wMass = 0, wmx = 0, wmy = 0, wmz = 0;
        bool weighted = weight is not null && double.IsFinite(w0);
        for (int f = s; f < e; f++)
        {
            int j = nb[f];
            _reverse[f] = -1;
            if (j < 0)
            {
                _faceCx[f] = _faceCy[f] = _faceCz[f] = double.NaN;
                _faceArea[f] = 0; _nbGx[f] = _nbGy[f] = _nbGz[f] = 0;
                continue;
            }
            for (int g = start[j]; g < start[j + 1]; g++) if (nb[g] == i) { _reverse[f] = g; break; }
            double px = x[j] - gx, py = y[j] - gy, pz = z[j] - gz;
            // First with a square a few neighbour distances wide; if a vertex stays on it the face is larger: redo with the domain's reach.
            polygon.Start(px, py, pz, 4 * far);
            ClipByNeighbours(polygon, f, s, e, x, y, z, gx, gy, gz, nb);
            if (polygon.TouchesStartSquare())
            {
                polygon.Start(px, py, pz, 2 * reach + far);
                ClipByNeighbours(polygon, f, s, e, x, y, z, gx, gy, gz, nb);
            }
            if (ball) polygon.ClipToBall(bcx, bcy, bcz, domain.Radius, BallTolerance(cells));
            else ClipToBox(polygon, domain, gx, gy, gz);
            polygon.Measure(out double area, out double cx, out double cy, out double cz);
            double d = Math.Sqrt(px * px + py * py + pz * pz);
            _faceArea[f] = area;
            _faceCx[f] = gx + cx; _faceCy[f] = gy + cy; _faceCz[f] = gz + cz;
            double k = area / d;
            _nbGx[f] = k * (px - cx); _nbGy[f] = k * (py - cy); _nbGz[f] = k * (pz - cz);
            sgx += k * cx; sgy += k * cy; sgz += k * cz;
            // Pyramid from the generator over the face: volume A d/6 (height d/2), centroid ¾ c.
            double vf = area * d / 6;
            volume += vf; mx += 0.75 * vf * cx; my += 0.75 * vf * cy; mz += 0.75 * vf * cz;
            if (weighted) polygon.WeightedMoments(weight!, gx, gy, gz, exponent, w0, ref wMass, ref wmx, ref wmy, ref wmz);
        }
        _selfGx[i] = sgx; _selfGy[i] = sgy; _selfGz[i] = sgz;
        if (!weighted || !(wMass > 0) || !double.IsFinite(wmx + wmy + wmz))
        {
            _wcx[i] = cells.CentroidX[i]; _wcy[i] = cells.CentroidY[i]; _wcz[i] = cells.CentroidZ[i];
            return;
        }
        // The part of a cut cell between its generator faces and the domain boundary: what the tessellation measured minus the tetrahedra.
        double rest = cells.Volume[i] - volume;
        if (rest > 1e-12 * cells.Volume[i])
        {
            double V = cells.Volume[i];
            double rmx = V * (cells.CentroidX[i] - gx) - mx, rmy = V * (cells.CentroidY[i] - gy) - my, rmz = V * (cells.CentroidZ[i] - gz) - mz;
            double wr = Weight(weight!, Math.Sqrt(Sq(gx + rmx / rest) + Sq(gy + rmy / rest) + Sq(gz + rmz / rest)), exponent);
            if (double.IsFinite(wr)) { wMass += wr * rest; wmx += wr * rmx; wmy += wr * rmy; wmz += wr * rmz; }
        }
        _wcx[i] = gx + wmx / wMass; _wcy[i] = gy + wmy / wMass; _wcz[i] = gz + wmz / wMass;
    }

    private static double BallTolerance(VoronoiCells cells) =>
        // The tessellation's default δ, raised for few points as it does (see TessellationOptions.SphereTolerance).
        Math.Max(TessellationOptions.Default.SphereTolerance, 1.4e-3 * Math.Pow(Math.Max(cells.Count, 1), -2.0 / 3.0));

    private static void ClipByNeighbours(FacePolygon polygon, int face, int s, int e, double[] x, double[] y, double[] z,
        double gx, double gy, double gz, int[] nb)
    {
        for (int g = s; g < e && polygon.Count > 0; g++)
        {
            int k = nb[g];
            if (k < 0 || g == face) continue;
            double qx = x[k] - gx, qy = y[k] - gy, qz = z[k] - gz;
            polygon.Clip(qx, qy, qz, 0.5 * (qx * qx + qy * qy + qz * qz));
        }
    }

    private static void ClipToBox(FacePolygon polygon, TessellationDomain d, double gx, double gy, double gz)
    {
        polygon.Clip(1, 0, 0, d.MaxX - gx); polygon.Clip(-1, 0, 0, gx - d.MinX);
        polygon.Clip(0, 1, 0, d.MaxY - gy); polygon.Clip(0, -1, 0, gy - d.MinY);
        polygon.Clip(0, 0, 1, d.MaxZ - gz); polygon.Clip(0, 0, -1, gz - d.MinZ);
    }

    internal static double Weight(IRadialProfile profile, double r, double exponent)
    {
        double rho = profile.Density(r);
        return rho > 0 ? Math.Pow(rho, exponent) : 0;
    }

    private static double Sq(double v) => v * v;
}
