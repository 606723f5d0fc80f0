using System.Text;
using Tessel.Core.Targets.Meshes;
using Tessel.Core.Tessellation.Miura;
using Tessel.Output.Writers;

namespace Tessel.Tests.Report;

public class StlMatchesObjTests
{
    [Fact]
    public void StlTrianglesAreTheObjFacesSplitTheSameWay()
    {
        // A folded regular Miura sheet (Schenk & Guest, PNAS 2013 cell) at 1:50.
        var mesh = RegularMiuraSheet.Build(new MiuraCell(1.2, 0.9, 55 * Math.PI / 180, 35 * Math.PI / 180), 3, 2);
        const double scale = 50;
        var obj = ObjMeshReader.Parse(Encoding.UTF8.GetString(ObjWriter.Write(mesh.Positions, mesh.Faces)), "folded.obj");
        var (_, stl) = BinaryStlTestReader.Read(StlWriter.ToBytes(mesh, scale));

        Assert.Equal(obj.TriangleCount, stl.Length);
        Assert.Equal(2 * mesh.FaceCount, stl.Length);
        for (int t = 0; t < stl.Length; t++)
        {
            float[][] corners = [stl[t].A, stl[t].B, stl[t].C];
            for (int c = 0; c < 3; c++)
            {
                int v = obj.Triangles[3 * t + c];
                for (int axis = 0; axis < 3; axis++)
                {
                    // STL is in millimetres at model scale, OBJ in metres at full scale; float precision.
                    double expected = obj.Positions[3 * v + axis] * 1000 / scale;
                    Assert.True(Math.Abs(corners[c][axis] - expected) <= 1e-5 * Math.Max(1, Math.Abs(expected)),
                        $"triangle {t} corner {c} axis {axis}: STL {corners[c][axis]}, OBJ {expected}");
                }
            }
        }
    }
}
