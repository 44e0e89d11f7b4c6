using Placement.Bodies.Background;
using Placement.IO;
using Placement.Points;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>
/// Turns a placed body into the system a simulation starts from: companions on two-body orbits, an optional background
/// medium around the body, and everything (gas, background, cores, companions) moved into the centre-of-mass frame.
/// </summary>
/// <remarks>
/// <para>Order: (1) companions are placed about the body's centre on their orbits (<see cref="CompanionOrbit"/>), the
/// primary's mass being the gas plus the point masses already in the table (e.g. a core); (2) the background box is
/// centred on the centre of mass of body plus point masses and filled around the body (<see cref="BackgroundMedium"/>),
/// at rest; (3) one centre-of-mass shift of every gas point, background point and point mass
/// (<see cref="CentreOfMassFrame.Shift"/>) makes Σ m x and Σ m v vanish; the box moves with it.</para>
/// <para>The output table is new (the input's arrays are not changed): body points first, then background points.
/// Columns: <c>velocity</c> (background at rest; created when companions need the gas to move), <c>cell_volume</c>
/// (joint tessellation), <c>pressure</c> (added when there is a background and the profile carries pressure: the
/// profile's pressure for body points, the background pressure for the medium), <c>internal_energy</c> (when
/// <see cref="BodyAssemblyRequest.BackgroundInternalEnergy"/> is given); any other column needs
/// <see cref="BodyAssemblyRequest.BackgroundColumn"/>. With neither companions nor background nothing is shifted.</para>
/// </remarks>
public static class BodyAssembly
{
    /// <summary>Name of the per-point pressure column written with a background (mass/(length·time²)).</summary>
    public const string PressureColumn = "pressure";

    /// <summary>Pressure, M L^-1 T^-2.</summary>
    private static readonly QuantityDimension Pressure = new(-1, 1, -2);

