using Tessel.Core.LinearAlgebra;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>The bar-and-hinge constraints of a crease pattern with rigid panels: a bar on every edge, fan
/// diagonals that triangulate each polygon, and one planarity row per vertex beyond the third of a polygon
/// (a quad: one diagonal, one planarity row), so a k-gon carries 3k - 6 constraints (Pellegrino &amp;
/// Calladine, IJSS 1986; Schenk &amp; Guest, Origami 5, 2011).</summary>
/// <remarks>Residuals and Jacobian are dimensionless: positions are measured in units of
/// <see cref="LengthUnit"/> (the mean edge length), so bar rows have unit-vector entries and planarity rows
/// (scaled triple products) entries of order one, and singular values of meshes of any size compare.</remarks>
internal sealed class BarHingeModel
{
    /// <summary>#B*2 bar end vertices.</summary>
    public int[] Bars { get; }
    /// <summary>#B bar lengths in the reference state (metres).</summary>
    public double[] RestLengths { get; }
    /// <summary>#P*4 planarity quadruples: vertex 3 must stay in the plane of vertices 0, 1, 2.</summary>
    public int[] PlanarQuads { get; }
    /// <summary>#P cube of the mean side length of the quadruple's polygon (metres^3), the triple product's scale.</summary>
    public double[] PlanarScales { get; }
    /// <summary>Mean edge length of the mesh (metres): the length unit of residuals and Jacobian.</summary>
    public double LengthUnit { get; }
    public int VertexCount { get; }
    /// <summary>Number of edges: bars 0..EdgeBarCount-1 are the mesh edges in edge order.</summary>
    public int EdgeBarCount { get; }

    public int RowCount => RestLengths.Length + PlanarScales.Length;
    public int ColumnCount => 3 * VertexCount;

    private BarHingeModel(int vertexCount, int edgeBars, int[] bars, double[] rest, int[] quads, double[] scales, double unit)
    {
        VertexCount = vertexCount; EdgeBarCount = edgeBars; Bars = bars; RestLengths = rest;
        PlanarQuads = quads; PlanarScales = scales; LengthUnit = unit;
    }

    /// <summary>Constraints of <paramref name="mesh"/> with rest lengths taken from its current positions.</summary>
    public static BarHingeModel FromMesh(CreaseMesh mesh)
    {
        var bars = new List<int>(mesh.EdgeVertices);
        var quads = new List<int>();
        var scales = new List<double>();
        double total = 0;
        for (int e = 0; e < mesh.EdgeCount; e++)
            total += (mesh.Vertex(mesh.EdgeVertices[2 * e + 1]) - mesh.Vertex(mesh.EdgeVertices[2 * e])).Length;
        double unit = mesh.EdgeCount > 0 ? total / mesh.EdgeCount : 1;
        if (!(unit > 0)) unit = 1;
        foreach (var face in mesh.Faces)
        {
            if (face.Length < 4) continue;
            double perimeter = 0;
            for (int k = 0; k < face.Length; k++)
                perimeter += (mesh.Vertex(face[(k + 1) % face.Length]) - mesh.Vertex(face[k])).Length;
            double l = perimeter / face.Length;
            for (int k = 2; k < face.Length - 1; k++) { bars.Add(face[0]); bars.Add(face[k]); }
            for (int k = 3; k < face.Length; k++)
            {
                quads.Add(face[0]); quads.Add(face[1]); quads.Add(face[2]); quads.Add(face[k]);
                scales.Add(l * l * l);
            }
        }
        var barArray = bars.ToArray();
        var rest = new double[barArray.Length / 2];
        for (int b = 0; b < rest.Length; b++)
            rest[b] = (mesh.Vertex(barArray[2 * b + 1]) - mesh.Vertex(barArray[2 * b])).Length;
        return new BarHingeModel(mesh.VertexCount, mesh.EdgeCount, barArray, rest, quads.ToArray(), scales.ToArray(), unit);
    }

    /// <summary>Residuals at <paramref name="x"/> (#V*3 metres) into <paramref name="r"/> (RowCount): bar rows
    /// (length - rest) / LengthUnit, then planarity rows triple product / scale.</summary>
    public void Residuals(ReadOnlySpan<double> x, Span<double> r)
    {
        int nb = RestLengths.Length;
        for (int b = 0; b < nb; b++)
        {
            var d = Vec3.Read(x, Bars[2 * b + 1]) - Vec3.Read(x, Bars[2 * b]);
            r[b] = (d.Length - RestLengths[b]) / LengthUnit;
        }
        for (int q = 0; q < PlanarScales.Length; q++)
        {
            var p0 = Vec3.Read(x, PlanarQuads[4 * q]);
            var a = Vec3.Read(x, PlanarQuads[4 * q + 1]) - p0;
            var b = Vec3.Read(x, PlanarQuads[4 * q + 2]) - p0;
            var c = Vec3.Read(x, PlanarQuads[4 * q + 3]) - p0;
            r[nb + q] = Vec3.Dot(a, Vec3.Cross(b, c)) / PlanarScales[q];
        }
    }

