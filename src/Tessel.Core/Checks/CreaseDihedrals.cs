using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>Fold angles of the interior edges of a crease mesh as functions of the vertex positions, with
/// their gradients. Each fold angle is measured between the triangles (a, b, c) and (b, a, d), a -&gt; b the
/// edge, c the corner after b on the left face and d the corner after a on the right face: equal to
/// <see cref="CreaseMesh.FoldAngle"/> when panels are planar. Same sign convention: positive = mountain.</summary>
internal sealed class CreaseDihedrals
{
    /// <summary>#I edge index of each interior edge.</summary>
    public int[] Edges { get; }
    /// <summary>#I*4 vertices a, b, c, d of each interior edge.</summary>
    public int[] Wings { get; }
    public int Count => Edges.Length;

    public CreaseDihedrals(CreaseMesh mesh)
    {
        var edges = new List<int>();
        var wings = new List<int>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
            edges.Add(e);
            wings.Add(a); wings.Add(b);
            wings.Add(After(mesh.Faces[mesh.EdgeFaceLeft[e]], b));
            wings.Add(After(mesh.Faces[mesh.EdgeFaceRight[e]], a));
        }
        Edges = edges.ToArray();
        Wings = wings.ToArray();
    }

    private static int After(int[] face, int v)
    {
        int k = Array.IndexOf(face, v);
        return face[(k + 1) % face.Length];
    }

    /// <summary>Fold angle (radians, in (-pi, pi]) of interior edge number <paramref name="i"/> at positions x (#V*3).</summary>
    public double Angle(ReadOnlySpan<double> x, int i)
    {
        var (a, b, c, d) = Corners(x, i);
        var axis = (b - a).Normalized();
        var nl = Vec3.Cross(b - a, c - a).Normalized();
        var nr = Vec3.Cross(a - b, d - b).Normalized();
        return Math.Atan2(Vec3.Dot(Vec3.Cross(nl, nr), axis), Vec3.Dot(nl, nr));
    }

    /// <summary>All #I fold angles.</summary>
    public double[] Angles(ReadOnlySpan<double> x)
    {
        var r = new double[Count];
        for (int i = 0; i < Count; i++) r[i] = Angle(x, i);
        return r;
    }

    /// <summary>Gradient of fold angle <paramref name="i"/> with respect to the four corners (radians per metre).</summary>
    /// <remarks>Moving c along the left normal by delta turns the left face about a -&gt; b by delta / h_c and lowers
    /// the fold angle by as much, so d rho / d c = -n_l / h_c (h_c = distance of c from the edge line), likewise
    /// d rho / d d = -n_r / h_d; the edge ends take the rest so that translations and rotations leave rho unchanged
    /// (derived here; the standard dihedral-angle gradient).</remarks>
    public (Vec3 Ga, Vec3 Gb, Vec3 Gc, Vec3 Gd) Gradient(ReadOnlySpan<double> x, int i)
    {
        var (a, b, c, d) = Corners(x, i);
        var e = b - a;
        double e2 = e.LengthSquared;
        var crossL = Vec3.Cross(e, c - a);
        var crossR = Vec3.Cross(a - b, d - b);
        double areaL = crossL.Length, areaR = crossR.Length;
        // h = |cross| / |e|, n = cross / |cross|: n / h = cross * |e| / |cross|^2.
        var gc = -(crossL * (Math.Sqrt(e2) / (areaL * areaL)));
        var gd = -(crossR * (Math.Sqrt(e2) / (areaR * areaR)));
        double ac = Vec3.Dot(c - a, e) / e2, ad = Vec3.Dot(d - a, e) / e2;
        var ga = -((1 - ac) * gc + (1 - ad) * gd);
        var gb = -(ac * gc + ad * gd);
        return (ga, gb, gc, gd);
    }

    private (Vec3, Vec3, Vec3, Vec3) Corners(ReadOnlySpan<double> x, int i) =>
        (Vec3.Read(x, Wings[4 * i]), Vec3.Read(x, Wings[4 * i + 1]), Vec3.Read(x, Wings[4 * i + 2]), Vec3.Read(x, Wings[4 * i + 3]));
}
