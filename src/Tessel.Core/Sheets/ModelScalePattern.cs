using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>A flat pattern at model scale in the sheet frame (millimetres, y flipped so the pattern seen
/// from the top side reads the same on the sheet), with each face's polygon and its neighbours.</summary>
/// <param name="Vertices">#V vertex positions, mm.</param>
/// <param name="Faces">#F face polygons (clockwise in this frame, as y is flipped).</param>
/// <param name="Neighbours">#F faces sharing an interior edge with each face, ascending.</param>
internal sealed record ModelScalePattern(Vec2[] Vertices, Vec2[][] Faces, int[][] Neighbours)
{
    /// <summary>Scales <paramref name="pattern"/> (metres) by <paramref name="millimetresPerMetre"/>.</summary>
    public static ModelScalePattern Of(FlatPattern pattern, double millimetresPerMetre)
    {
        var mesh = pattern.Folded;
        double k = millimetresPerMetre;
        var model = new Vec2[pattern.VertexCount];
        for (int v = 0; v < model.Length; v++) { var p = pattern.Vertex(v); model[v] = new Vec2(p.X * k, -p.Y * k); }
        var facePolys = mesh.Faces.Select(f => f.Select(v => model[v]).ToArray()).ToArray();
        var neighbourSets = Enumerable.Range(0, mesh.FaceCount).Select(_ => new SortedSet<int>()).ToArray();
        for (int e = 0; e < mesh.EdgeCount; e++)
            if (mesh.IsInterior(e)) { neighbourSets[mesh.EdgeFaceLeft[e]].Add(mesh.EdgeFaceRight[e]); neighbourSets[mesh.EdgeFaceRight[e]].Add(mesh.EdgeFaceLeft[e]); }
        return new ModelScalePattern(model, facePolys, neighbourSets.Select(s => s.ToArray()).ToArray());
    }
}
