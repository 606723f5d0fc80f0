using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>The table a maker folds by: every interior edge with its role, length and target fold angle
/// (written as fold-angles.csv by <c>Tessel.Output.Writers.FoldAngleCsvWriter</c>).</summary>
public static class FoldAngleTable
{
    /// <summary>Rows for every interior edge of <paramref name="mesh"/> in edge-index order (boundary
    /// edges are cuts, not creases, and are left out).</summary>
    /// <param name="mesh">Folded pattern, positions in metres at full scale.</param>
    /// <param name="scaleDenominator">n of the model scale 1:n (1 = full size); must be positive.</param>
    public static IReadOnlyList<FoldAngleRow> Build(CreaseMesh mesh, double scaleDenominator)
    {
        if (!(scaleDenominator > 0)) throw new ArgumentOutOfRangeException(nameof(scaleDenominator), "scale 1:n needs n > 0");
        var rows = new List<FoldAngleRow>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            if (!mesh.IsInterior(e)) continue;
            int v0 = mesh.EdgeVertices[2 * e], v1 = mesh.EdgeVertices[2 * e + 1];
            double length = (mesh.Vertex(v1) - mesh.Vertex(v0)).Length;
            rows.Add(new FoldAngleRow(e, v0, v1, mesh.EdgeRoles[e], length,
                length / scaleDenominator * 1000.0, mesh.FoldAngle(e) * 180.0 / Math.PI));
        }
        return rows;
    }
}
