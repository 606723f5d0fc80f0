using System.Text;
using Tessel.Core.Targets.Meshes;
using Tessel.Output.Writers;

namespace Tessel.Tests.Output.Writers;

public class ObjWriterTests
{
    [Fact]
    public void WritesVerticesFacesAndGroupsOneBased()
    {
        double[] pos = [0, 0, 0, 1, 0, 0, 1, 1, 0.1, 0, 1, 0];
        int[][] faces = [[0, 1, 2, 3], [0, 2, 3]];
        var text = Encoding.UTF8.GetString(ObjWriter.Write(pos, faces, [new ObjWriter.Group("panels", [1])], "hello"));
        // Wavefront OBJ: "v x y z", "f i j k ..." with 1-based indices, "g name" (value from memory).
        Assert.Equal("# hello\nv 0 0 0\nv 1 0 0\nv 1 1 0.1\nv 0 1 0\nf 1 2 3 4\ng panels\nf 1 3 4\n", text);
    }

    [Fact]
    public void RoundTripsThroughTheReader()
    {
        var rng = new Random(5);
        var pos = Enumerable.Range(0, 30).Select(_ => rng.NextDouble() * 1e3 - 500 + 1e-7 * rng.NextDouble()).ToArray();
        var mesh = new TriangleMesh(pos, [0, 1, 2, 2, 3, 4, 5, 6, 7, 7, 8, 9]);
        var back = ObjMeshReader.Parse(Encoding.UTF8.GetString(ObjWriter.Write(mesh)), "rt.obj");
        Assert.Equal(mesh.Positions, back.Positions);
        Assert.Equal(mesh.Triangles, back.Triangles);
    }

    [Fact]
    public void RejectsOutOfRangeIndices()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => ObjWriter.Write([0, 0, 0], [[0, 1, 2]]));
    }
}
