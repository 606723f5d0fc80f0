using Tessel.Core.Model;

namespace Tessel.Core.Tessellation;

/// <summary>Discrete Gaussian curvature of a polyhedral surface: the angle defect 2 pi - (sum of face
/// corners) at an interior vertex, pi - (sum) at a boundary vertex. By the discrete Gauss-Bonnet
/// theorem the interior plus boundary defects of a triangulated disk sum to exactly 2 pi (derived in
/// docs/reference/geometry.md section 6); a developable crease pattern has zero defect at every interior vertex.</summary>
public static class AngleDefects
{
    /// <summary>#V defects in radians, interior vertices against 2 pi, boundary ones against pi;
    /// vertices on no face get NaN. Faces are treated corner by corner (planar or not).</summary>
    public static double[] PerVertex(CreaseMesh mesh)
    {
        var sum = new double[mesh.VertexCount];
        var used = new bool[mesh.VertexCount];
        foreach (var f in mesh.Faces)
            for (int k = 0; k < f.Length; k++)
            {
                var c = mesh.Vertex(f[k]);
                var a = mesh.Vertex(f[(k + 1) % f.Length]) - c;
                var b = mesh.Vertex(f[(k + f.Length - 1) % f.Length]) - c;
                sum[f[k]] += Geometry.Vec3.Angle(a, b);
                used[f[k]] = true;
            }
        var boundary = mesh.BoundaryVertices();
        var d = new double[mesh.VertexCount];
        for (int v = 0; v < d.Length; v++)
            d[v] = !used[v] ? double.NaN : (boundary[v] ? Math.PI : 2 * Math.PI) - sum[v];
        return d;
    }

    /// <summary>Sum of the defects at interior vertices, radians: the discrete integral of K over the
    /// surface away from its boundary.</summary>
    public static double InteriorTotal(CreaseMesh mesh)
    {
        var d = PerVertex(mesh);
        var boundary = mesh.BoundaryVertices();
        double total = 0;
        for (int v = 0; v < d.Length; v++) if (!boundary[v] && double.IsFinite(d[v])) total += d[v];
        return total;
    }

    /// <summary>Largest |defect| over interior vertices, radians.</summary>
    public static double MaxInterior(CreaseMesh mesh)
    {
        var d = PerVertex(mesh);
        var boundary = mesh.BoundaryVertices();
        double m = 0;
        for (int v = 0; v < d.Length; v++) if (!boundary[v] && double.IsFinite(d[v])) m = Math.Max(m, Math.Abs(d[v]));
        return m;
    }

    /// <summary>Defects at the interior vertices only, in vertex order, radians.</summary>
    public static double[] Interior(CreaseMesh mesh)
    {
        var d = PerVertex(mesh);
        var boundary = mesh.BoundaryVertices();
        var list = new List<double>();
        for (int v = 0; v < d.Length; v++) if (!boundary[v] && double.IsFinite(d[v])) list.Add(d[v]);
        return list.ToArray();
    }
}
