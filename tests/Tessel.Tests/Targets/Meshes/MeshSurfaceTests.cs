using System.Globalization;
using System.Text;
using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Targets.Meshes;

namespace Tessel.Tests.Targets.Meshes;

public class MeshSurfaceTests
{
    /// <summary>A bumpy grid mesh over [-2, 2]^2 with n x n cells, jittered so no two queries tie.</summary>
    internal static TriangleMesh Bumpy(int n, int seed)
    {
        var rng = new Random(seed);
        var pos = new List<double>();
        for (int j = 0; j <= n; j++)
            for (int i = 0; i <= n; i++)
            {
                double x = -2 + 4.0 * i / n + (i > 0 && i < n ? 0.05 * (rng.NextDouble() - 0.5) : 0);
                double y = -2 + 4.0 * j / n + (j > 0 && j < n ? 0.05 * (rng.NextDouble() - 0.5) : 0);
                pos.AddRange([x, y, 0.3 * Math.Sin(x) * Math.Cos(1.3 * y)]);
            }
        var tris = new List<int>();
        for (int j = 0; j < n; j++)
            for (int i = 0; i < n; i++)
            {
                int a = j * (n + 1) + i, b = a + 1, c = a + n + 2, d = a + n + 1;
                tris.AddRange([a, b, c, a, c, d]);
            }
        return new TriangleMesh(pos.ToArray(), tris.ToArray());
    }

    [Fact]
    public void BvhClosestPointEqualsBruteForce()
    {
        var mesh = Bumpy(14, 1);
        var bvh = new TriangleBvh(mesh);
        var rng = new Random(7);
        for (int q = 0; q < 200; q++)
        {
            var p = new Vec3(rng.NextDouble() * 6 - 3, rng.NextDouble() * 6 - 3, rng.NextDouble() * 3 - 1.5);
            double best = double.MaxValue;
            for (int t = 0; t < mesh.TriangleCount; t++)
            {
                var a = Vec3.Read(mesh.Positions, mesh.Triangles[3 * t]);
                var b = Vec3.Read(mesh.Positions, mesh.Triangles[3 * t + 1]);
                var c = Vec3.Read(mesh.Positions, mesh.Triangles[3 * t + 2]);
                var (u, v, w) = TriangleClosestPoint.Find(p, a, b, c);
                best = Math.Min(best, (p - (u * a + v * b + w * c)).Length);
            }
            var (tri, bu, bv, bw) = bvh.Closest(p);
            var ta = Vec3.Read(mesh.Positions, mesh.Triangles[3 * tri]);
            var tb = Vec3.Read(mesh.Positions, mesh.Triangles[3 * tri + 1]);
            var tc = Vec3.Read(mesh.Positions, mesh.Triangles[3 * tri + 2]);
            Assert.Equal(best, (p - (bu * ta + bv * tb + bw * tc)).Length, 12);
        }
    }

    [Fact]
    public void TriangleClosestPointHitsEachRegion()
    {
        Vec3 a = new(0, 0, 0), b = new(1, 0, 0), c = new(0, 1, 0);
        Assert.Equal((1.0, 0.0, 0.0), TriangleClosestPoint.Find(new(-1, -1, 2), a, b, c));
        Assert.Equal((0.0, 1.0, 0.0), TriangleClosestPoint.Find(new(2, -0.5, 0), a, b, c));
        var (u, v, w) = TriangleClosestPoint.Find(new(0.25, 0.25, 3), a, b, c);
        Assert.Equal(0.5, u, 12); Assert.Equal(0.25, v, 12); Assert.Equal(0.25, w, 12);
        (u, v, w) = TriangleClosestPoint.Find(new(0.5, -2, 0), a, b, c);
        Assert.Equal(0.5, u, 12); Assert.Equal(0.5, v, 12); Assert.Equal(0, w, 12);
    }

    [Fact]
    public void HeightByRayCastMatchesTheGridSurface()
    {
        var mesh = Bumpy(20, 2);
        var s = new MeshSurface(mesh, null, "bumpy");
        // At a vertex the ray cast returns the vertex height exactly.
        int v = 10 * 21 + 7;
        Assert.Equal(mesh.Positions[3 * v + 2], s.HeightAt(mesh.Positions[3 * v], mesh.Positions[3 * v + 1]), 12);
        Assert.True(double.IsNaN(s.HeightAt(5, 5)));
        Assert.True(s.NormalAt(0.3, 0.2).Z > 0);
    }

    [Fact]
    public void DownwardFacingTrianglesAreTreatedAsUpward()
    {
        var m = new TriangleMesh([0, 0, 0, 1, 0, 0, 0, 1, 0], [0, 2, 1]); // clockwise seen from above
        var s = new MeshSurface(m, null, "flipped");
        Assert.Equal(1, s.NormalAt(0.2, 0.2).Z, 12);
    }

