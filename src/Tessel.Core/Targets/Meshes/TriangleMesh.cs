namespace Tessel.Core.Targets.Meshes;

/// <summary>An indexed triangle mesh: <see cref="Positions"/> holds x, y, z per vertex (length 3V),
/// <see cref="Triangles"/> three vertex indices per triangle (length 3T).</summary>
public sealed record TriangleMesh(double[] Positions, int[] Triangles)
{
    /// <summary>Number of vertices.</summary>
    public int VertexCount => Positions.Length / 3;
    /// <summary>Number of triangles.</summary>
    public int TriangleCount => Triangles.Length / 3;

    /// <summary>The same mesh with every coordinate multiplied by <paramref name="factor"/> (unit conversion).</summary>
    public TriangleMesh Scaled(double factor) => new(Positions.Select(p => p * factor).ToArray(), Triangles);
}
