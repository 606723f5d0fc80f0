using Tessel.Core.Targets.Meshes;

namespace Tessel.Core.Targets;

/// <summary>Samples a target on a regular plan grid over its footprint and triangulates it, for
/// previews and for the target.obj output.</summary>
public static class TargetMesher
{
    /// <summary>A mesh with about <paramref name="cellsAlongLongerSide"/> grid cells along the footprint's
    /// longer side. Each grid cell is split into two triangles along its rising diagonal; a triangle is
    /// kept when its three corners lie inside the footprint and have finite heights. Unused grid points
    /// are dropped, so vertex numbering is compact and deterministic.</summary>
    public static TriangleMesh Mesh(ITargetSurface target, int cellsAlongLongerSide = 64)
    {
        var f = target.Footprint;
        double step = Math.Max(f.Width, f.Depth) / cellsAlongLongerSide;
        int nx = Math.Max(1, (int)Math.Round(f.Width / step)), ny = Math.Max(1, (int)Math.Round(f.Depth / step));
        var z = new double[(nx + 1) * (ny + 1)];
        var ok = new bool[z.Length];
        for (int j = 0; j <= ny; j++)
            for (int i = 0; i <= nx; i++)
            {
                double x = X(f, i, nx), y = Y(f, j, ny);
                int k = j * (nx + 1) + i;
                z[k] = target.HeightAt(x, y);
                ok[k] = f.Contains(x, y) && double.IsFinite(z[k]);
            }
        var tris = new List<int>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int a = j * (nx + 1) + i, b = a + 1, c = a + nx + 2, d = a + nx + 1;
                if (ok[a] && ok[b] && ok[c]) { tris.Add(a); tris.Add(b); tris.Add(c); }
                if (ok[a] && ok[c] && ok[d]) { tris.Add(a); tris.Add(c); tris.Add(d); }
            }
        var map = new int[z.Length];
        Array.Fill(map, -1);
        var pos = new List<double>();
        foreach (int k in tris.Distinct().Order())
        {
            map[k] = pos.Count / 3;
            pos.Add(X(f, k % (nx + 1), nx)); pos.Add(Y(f, k / (nx + 1), ny)); pos.Add(z[k]);
        }
        return new TriangleMesh(pos.ToArray(), tris.Select(k => map[k]).ToArray());
    }

    private static double X(Footprint f, int i, int n) => i == n ? f.MaxX : f.MinX + f.Width * i / n;
    private static double Y(Footprint f, int j, int n) => j == n ? f.MaxY : f.MinY + f.Depth * j / n;
}
