using Placement.Tessellation;

namespace Placement.Tests.Tessellation;

public class VoronoiTessellatorTests
{
    [Fact]
    public void ReusedTessellator_GivesTheSameCellsAsAFreshOne_InTheSameMemory()
    {
        var tessellator = new VoronoiTessellator(TessellationDomain.UnitCube(true), new TessellationOptions { KeepFaces = true });
        var (x1, y1, z1) = TestPoints.Uniform(3000, 301);
        var (x2, y2, z2) = TestPoints.Uniform(3000, 302);
        var first = tessellator.Compute(x1, y1, z1);
        var volumes = first.Volume;
        var second = tessellator.Compute(x2, y2, z2);
        Assert.Same(first, second);
        Assert.Same(volumes, second.Volume);
        second.CheckValidity(x2, y2, z2, 1e-12);
        var fresh = VoronoiTessellation.Compute(x2, y2, z2, TessellationDomain.UnitCube(true), new TessellationOptions { KeepFaces = true });
        Assert.Equal(fresh.Volume, second.Volume);
        Assert.Equal(fresh.FaceCount, second.FaceCount);
        Assert.Equal(fresh.FaceNeighbour, second.FaceNeighbour);
    }
}
