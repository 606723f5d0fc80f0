using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>An interior vertex with its neighbours in counter-clockwise order (seen from the top
/// side): sector k is the face corner between Ring[k] and Ring[(k+1) % degree].</summary>
public sealed record VertexStar(int Center, int[] Ring)
{
    public int Degree => Ring.Length;

    /// <summary>Stars of all interior vertices (every incident edge shared by two faces), in vertex order.</summary>
    public static VertexStar[] InteriorStars(CreaseMesh mesh)
    {
        // For a counter-clockwise face [.., prev, v, next, ..] the corner at v runs counter-clockwise
        // from next to prev; the next face around v is the one whose "next" is this face's "prev".
        var cornersAt = new List<(int Next, int Prev)>[mesh.VertexCount];
        for (int v = 0; v < cornersAt.Length; v++) cornersAt[v] = [];
        foreach (var f in mesh.Faces)
            for (int k = 0; k < f.Length; k++)
                cornersAt[f[k]].Add((f[(k + 1) % f.Length], f[(k + f.Length - 1) % f.Length]));
        var boundary = mesh.BoundaryVertices();
        var stars = new List<VertexStar>();
        for (int v = 0; v < mesh.VertexCount; v++)
        {
            var corners = cornersAt[v];
            if (boundary[v] || corners.Count < 3) continue;
            var ring = new int[corners.Count];
            var (next, prev) = corners[0];
            ring[0] = next;
            bool closed = true;
            for (int k = 1; k < ring.Length; k++)
            {
                ring[k] = prev;
                int idx = corners.FindIndex(c => c.Next == prev);
                if (idx < 0) { closed = false; break; }
                prev = corners[idx].Prev;
            }
            if (closed && prev == ring[0]) stars.Add(new VertexStar(v, ring));
        }
        return stars.ToArray();
    }
}
