using Placement.IO;
using Placement.Points;

namespace Placement.Bodies;

/// <summary>Recovers the placed body from a point file that also holds a background medium or was moved to a centre-of-mass frame.</summary>
public static class PlacedBody
{
    /// <summary>
    /// The body's own points: every point not in the background layer (<see cref="PointLayers.Background"/>), moved so
    /// the body's centre (the scalars <see cref="BodyNames.BodyCentreX"/> … written by <see cref="BodyAssembly"/>, the
    /// origin when absent) is at the origin again. Positions, masses, target densities and layers are copied.
    /// </summary>
    /// <param name="table">A point table, e.g. read from a file.</param>
    /// <returns>A new point set in the table's units with the table's provenance.</returns>
    public static PointSet Of(PointTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var all = table.Points;
        double cx = Centre(table, BodyNames.BodyCentreX), cy = Centre(table, BodyNames.BodyCentreY), cz = Centre(table, BodyNames.BodyCentreZ);
        int n = 0;
        for (int i = 0; i < all.Count; i++) if (all.Layer[i] != PointLayers.Background) n++;
        var body = new PointSet(n, all.Units) { Provenance = all.Provenance };
        for (int i = 0, k = 0; i < all.Count; i++)
        {
            if (all.Layer[i] == PointLayers.Background) continue;
            body.X[k] = all.X[i] - cx; body.Y[k] = all.Y[i] - cy; body.Z[k] = all.Z[i] - cz;
            body.Mass[k] = all.Mass[i]; body.TargetDensity[k] = all.TargetDensity[i]; body.Layer[k] = all.Layer[i];
            k++;
        }
        return body;
    }

    /// <summary>Whether <see cref="Of"/> would change anything: a background layer or a moved centre.</summary>
    /// <param name="table">A point table.</param>
    public static bool IsEmbedded(PointTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        if (Centre(table, BodyNames.BodyCentreX) != 0 || Centre(table, BodyNames.BodyCentreY) != 0 || Centre(table, BodyNames.BodyCentreZ) != 0) return true;
        foreach (int layer in table.Points.Layer) if (layer == PointLayers.Background) return true;
        return false;
    }

    private static double Centre(PointTable table, string name)
    {
        foreach (var scalar in table.BodyScalars)
            if (scalar.Name == name && double.IsFinite(scalar.Value)) return scalar.Value;
        return 0;
    }
}
