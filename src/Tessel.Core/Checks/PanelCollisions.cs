using System.Diagnostics;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>Finds panels of a folded crease mesh that pass through each other. Panels are triangulated (fans
/// from their first corner); triangles of the same panel are never compared; triangles of panels that share a
/// vertex or a crease are compared by the corner test (they touch by construction and only count when they
/// overlap beyond the shared element); all others by Moller's triangle-triangle test after a box-tree broad phase.</summary>
public static class PanelCollisions
{
    /// <summary>Sine below which two directions at a shared corner count as the same (panels that only touch
    /// along their shared crease): far below any fold angle a model shows.</summary>
    private const double SharedCornerSine = 1e-9;

    /// <summary>Collisions at the mesh's own positions.</summary>
    public static CollisionResult Find(CreaseMesh mesh) => Find(mesh, mesh.Positions);

    /// <summary>Collisions with the mesh's topology at other positions (#V*3, metres).</summary>
    /// <param name="relativeTolerance">Distances below this times the mean edge length count as contact.</param>
    public static CollisionResult Find(CreaseMesh mesh, double[] positions, double relativeTolerance = 1e-9)
    {
        var clock = Stopwatch.StartNew();
        var tris = new List<(int A, int B, int C, int Face)>();
        for (int f = 0; f < mesh.FaceCount; f++)
        {
            var face = mesh.Faces[f];
            for (int k = 1; k + 1 < face.Length; k++) tris.Add((face[0], face[k], face[k + 1], f));
        }
        double mean = 0;
        for (int e = 0; e < mesh.EdgeCount; e++)
            mean += (Vec3.Read(positions, mesh.EdgeVertices[2 * e + 1]) - Vec3.Read(positions, mesh.EdgeVertices[2 * e])).Length;
        mean = mesh.EdgeCount > 0 ? mean / mesh.EdgeCount : 1;
        double eps = relativeTolerance * mean;
        var boxes = new double[tris.Count * 6];
        for (int t = 0; t < tris.Count; t++)
        {
            var (a, b, c, _) = tris[t];
            for (int axis = 0; axis < 3; axis++)
            {
                double pa = positions[3 * a + axis], pb = positions[3 * b + axis], pc = positions[3 * c + axis];
                boxes[6 * t + axis] = Math.Min(pa, Math.Min(pb, pc)) - eps;
                boxes[6 * t + axis + 3] = Math.Max(pa, Math.Max(pb, pc)) + eps;
            }
        }
        var found = new SortedDictionary<(int, int), CollisionKind>();
        int tested = 0;
        new TriangleBoxTree(boxes).OverlappingPairs((p, q) =>
        {
            var t1 = tris[p]; var t2 = tris[q];
            if (t1.Face == t2.Face) return;
            var key = t1.Face < t2.Face ? (t1.Face, t2.Face) : (t2.Face, t1.Face);
            if (found.ContainsKey(key)) return;
            tested++;
            var kind = Test(positions, t1, t2, eps);
            if (kind.HasValue) found[key] = kind.Value;
        });
        var pairs = found.Select(kv => new PanelCollision(kv.Key.Item1, kv.Key.Item2, kv.Value)).ToList();
        return new CollisionResult(pairs, tested, clock.Elapsed);
    }

    /// <summary>Collisions at every keyframe of a folding path of <paramref name="mesh"/>.</summary>
    public static IReadOnlyList<PathCollisionFrame> AlongPath(CreaseMesh mesh, FoldingPathResult path) =>
        path.Keyframes.Select(k => new PathCollisionFrame(k.Progress, Find(mesh, k.Positions))).ToList();

    private static CollisionKind? Test(double[] x, (int A, int B, int C, int Face) t1, (int A, int B, int C, int Face) t2, double eps)
    {
        int[] a = [t1.A, t1.B, t1.C], b = [t2.A, t2.B, t2.C];
        for (int i = 0; i < 3; i++)
        {
            int j = Array.IndexOf(b, a[i]);
            if (j < 0) continue;
            // Rotate both triangles to start at the shared corner, keeping their orientation.
            var v = Vec3.Read(x, a[i]);
            bool overlap = TriangleIntersection.CornersOverlap(v,
                Vec3.Read(x, a[(i + 1) % 3]), Vec3.Read(x, a[(i + 2) % 3]),
                Vec3.Read(x, b[(j + 1) % 3]), Vec3.Read(x, b[(j + 2) % 3]), SharedCornerSine);
            return overlap ? CollisionKind.OverlapAtSharedCorner : null;
        }
        var p0 = Vec3.Read(x, t1.A); var p1 = Vec3.Read(x, t1.B); var p2 = Vec3.Read(x, t1.C);
        var q0 = Vec3.Read(x, t2.A); var q1 = Vec3.Read(x, t2.B); var q2 = Vec3.Read(x, t2.C);
        if (Vec3.Cross(p1 - p0, p2 - p0).Length <= eps * eps || Vec3.Cross(q1 - q0, q2 - q0).Length <= eps * eps) return null;
        return TriangleIntersection.Intersect(p0, p1, p2, q0, q1, q2, eps) ? CollisionKind.Crossing : null;
    }
}
