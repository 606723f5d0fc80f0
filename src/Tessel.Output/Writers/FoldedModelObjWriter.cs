using System.Text;
using Tessel.Core.Model;

namespace Tessel.Output.Writers;

/// <summary>Writes the folded model as Wavefront OBJ: the panels as faces in one group "panels", then
/// the creases as two-point polylines (<c>l</c>) in one group per role (mountain, valley, flat,
/// boundary; a role with no edge gets no group). Metres, z up, 1-based indices.</summary>
public static class FoldedModelObjWriter
{
    /// <summary>The order the crease groups are written in.</summary>
    private static readonly CreaseRole[] RoleOrder = [CreaseRole.Mountain, CreaseRole.Valley, CreaseRole.Flat, CreaseRole.Boundary];

    /// <summary>OBJ bytes (UTF-8, '\n' line ends); <paramref name="comment"/> lines become # comments.</summary>
    public static byte[] Write(CreaseMesh mesh, string comment)
    {
        var faces = ObjWriter.Write(mesh.Positions, mesh.Faces, [new ObjWriter.Group("panels", Enumerable.Range(0, mesh.FaceCount).ToArray())], comment);
        var sb = new StringBuilder(Encoding.UTF8.GetString(faces));
        foreach (var role in RoleOrder)
        {
            var edges = Enumerable.Range(0, mesh.EdgeCount).Where(e => mesh.EdgeRoles[e] == role).ToArray();
            if (edges.Length == 0) continue;
            sb.Append("g ").Append(role.ToString().ToLowerInvariant()).Append('\n');
            foreach (int e in edges)
                sb.Append("l ").Append(mesh.EdgeVertices[2 * e] + 1).Append(' ').Append(mesh.EdgeVertices[2 * e + 1] + 1).Append('\n');
        }
        return Encoding.UTF8.GetBytes(sb.ToString());
    }
}
