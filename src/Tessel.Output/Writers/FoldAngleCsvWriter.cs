using System.Globalization;
using System.Text;
using Tessel.Core.Checks;

namespace Tessel.Output.Writers;

/// <summary>Writes the table a maker folds by (<see cref="FoldAngleTable"/>) as CSV.</summary>
public static class FoldAngleCsvWriter
{
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

    /// <summary>The CSV as UTF-8 bytes.</summary>
    public static byte[] Write(IReadOnlyList<FoldAngleRow> rows) => Encoding.UTF8.GetBytes(ToCsv(rows));
}
