using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Checks;

/// <summary>Compares the flat layout with the folded mesh edge by edge.</summary>
public static class FlatLayoutStrain
{
    /// <summary>Default material limit 0.08 % (0.0008): well under the 0.3-0.5 % where card takes a
    /// permanent set (docs/reference/geometry.md section 7, values from memory).</summary>
    public const double DefaultStrainLimit = 0.0008;

    /// <summary>Measures the strain of every facet of <paramref name="flat"/> against its folded mesh.</summary>
    public static FlatStrainResult Measure(FlatPattern flat, double strainLimit = DefaultStrainLimit)
    {
        var mesh = flat.Folded;
        var facetMax = new double[mesh.FaceCount];
        double max = 0; int worst = mesh.FaceCount > 0 ? 0 : -1;
        var over = new List<int>();
        for (int f = 0; f < mesh.FaceCount; f++)
        {
            var face = mesh.Faces[f];
            double m = 0;
            for (int k = 0; k < face.Length; k++)
                m = Math.Max(m, Math.Abs(Strain(flat, mesh, face[k], face[(k + 1) % face.Length])));
            // A quad can shear in the flat layout with unchanged sides: its diagonals catch that.
            if (face.Length == 4)
            {
                m = Math.Max(m, Math.Abs(Strain(flat, mesh, face[0], face[2])));
                m = Math.Max(m, Math.Abs(Strain(flat, mesh, face[1], face[3])));
            }
            facetMax[f] = m;
            if (m > max) { max = m; worst = f; }
            if (m > strainLimit) over.Add(f);
        }
        var vertexStrain = VertexAngleStrain(mesh);
        return new FlatStrainResult(facetMax, max, worst, strainLimit, over.ToArray(), vertexStrain,
            vertexStrain.Length == 0 ? 0 : vertexStrain.Max());
    }

    /// <summary>#V |2 pi - sum of sector angles| / (2 pi) at interior vertices of the folded mesh, 0 on the boundary:
    /// the in-plane strain needed to flatten a vertex whose angle residual is concentrated at it (derived here,
    /// docs/reference/geometry.md section 7).</summary>
    public static double[] VertexAngleStrain(CreaseMesh mesh)
    {
        var angleSum = new double[mesh.VertexCount];
        foreach (var face in mesh.Faces)
            for (int k = 0; k < face.Length; k++)
            {
                var p = mesh.Vertex(face[k]);
                var prev = mesh.Vertex(face[(k + face.Length - 1) % face.Length]);
                var next = mesh.Vertex(face[(k + 1) % face.Length]);
                angleSum[face[k]] += Vec3.Angle(prev - p, next - p);
            }
        var boundary = mesh.BoundaryVertices();
        var result = new double[mesh.VertexCount];
        for (int v = 0; v < mesh.VertexCount; v++)
            if (!boundary[v]) result[v] = Math.Abs(2 * Math.PI - angleSum[v]) / (2 * Math.PI);
        return result;
    }

    private static double Strain(FlatPattern flat, CreaseMesh mesh, int a, int b)
    {
        double folded = (mesh.Vertex(b) - mesh.Vertex(a)).Length;
        double flatLength = (flat.Vertex(b) - flat.Vertex(a)).Length;
        return (flatLength - folded) / folded;
    }
}
