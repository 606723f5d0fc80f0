using System.Globalization;
using System.Text;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>The table a maker folds by: every interior edge with its role, length and target fold angle.</summary>
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

    /// <summary>The table as CSV text (header line, one line per row, '\n' line ends, invariant culture):
    /// lengths in metres with 6 decimals (micrometres), model lengths in mm with 3, angles with 3.</summary>
    public static string ToCsv(IReadOnlyList<FoldAngleRow> rows)
    {
        var ci = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.Append("edge,v0,v1,role,length_m,model_length_mm,fold_angle_deg\n");
        foreach (var r in rows)
        {
            sb.Append(r.Edge.ToString(ci)).Append(',')
              .Append(r.V0.ToString(ci)).Append(',')
              .Append(r.V1.ToString(ci)).Append(',')
              .Append(r.Role.ToString().ToLowerInvariant()).Append(',')
              .Append(r.LengthMetres.ToString("F6", ci)).Append(',')
              .Append(r.ModelLengthMillimetres.ToString("F3", ci)).Append(',')
              .Append(r.FoldAngleDegrees.ToString("F3", ci)).Append('\n');
        }
        return sb.ToString();
    }
}