    /// <summary>Largest |length - rest| / rest over all bars: the panel strain a state needs.</summary>
    public double MaxBarStrain(ReadOnlySpan<double> x)
    {
        double m = 0;
        for (int b = 0; b < RestLengths.Length; b++)
        {
            var d = Vec3.Read(x, Bars[2 * b + 1]) - Vec3.Read(x, Bars[2 * b]);
            m = Math.Max(m, Math.Abs(d.Length - RestLengths[b]) / RestLengths[b]);
        }
        return m;
    }

    /// <summary>Largest |planarity residual| (dimensionless triple product).</summary>
    public double MaxPlanarity(ReadOnlySpan<double> x)
    {
        var r = new double[RowCount];
        Residuals(x, r);
        double m = 0;
        for (int q = RestLengths.Length; q < r.Length; q++) m = Math.Max(m, Math.Abs(r[q]));
        return m;
    }

    /// <summary>Jacobian of <see cref="Residuals"/> with respect to x / LengthUnit: RowCount x 3V, 6 entries per
    /// bar row, 12 per planarity row.</summary>
    public CsrMatrix Jacobian(ReadOnlySpan<double> x)
    {
        int nb = RestLengths.Length, np = PlanarScales.Length;
        var rowStart = new int[nb + np + 1];
        for (int i = 0; i < nb; i++) rowStart[i + 1] = rowStart[i] + 6;
        for (int q = 0; q < np; q++) rowStart[nb + q + 1] = rowStart[nb + q] + 12;
        var cols = new int[rowStart[^1]];
        var vals = new double[rowStart[^1]];
        Span<(int Col, double Val)> entries = stackalloc (int, double)[12];
        for (int b = 0; b < nb; b++)
        {
            int i = Bars[2 * b], j = Bars[2 * b + 1];
            var u = (Vec3.Read(x, j) - Vec3.Read(x, i)).Normalized();
            entries[0] = (3 * i, -u.X); entries[1] = (3 * i + 1, -u.Y); entries[2] = (3 * i + 2, -u.Z);
            entries[3] = (3 * j, u.X); entries[4] = (3 * j + 1, u.Y); entries[5] = (3 * j + 2, u.Z);
            WriteSorted(entries[..6], cols, vals, rowStart[b]);
        }
        for (int q = 0; q < np; q++)
        {
            int v0 = PlanarQuads[4 * q], v1 = PlanarQuads[4 * q + 1], v2 = PlanarQuads[4 * q + 2], v3 = PlanarQuads[4 * q + 3];
            var p0 = Vec3.Read(x, v0);
            var a = Vec3.Read(x, v1) - p0;
            var b = Vec3.Read(x, v2) - p0;
            var c = Vec3.Read(x, v3) - p0;
            // d det[a b c] = (b x c).da + (c x a).db + (a x b).dc; scaled to derivatives in LengthUnit.
            double s = LengthUnit / PlanarScales[q];
            var ga = Vec3.Cross(b, c) * s;
            var gb = Vec3.Cross(c, a) * s;
            var gc = Vec3.Cross(a, b) * s;
            var g0 = -(ga + gb + gc);
            Put(entries, 0, v0, g0); Put(entries, 3, v1, ga); Put(entries, 6, v2, gb); Put(entries, 9, v3, gc);
            WriteSorted(entries[..12], cols, vals, rowStart[nb + q]);
        }
        return new CsrMatrix(nb + np, 3 * VertexCount, rowStart, cols, vals);
    }

    private static void Put(Span<(int Col, double Val)> entries, int at, int vertex, Vec3 g)
    {
        entries[at] = (3 * vertex, g.X); entries[at + 1] = (3 * vertex + 1, g.Y); entries[at + 2] = (3 * vertex + 2, g.Z);
    }

    // CSR wants ascending distinct columns per row; vertices of one row are distinct by construction.
    private static void WriteSorted(Span<(int Col, double Val)> entries, int[] cols, double[] vals, int start)
    {
        entries.Sort((p, q) => p.Col.CompareTo(q.Col));
        for (int k = 0; k < entries.Length; k++) { cols[start + k] = entries[k].Col; vals[start + k] = entries[k].Val; }
    }
}
