using Tessel.Core.Geometry;

namespace Tessel.Core.Model;

/// <summary>The crease pattern laid flat, in metres at full scale: what the sheet stage cuts up and
/// the writers draw. Vertex, face and edge indices are those of the folded <see cref="CreaseMesh"/>
/// it came from, so per-edge figures (fold angle, strain) can be looked up by index.</summary>
public sealed class FlatPattern
{
    /// <summary>#V*2 flat vertex positions x0 y0 x1 y1 ... (metres, full scale).</summary>
    public double[] Positions { get; }
    /// <summary>The folded pattern this was developed from (faces, edges and roles).</summary>
    public CreaseMesh Folded { get; }
    /// <summary>#E relative length error of each edge, (flat - folded) / folded.</summary>
    public double[] EdgeStrain { get; }

    public FlatPattern(CreaseMesh folded, double[] positions, double[] edgeStrain)
    {
        if (positions.Length != folded.VertexCount * 2) throw new ArgumentException("two numbers per vertex");
        if (edgeStrain.Length != folded.EdgeCount) throw new ArgumentException("one strain per edge");
        Folded = folded; Positions = positions; EdgeStrain = edgeStrain;
    }

    public Vec2 Vertex(int i) => new(Positions[2 * i], Positions[2 * i + 1]);
    public int VertexCount => Folded.VertexCount;
    public int EdgeCount => Folded.EdgeCount;
    public CreaseRole Role(int edge) => Folded.EdgeRoles[edge];
    public (int V0, int V1) Edge(int edge) => (Folded.EdgeVertices[2 * edge], Folded.EdgeVertices[2 * edge + 1]);
}
