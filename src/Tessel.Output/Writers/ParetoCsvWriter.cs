using System.Globalization;
using System.Text;
using Tessel.Core.Fitting;

namespace Tessel.Output.Writers;

/// <summary>Writes the fit's trade-off front (one row per developability tolerance tried) as CSV:
/// a header line, then numbers in round-trip form ("R", invariant culture) and converged as true/false.</summary>
public static class ParetoCsvWriter
{
    /// <summary>The header line's columns, in order.</summary>
    public const string Header = "epsilon_deg,shape_rms_m,shape_max_m,objective,max_developability_rad,max_kawasaki_rad,max_planarity,converged";

    /// <summary>CSV bytes (UTF-8, '\n' line ends).</summary>
    public static byte[] Write(IReadOnlyList<ParetoPoint> front)
    {
        var sb = new StringBuilder(Header).Append('\n');
        foreach (var p in front)
            sb.Append(string.Join(",", new[] { p.EpsilonDeg, p.ShapeRms, p.ShapeMax, p.Objective, p.MaxDevelopability, p.MaxKawasaki, p.MaxPlanarity }
                .Select(v => v.ToString("R", CultureInfo.InvariantCulture)))).Append(',').Append(p.Converged ? "true" : "false").Append('\n');
        return Encoding.UTF8.GetBytes(sb.ToString());
    }
}
