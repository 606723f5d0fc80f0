using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation;

/// <summary>A pattern cut down to the footprint: the kept mesh and what the generator's bookkeeping
/// becomes under the new vertex numbering.</summary>
/// <param name="Mesh">Kept faces only, vertices renumbered in their old order.</param>
/// <param name="FairnessStencils">The stencils whose three vertices were all kept, renumbered.</param>
/// <param name="AnchorVertex">The old anchor if kept, else the kept vertex of its layer nearest to it.</param>
/// <param name="NewOfOld">New index of every old vertex, -1 where it was dropped.</param>
public sealed record TrimmedPattern(CreaseMesh Mesh, int[] FairnessStencils, int AnchorVertex, int[] NewOfOld);

/// <summary>Cuts a generated sheet laid over the footprint's bounding box down to a polygon footprint:
/// whole faces whose vertices may all stay are kept, the rest dropped, then the largest edge-connected
/// piece is kept and vertices where two fans of faces touch at a point are split off (a fold pattern
/// must be one sheet, and a vertex joining two fans has no single cone to unfold).</summary>
/// <remarks>Faces are never cut, so every kept facet keeps its shape, every interior vertex of the
/// result keeps all its faces (its degree and crease roles, hence Kawasaki's and the developability
/// condition still apply to it as generated), and the vertices the cut exposes become boundary
/// vertices, which the fitter leaves unconstrained.</remarks>
public static class FootprintTrim
{
    /// <summary>Whether a vertex whose plan position is <paramref name="plan"/> may stay: inside the
    /// footprint (within its border tolerance) and over a point where the target has a height.</summary>
    public static bool Keeps(ITargetSurface target, Vec2 plan) =>
        target.Footprint.Covers(plan.X, plan.Y) && double.IsFinite(target.HeightAt(plan.X, plan.Y));

    /// <summary>Cuts <paramref name="mesh"/> to the faces whose vertices all have <paramref name="keep"/>
    /// set (see the class remarks). Throws <see cref="ArgumentException"/> (parameter CellSize) when no
    /// face is left.</summary>
    public static TrimmedPattern Trim(CreaseMesh mesh, bool[] keep, int[] fairnessStencils, int anchorVertex)
    {
        if (keep.Length != mesh.VertexCount) throw new ArgumentException("one keep flag per vertex", nameof(keep));
        var faceKept = new bool[mesh.FaceCount];
        for (int f = 0; f < faceKept.Length; f++) faceKept[f] = mesh.Faces[f].All(v => keep[v]);
        var neighbours = EdgeNeighbours(mesh);
        while (true)
        {
            KeepLargestPiece(neighbours, faceKept);
            if (!SplitPinchedVertices(mesh, faceKept)) break;
        }
        if (!faceKept.Any(k => k))
            throw new ArgumentException("no cell of the pattern lies inside the footprint where the target has a surface; use more cells (a smaller CellSize) or a larger footprint", "CellSize");

        var newOfOld = Enumerable.Repeat(-1, mesh.VertexCount).ToArray();
        for (int f = 0; f < faceKept.Length; f++)
            if (faceKept[f]) foreach (int v in mesh.Faces[f]) newOfOld[v] = 0;
        int n = 0;
        for (int v = 0; v < newOfOld.Length; v++) if (newOfOld[v] == 0) newOfOld[v] = n++;
        var oldOfNew = new int[n];
        for (int v = 0; v < newOfOld.Length; v++) if (newOfOld[v] >= 0) oldOfNew[newOfOld[v]] = v;

        var pos = new double[3 * n];
        var layers = new VertexLayer[n];
        for (int v = 0; v < n; v++)
        {
            mesh.Vertex(oldOfNew[v]).Write(pos, v);
            layers[v] = mesh.Layers[oldOfNew[v]];
        }
        var faces = new List<int[]>();
        for (int f = 0; f < faceKept.Length; f++)
            if (faceKept[f]) faces.Add(mesh.Faces[f].Select(v => newOfOld[v]).ToArray());
        var roles = new Dictionary<(int, int), CreaseRole>();
        for (int e = 0; e < mesh.EdgeCount; e++) roles[(mesh.EdgeVertices[2 * e], mesh.EdgeVertices[2 * e + 1])] = mesh.EdgeRoles[e];
        // Renumbering keeps the old order, so a < b stays a < b and the old edge key is found directly.
        var trimmed = new CreaseMesh(mesh.Family, pos, faces.ToArray(), layers, (a, b) => roles[(oldOfNew[a], oldOfNew[b])]);

        var stencils = new List<int>();
        for (int s = 0; s + 2 < fairnessStencils.Length; s += 3)
        {
            int a = newOfOld[fairnessStencils[s]], c = newOfOld[fairnessStencils[s + 1]], b = newOfOld[fairnessStencils[s + 2]];
            if (a >= 0 && c >= 0 && b >= 0) stencils.AddRange([a, c, b]);
        }
        return new TrimmedPattern(trimmed, stencils.ToArray(), Anchor(mesh, newOfOld, oldOfNew, anchorVertex), newOfOld);
    }

