using Tessel.Core.Geometry;
using Tessel.Output.Writers;

namespace Tessel.Tests.Report;

/// <summary>STL export of the folded model (the report's 3D download).</summary>
public class StlWriterReportTests
{
    [Fact]
    public void UnitSquareGivesTheLittleEndianBytesOfTheSpecification()
    {
        // One 1 m square at z = 0, counter-clockwise from above, at scale 1:1 -> 1000 mm sides.
        double[] pos = [0, 0, 0, 1, 0, 0, 1, 1, 0, 0, 1, 0];
        var bytes = StlWriter.ToBytes(pos, [[0, 1, 2, 3]], 1);
        // Binary STL layout (3D Systems, StereoLithography Interface Specification, 1989):
        // 80-byte header, uint32 triangle count, 50 bytes per triangle.
        Assert.Equal(84 + 2 * 50, bytes.Length);
        Assert.Equal(new byte[] { 2, 0, 0, 0 }, bytes[80..84]);
        // First normal (0, 0, 1): 1.0f is 00 00 80 3F in little-endian IEEE 754.
        Assert.Equal(new byte[] { 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0x80, 0x3F }, bytes[84..96]);
        // Second corner of the first triangle is vertex 1 = (1000, 0, 0) mm; 1000.0f is 00 00 7A 44.
        Assert.Equal(new byte[] { 0, 0, 0x7A, 0x44 }, bytes[108..112]);
        Assert.Equal(0, bytes[132]); Assert.Equal(0, bytes[133]); // attribute word
        Assert.StartsWith(StlWriter.HeaderText, System.Text.Encoding.ASCII.GetString(bytes, 0, 80));
        Assert.False(System.Text.Encoding.ASCII.GetString(bytes, 0, 5) == "solid", "binary header must not look like ASCII STL");
    }

    [Fact]
    public void FoldedMiuraReReadsAsTheSameTrianglesWithUpwardFanSplit()
    {
        var mesh = ReportDemoData.Miura(40);
        double n = ReportDemoData.Scale;
        var bytes = StlWriter.ToBytes(mesh, n);
        var (header, tris) = BinaryStlTestReader.Read(bytes);
        Assert.StartsWith(StlWriter.HeaderText, header);
        Assert.Equal(2 * mesh.FaceCount, tris.Length);
        Assert.Equal(StlWriter.TriangleCount(mesh.Faces), tris.Length);

        double k = 1000 / n;
        for (int f = 0; f < mesh.FaceCount; f++)
        {
            var face = mesh.Faces[f];
            int[][] expected = [[face[0], face[1], face[2]], [face[0], face[2], face[3]]];
            var faceNormal = mesh.FaceNormal(f);
            for (int t = 0; t < 2; t++)
            {
                var tri = tris[2 * f + t];
                var corners = new[] { tri.A, tri.B, tri.C };
                for (int c = 0; c < 3; c++)
                {
                    var p = mesh.Vertex(expected[t][c]);
                    Assert.Equal((float)(p.X * k), corners[c][0]);
                    Assert.Equal((float)(p.Y * k), corners[c][1]);
                    Assert.Equal((float)(p.Z * k), corners[c][2]);
                }
                var nrm = new Vec3(tri.Normal[0], tri.Normal[1], tri.Normal[2]);
                Assert.Equal(1.0, nrm.Length, 6);
                // Miura facets are planar parallelograms, so each half has the facet's normal.
                Assert.True(Vec3.Dot(nrm, faceNormal) > 1 - 1e-6, $"face {f} triangle {t} normal {nrm} vs {faceNormal}");
                Assert.Equal(0, tri.Attribute);
            }
        }
    }

    [Fact]
    public void SameMeshGivesIdenticalBytesAndFileMatchesThem()
    {
        var mesh = ReportDemoData.Miura(30);
        var a = StlWriter.ToBytes(mesh, 20);
        var b = StlWriter.ToBytes(ReportDemoData.Miura(30), 20);
        Assert.Equal(a, b);
        string path = Path.Combine(Path.GetTempPath(), "tessel-stl-" + Guid.NewGuid().ToString("N") + ".stl");
        try
        {
            StlWriter.WriteFile(path, mesh.Positions, mesh.Faces, 20);
            Assert.Equal(a, File.ReadAllBytes(path));
        }
        finally { File.Delete(path); }
    }

    [Fact]
    public void RejectsFacesOutsideTheVertexList()
    {
        Assert.Throws<ArgumentException>(() => StlWriter.ToBytes([0, 0, 0, 1, 0, 0, 0, 1, 0], [[0, 1, 3]], 1));
    }
}