    /// <summary>Assembles the system.</summary>
    /// <param name="body">The placed body (points centred on the origin, columns, point masses such as a core).</param>
    /// <param name="profile">The body's profile (radius, pressure).</param>
    /// <param name="request">Companions, background and settings.</param>
    /// <returns>The new table and a summary of what was added.</returns>
    /// <exception cref="ArgumentException">A companion or background setting is out of range, two point masses share a
    /// name, or an extra column has no value for background points.</exception>
    public static (PointTable Table, BodyAssemblySummary Summary) Assemble(PointTable body, IRadialProfile profile, BodyAssemblyRequest request)
    {
        ArgumentNullException.ThrowIfNull(body);
        ArgumentNullException.ThrowIfNull(profile);
        ArgumentNullException.ThrowIfNull(request);
        var gas = body.Points;
        var units = gas.Units;
        var masses = new List<PointMass>(body.PointMasses);
        double primary = gas.TotalMass();
        foreach (var p in masses) primary += p.Mass;
        foreach (var companion in request.Companions)
        {
            PointMass placed;
            try
            {
                placed = companion.Place(primary, units);
            }
            catch (Exception e) when (e is ArgumentOutOfRangeException or InvalidOperationException)
            {
                throw new ArgumentException($"Companion '{companion.Name}': {e.Message}", nameof(request), e);
            }
            if (masses.Exists(m => m.Name == placed.Name))
                throw new ArgumentException($"Two point masses are named '{placed.Name}'; give each companion its own name.", nameof(request));
            masses.Add(placed);
        }
        bool moving = request.Companions.Count > 0 || body.Find(PointColumnNames.Velocity) is not null;
        var velocity = body.Find(PointColumnNames.Velocity);
        int nb = gas.Count;
        double[]? bvx = null, bvy = null, bvz = null;
        if (moving)
        {
            bvx = velocity is null ? new double[nb] : (double[])velocity.Components[0].Clone();
            bvy = velocity is null ? new double[nb] : (double[])velocity.Components[1].Clone();
            bvz = velocity is null ? new double[nb] : (double[])velocity.Components[2].Clone();
        }
        var bound = CentreOfMassFrame.Measure(gas, bvx, bvy, bvz, masses, request.Parallel);
        var pre = (X: 0.0, Y: 0.0, Z: 0.0);
        if (moving && request.Background is not null)
        {
            pre = (bound.Vx, bound.Vy, bound.Vz);
            // The background is at rest in the frame where body plus point masses have no momentum: go there first.
            for (int i = 0; i < nb; i++) { bvx![i] -= bound.Vx; bvy![i] -= bound.Vy; bvz![i] -= bound.Vz; }
            for (int k = 0; k < masses.Count; k++)
                masses[k] = masses[k] with { Vx = masses[k].Vx - bound.Vx, Vy = masses[k].Vy - bound.Vy, Vz = masses[k].Vz - bound.Vz };
        }

        BackgroundPoints? bg = request.Background is null ? null
            : BackgroundMedium.Place(request.Background, gas, profile, (bound.X, bound.Y, bound.Z), request.Seed, request.MeshGenerators, request.Parallel);
        int ng = bg?.Points.Count ?? 0, n = nb + ng;

        var all = new PointSet(n, units) { Provenance = gas.Provenance };
        Join(gas.X, bg?.Points.X, all.X);
        Join(gas.Y, bg?.Points.Y, all.Y);
        Join(gas.Z, bg?.Points.Z, all.Z);
        Join(bg?.BodyCellMass ?? gas.Mass, bg?.Points.Mass, all.Mass);
        Join(gas.TargetDensity, bg?.Points.TargetDensity, all.TargetDensity);
        gas.Layer.CopyTo(all.Layer, 0);
        if (bg is not null) bg.Points.Layer.CopyTo(all.Layer, nb);

        var table = new PointTable(all);
        // Body-level values (γ, energies, resolution) describe the body and travel with it unchanged.
        table.BodyScalars.AddRange(body.BodyScalars);
        foreach (var (name, label) in body.BodyLabels) table.BodyLabels[name] = label;
        if (body.Ids is { } ids)
        {
            var extended = new long[n];
            ids.CopyTo(extended, 0);
            long next = ids.Length == 0 ? 0 : ids.Max() + 1;
            for (int i = nb; i < n; i++) extended[i] = next++;
            table.Ids = extended;
        }
        double[]? vx = null, vy = null, vz = null;
        foreach (var column in body.Columns)
        {
            if (column.Name == PointColumnNames.Velocity && column.ComponentCount == 3)
            {
                (vx, vy, vz) = (Extend(bvx!, null, n), Extend(bvy!, null, n), Extend(bvz!, null, n));
                table.Add(new PointColumn(column.Name, [vx, vy, vz], column.Unit, column.CgsFactor, column.Description));
                continue;
            }
            var components = new double[column.ComponentCount][];
            for (int c = 0; c < column.ComponentCount; c++)
                components[c] = bg is null ? (double[])column.Components[c].Clone() : Extend(column.Components[c], BackgroundValues(column, bg, request, c), n);
            if (column.Name == PointColumnNames.CellVolume && bg is not null && request.MeshGenerators)
                components[0] = Extend(bg.BodyCellVolume, bg.CellVolume, n);
            table.Add(new PointColumn(column.Name, components, column.Unit, column.CgsFactor, column.Description));
        }
        if (moving && vx is null)
        {
            (vx, vy, vz) = (Extend(bvx!, null, n), Extend(bvy!, null, n), Extend(bvz!, null, n));
            table.Add(PointColumn.Vector(PointColumnNames.Velocity, vx, vy, vz, QuantityDimension.Velocity, units,
                "velocity in the centre-of-mass frame of body, companions and background"));
        }
        if (bg is not null)
        {
            if (request.MeshGenerators && table.Find(PointColumnNames.CellVolume) is null)
                table.Add(PointColumnNames.CellVolume, Extend(bg.BodyCellVolume, bg.CellVolume, n), QuantityDimension.Volume,
                    "Voronoi cell volume (body and background tessellated together in the box)");
            if (table.Find(PressureColumn) is null && ScaleHeights.PressureQuantity(profile) is { } pressureName)
            {
                var pressure = new double[n];
                for (int i = 0; i < nb; i++)
                    pressure[i] = profile.TryQuantity(pressureName, gas.Radius(i), out double value) && double.IsFinite(value) ? value : 0;
                Array.Fill(pressure, request.Background!.Pressure, nb, ng);
                table.Add(new PointColumn(PressureColumn, [pressure], Pressure.UnitName(units), Pressure.CgsFactor(units),
                    "pressure: the profile's at body points, the background's at background points"));
            }
        }

        var shift = new CentreOfMass(bound.Mass, 0, 0, 0, 0, 0, 0);
        if (request.Companions.Count > 0 || bg is not null)
        {
            shift = CentreOfMassFrame.Shift(all, vx, vy, vz, masses, request.Parallel);
            shift = shift with { Vx = shift.Vx + pre.X, Vy = shift.Vy + pre.Y, Vz = shift.Vz + pre.Z };
        }
        var after = CentreOfMassFrame.Measure(all, vx, vy, vz, masses, request.Parallel);
        // Where the profile's origin went, so a reader (e.g. `check`) can measure the body about its own centre again.
        table.BodyScalars.RemoveAll(s => s.Name is BodyNames.BodyCentreX or BodyNames.BodyCentreY or BodyNames.BodyCentreZ);
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.BodyCentreX, -shift.X, QuantityDimension.LengthDimension, units, "x of the body's centre (the profile's origin) in this frame"));
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.BodyCentreY, -shift.Y, QuantityDimension.LengthDimension, units, "y of the body's centre (the profile's origin) in this frame"));
        table.BodyScalars.Add(BodyScalar.Of(BodyNames.BodyCentreZ, -shift.Z, QuantityDimension.LengthDimension, units, "z of the body's centre (the profile's origin) in this frame"));
        table.PointMasses.AddRange(masses);

        BackgroundSummary? summary = null;
        if (bg is not null)
        {
            var d = bg.Domain;
            var box = new BackgroundBox(d.MinX - shift.X, d.MinY - shift.Y, d.MinZ - shift.Z, d.MaxX - shift.X, d.MaxY - shift.Y, d.MaxZ - shift.Z,
                request.Background!.Periodic, request.Background.Density, request.Background.Pressure);
            table.Background = box;
            double bodyVolume = 0;
            foreach (double v in bg.BodyCellVolume) bodyVolume += v;
            double r = bg.BodyRadius;
            summary = new BackgroundSummary(ng, PointLayers.Background, box, bg.Points.TotalMass(), bg.ExpectedMass, bg.SurfaceSpacing,
                bg.InnerRadius, bg.OuterSpacing, bg.ShellCount, bodyVolume / (4.0 / 3.0 * Math.PI * r * r * r));
        }
        return (table, new BodyAssemblySummary(masses, shift, after.Offset, after.Momentum / after.Mass, summary));
    }

    private static double[]? BackgroundValues(PointColumn column, BackgroundPoints bg, BodyAssemblyRequest request, int component)
    {
        if (column.Name == PointColumnNames.CellVolume && column.ComponentCount == 1) return bg.CellVolume;
        if (column.Name == PressureColumn && column.ComponentCount == 1)
        {
            var values = new double[bg.Points.Count];
            Array.Fill(values, bg.Settings.Pressure);
            return values;
        }
        if (column.Name == PointColumnNames.InternalEnergy && column.ComponentCount == 1 && double.IsFinite(request.BackgroundInternalEnergy))
        {
            var values = new double[bg.Points.Count];
            Array.Fill(values, request.BackgroundInternalEnergy);
            return values;
        }
        var given = request.BackgroundColumn?.Invoke(column, bg);
        if (given is null)
            throw new ArgumentException($"Column '{column.Name}' has no value for the background points; give one through BodyAssemblyRequest.BackgroundColumn.", nameof(request));
        if (given.Count != column.ComponentCount || given[component].Length != bg.Points.Count)
            throw new ArgumentException($"Background values for column '{column.Name}' must have {column.ComponentCount} components of {bg.Points.Count} values.", nameof(request));
        return given[component];
    }

    private static void Join(double[] first, double[]? second, double[] target)
    {
        first.CopyTo(target, 0);
        second?.CopyTo(target, first.Length);
    }

    /// <summary>A copy of <paramref name="first"/> followed by <paramref name="second"/> (zeros when null), of length <paramref name="n"/>.</summary>
    private static double[] Extend(double[] first, double[]? second, int n)
    {
        var result = new double[n];
        Join(first, second, result);
        return result;
    }
}