    [Fact]
    public void CurvatureEstimateOnASphereIsNearOneOverR()
    {
        // Sphere of radius R: k1 = k2 = 1/R (do Carmo section 3-2); the quadric-fit ESTIMATE on a mesh
        // with spacing h = 0.2, R = 5 should be within a few per cent (our own tolerance, no source).
        const double r = 5;
        int n = 30;
        var pos = new List<double>();
        var tris = new List<int>();
        for (int j = 0; j <= n; j++)
            for (int i = 0; i <= n; i++)
            {
                double x = -3 + 6.0 * i / n, y = -3 + 6.0 * j / n;
                pos.AddRange([x, y, Math.Sqrt(r * r - x * x - y * y)]);
            }
        for (int j = 0; j < n; j++)
            for (int i = 0; i < n; i++)
            {
                int a = j * (n + 1) + i;
                tris.AddRange([a, a + 1, a + n + 2, a, a + n + 2, a + n + 1]);
            }
        var s = new MeshSurface(new TriangleMesh(pos.ToArray(), tris.ToArray()), null, "sphere");
        foreach (var (x, y) in new[] { (0.0, 0.0), (1.1, -0.7), (-1.5, 1.2) })
        {
            var k = s.CurvaturesAt(x, y);
            Assert.InRange(k.K1, -1 / r * 1.03, -1 / r * 0.97);
            Assert.InRange(k.K2, -1 / r * 1.03, -1 / r * 0.97);
        }
    }

    [Fact]
    public void ObjReaderFanTriangulatesAndAcceptsNegativeIndices()
    {
        // OBJ face corners may be i, i/t, i//n or i/t/n; negative i counts back from the latest vertex
        // (Wavefront OBJ format; value from memory).
        string obj = """
            # a square as one quad, then a triangle by negative indices with texture/normal parts
            v 0 0 0
            v 1 0 0
            v 1 1 0
            v 0 1 0
            f 1 2 3 4
            v 2 0 0.5
            f -4/1/1 -1//2 -3
            """;
        var m = ObjMeshReader.Parse(obj, "t.obj");
        Assert.Equal(5, m.VertexCount);
        Assert.Equal([0, 1, 2, 0, 2, 3, 1, 4, 2], m.Triangles);
    }

    [Fact]
    public void ObjWithoutFacesIsAClearError()
    {
        var e = Assert.Throws<JobError>(() => ObjMeshReader.Parse("v 0 0 0\nv 1 0 0\nv 0 1 0\n", "empty.obj"));
        Assert.Contains("no triangles", e.Message);
        e = Assert.Throws<JobError>(() => ObjMeshReader.Parse("v 0 0 0\nf 1 2 3\n", "bad.obj"));
        Assert.Equal("bad.obj:2", e.Where);
    }

    [Fact]
    public void StlBinaryAndAsciiGiveTheSameMesh()
    {
        var mesh = Bumpy(5, 3);
        byte[] binary = Binary(mesh);
        byte[] ascii = Ascii(mesh);
        var a = StlMeshReader.Parse(binary, "b.stl");
        var b = StlMeshReader.Parse(ascii, "a.stl");
        Assert.Equal(mesh.TriangleCount, a.TriangleCount);
        Assert.Equal(mesh.VertexCount, a.VertexCount);
        Assert.Equal(a.Positions, b.Positions);
        Assert.Equal(a.Triangles, b.Triangles);
        Assert.Throws<JobError>(() => StlMeshReader.Parse(Encoding.ASCII.GetBytes("solid empty\nendsolid empty\n"), "e.stl"));
    }

    private static IEnumerable<float> Corner(TriangleMesh m, int t, int k) =>
        Enumerable.Range(0, 3).Select(a => (float)m.Positions[3 * m.Triangles[3 * t + k] + a]);

    /// <summary>Binary STL: 80-byte header, uint32 facet count, then per facet a normal, three corners
    /// (float32 x, y, z each) and a uint16 attribute (3D Systems STL format; value from memory).</summary>
    private static byte[] Binary(TriangleMesh m)
    {
        using var ms = new MemoryStream();
        using var w = new BinaryWriter(ms);
        w.Write(new byte[80]);
        w.Write((uint)m.TriangleCount);
        for (int t = 0; t < m.TriangleCount; t++)
        {
            w.Write(0f); w.Write(0f); w.Write(1f);
            for (int k = 0; k < 3; k++) foreach (float f in Corner(m, t, k)) w.Write(f);
            w.Write((ushort)0);
        }
        w.Flush();
        return ms.ToArray();
    }

    private static byte[] Ascii(TriangleMesh m)
    {
        var sb = new StringBuilder("solid test\n");
        for (int t = 0; t < m.TriangleCount; t++)
        {
            sb.Append(" facet normal 0 0 1\n  outer loop\n");
            for (int k = 0; k < 3; k++)
                sb.Append("   vertex ").Append(string.Join(' ', Corner(m, t, k).Select(f => f.ToString("R", CultureInfo.InvariantCulture)))).Append('\n');
            sb.Append("  endloop\n endfacet\n");
        }
        sb.Append("endsolid test\n");
        return Encoding.ASCII.GetBytes(sb.ToString());
    }
}
