using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Tests.Checks;

/// <summary>Small meshes the check tests share.</summary>
internal static class CheckMeshes
{
    public const double Deg = Math.PI / 180;

    /// <summary>Regular Miura sheet, a = 1.0 m, b = 0.8 m, gamma = 60 deg, folded to theta.</summary>
    public static CreaseMesh Miura(int cellsX, int cellsY, double thetaDeg = 40) =>
        RegularMiuraSheet.Build(new MiuraCell(1.0, 0.8, 60 * Deg, thetaDeg * Deg), cellsX, cellsY);

    /// <summary>A triangulated (n+1) x (n+1) grid of unit spacing with every vertex lifted by a pseudo-random
    /// z in [-0.2, 0.2] (seeded): a generic triangulated disk with 4n boundary vertices.</summary>
    public static CreaseMesh RandomTriangulatedDisk(int n, int seed)
    {
        var rng = new Random(seed);
        int m = n + 1;
        var pos = new double[m * m * 3];
        for (int j = 0; j < m; j++)
            for (int i = 0; i < m; i++)
                new Vec3(i + 0.2 * (rng.NextDouble() - 0.5), j + 0.2 * (rng.NextDouble() - 0.5), 0.4 * (rng.NextDouble() - 0.5))
                    .Write(pos, j * m + i);
        var faces = new List<int[]>();
        for (int j = 0; j < n; j++)
            for (int i = 0; i < n; i++)
            {
                int a = j * m + i, b = a + 1, c = a + m + 1, d = a + m;
                faces.Add([a, b, c]);
                faces.Add([a, c, d]);
            }
        return RegularMiuraSheet.AssignRolesFromGeometry(
            new CreaseMesh("disk", pos, faces.ToArray(), new VertexLayer[m * m], (_, _) => CreaseRole.Flat));
    }
}