    /// <summary>The kept vertex nearest in plan to the old anchor, of its layer where there is one.</summary>
    private static int Anchor(CreaseMesh mesh, int[] newOfOld, int[] oldOfNew, int anchor)
    {
        if (newOfOld[anchor] >= 0) return newOfOld[anchor];
        var a = mesh.Vertex(anchor);
        int best = -1; double bestDistance = double.MaxValue; bool bestSameLayer = false;
        for (int v = 0; v < oldOfNew.Length; v++)
        {
            var p = mesh.Vertex(oldOfNew[v]);
            bool same = mesh.Layers[oldOfNew[v]] == mesh.Layers[anchor];
            double d = (p.X - a.X) * (p.X - a.X) + (p.Y - a.Y) * (p.Y - a.Y);
            if ((same && !bestSameLayer) || (same == bestSameLayer && d < bestDistance)) { best = v; bestDistance = d; bestSameLayer = same; }
        }
        return best;
    }

    /// <summary>Clears every kept face outside the largest piece of faces joined across edges (ties: the
    /// piece holding the lowest face index).</summary>
    private static void KeepLargestPiece(int[][] neighbours, bool[] faceKept)
    {
        var piece = Enumerable.Repeat(-1, faceKept.Length).ToArray();
        var sizes = new List<int>();
        var stack = new Stack<int>();
        for (int f0 = 0; f0 < faceKept.Length; f0++)
        {
            if (!faceKept[f0] || piece[f0] >= 0) continue;
            int id = sizes.Count, size = 0;
            piece[f0] = id; stack.Push(f0);
            while (stack.Count > 0)
            {
                int f = stack.Pop(); size++;
                foreach (int g in neighbours[f])
                    if (faceKept[g] && piece[g] < 0) { piece[g] = id; stack.Push(g); }
            }
            sizes.Add(size);
        }
        if (sizes.Count <= 1) return;
        int largest = 0;
        for (int i = 1; i < sizes.Count; i++) if (sizes[i] > sizes[largest]) largest = i;
        for (int f = 0; f < faceKept.Length; f++) if (faceKept[f] && piece[f] != largest) faceKept[f] = false;
    }

    /// <summary>Faces sharing an edge with each face of the untrimmed mesh.</summary>
    private static int[][] EdgeNeighbours(CreaseMesh mesh)
    {
        var lists = new List<int>[mesh.FaceCount];
        for (int i = 0; i < lists.Length; i++) lists[i] = [];
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int l = mesh.EdgeFaceLeft[e], r = mesh.EdgeFaceRight[e];
            if (l >= 0 && r >= 0) { lists[l].Add(r); lists[r].Add(l); }
        }
        return lists.Select(x => x.ToArray()).ToArray();
    }

    /// <summary>At every vertex whose kept faces form more than one fan (faces around it joined across
    /// its own edges), keeps the largest fan (ties: lowest face index) and clears the others. True when
    /// a face was cleared.</summary>
    private static bool SplitPinchedVertices(CreaseMesh mesh, bool[] faceKept)
    {
        var around = new List<int>[mesh.VertexCount];
        for (int f = 0; f < mesh.FaceCount; f++)
            if (faceKept[f]) foreach (int v in mesh.Faces[f]) (around[v] ??= []).Add(f);
        bool changed = false;
        for (int v = 0; v < around.Length; v++)
        {
            if (around[v] is not { Count: > 1 } faces) continue;
            var fan = new Dictionary<int, int>();
            int fans = 0;
            foreach (int f0 in faces)
            {
                if (fan.ContainsKey(f0) || !faceKept[f0]) continue;
                var stack = new Stack<int>([f0]);
                fan[f0] = fans;
                while (stack.Count > 0)
                {
                    int f = stack.Pop();
                    foreach (int g in faces)
                        if (!fan.ContainsKey(g) && faceKept[g] && ShareEdgeAt(mesh.Faces[f], mesh.Faces[g], v)) { fan[g] = fans; stack.Push(g); }
                }
                fans++;
            }
            if (fans <= 1) continue;
            var size = new int[fans];
            foreach (var (_, id) in fan) size[id]++;
            int keepFan = 0;
            for (int i = 1; i < fans; i++) if (size[i] > size[keepFan]) keepFan = i;
            foreach (var (f, id) in fan)
                if (id != keepFan) { faceKept[f] = false; changed = true; }
        }
        return changed;
    }

    /// <summary>Whether two faces share an edge that has <paramref name="v"/> as one end.</summary>
    private static bool ShareEdgeAt(int[] a, int[] b, int v)
    {
        int ia = Array.IndexOf(a, v), ib = Array.IndexOf(b, v);
        if (ia < 0 || ib < 0) return false;
        int aNext = a[(ia + 1) % a.Length], aPrev = a[(ia + a.Length - 1) % a.Length];
        int bNext = b[(ib + 1) % b.Length], bPrev = b[(ib + b.Length - 1) % b.Length];
        return aNext == bPrev || aPrev == bNext || aNext == bNext || aPrev == bPrev;
    }
}
