using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Tessellation.Miura;

/// <summary>A regular, partly folded Miura sheet on the xy-plane: the reference state that the
/// generator drapes onto a target and the kinematics tests fold.</summary>
/// <remarks>
/// Vertex (i, j), i = 0..2*cellsX along x, j = 0..2*cellsY along y, index j*(2*cellsX+1)+i, sits at
/// x = i*S, y = j*L + (i odd ? V : 0), z = (j odd ? H : 0) (Schenk &amp; Guest 2013). Edges along x
/// have length b and zig-zag in plan: they are the Miura's "straight" crease lines of the flat
/// pattern, all mountain on odd rows (the top layer) and valley on even rows. Edges along y have
/// length a and zig-zag in elevation. Vertices on odd rows form the top layer.
/// </remarks>
public static class RegularMiuraSheet
{
    public static int Index(int i, int j, int cellsX) => j * (2 * cellsX + 1) + i;

    public static CreaseMesh Build(MiuraCell cell, int cellsX, int cellsY)
    {
        if (cellsX < 1 || cellsY < 1) throw new ArgumentOutOfRangeException(nameof(cellsX), "at least one cell each way");
        int nx = 2 * cellsX + 1, ny = 2 * cellsY + 1;
        var pos = new double[nx * ny * 3];
        var layers = new VertexLayer[nx * ny];
        double s = cell.S, l = cell.L, v = cell.V, h = cell.H;
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int k = j * nx + i;
                new Vec3(i * s, j * l + (i % 2 == 1 ? v : 0), j % 2 == 1 ? h : 0).Write(pos, k);
                layers[k] = j % 2 == 1 ? VertexLayer.Top : VertexLayer.Bottom;
            }
        var faces = new int[(nx - 1) * (ny - 1)][];
        for (int j = 0; j < ny - 1; j++)
            for (int i = 0; i < nx - 1; i++)
                faces[j * (nx - 1) + i] = [j * nx + i, j * nx + i + 1, (j + 1) * nx + i + 1, (j + 1) * nx + i];
        var mesh = new CreaseMesh("miura", pos, faces, layers, (_, _) => CreaseRole.Flat);
        return AssignRolesFromGeometry(mesh);
    }

    /// <summary>Labels every interior edge mountain or valley from the sign of its fold angle in the
    /// given folded state; edges that are (numerically) flat stay <see cref="CreaseRole.Flat"/>.</summary>
    public static CreaseMesh AssignRolesFromGeometry(CreaseMesh mesh, double flatTolerance = 1e-9)
    {
        var roles = new Dictionary<(int, int), CreaseRole>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            double rho = mesh.FoldAngle(e);
            roles[(mesh.EdgeVertices[2 * e], mesh.EdgeVertices[2 * e + 1])] =
                Math.Abs(rho) <= flatTolerance ? CreaseRole.Flat : rho > 0 ? CreaseRole.Mountain : CreaseRole.Valley;
        }
        return new CreaseMesh(mesh.Family, mesh.Positions, mesh.Faces, mesh.Layers, (a, b) => roles[(a, b)]);
    }
}
