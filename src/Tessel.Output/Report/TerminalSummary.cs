using System.Globalization;
using System.Text;

namespace Tessel.Output.Report;

/// <summary>A few aligned lines about a build for the terminal: the summary rows, the distance to the
/// target at both scales and the warnings, each warning on its own line, then the one-line caution.</summary>
public static class TerminalSummary
{
    /// <summary>The lines joined with "\n" (no trailing line end). Labels are padded to one column.</summary>
    public static string Format(ReportModel model)
    {
        model.Validate();
        var (min, max) = DeviationRange.Of(model);
        double n = model.ScaleDenominator;
        var rows = new List<(string Label, string Value)>();
        rows.AddRange(model.Summary.Select(r => (OneLine(r.Label), OneLine(r.Value))));
        rows.Add(("distance to target", $"{DeviationFormat.SignedMm(min * 1000)} .. {DeviationFormat.SignedMm(max * 1000)} mm full scale"));
        rows.Add(("", $"{DeviationFormat.SignedMm(min * 1000 / n)} .. {DeviationFormat.SignedMm(max * 1000 / n)} mm on the model at 1:{n.ToString("0.###", CultureInfo.InvariantCulture)}"));
        rows.Add(("warnings", model.Warnings.Length.ToString(CultureInfo.InvariantCulture)));
        int width = rows.Max(r => r.Label.Length);

        var sb = new StringBuilder();
        sb.Append(OneLine(model.JobName));
        foreach (var (label, value) in rows)
            sb.Append('\n').Append("  ").Append(label.PadRight(width)).Append("  ").Append(value);
        foreach (var w in model.Warnings)
            sb.Append('\n').Append("  ! ").Append(OneLine(w));
        sb.Append('\n').Append("  ").Append(Tessel.Core.Sheets.SheetAnnotations.CautionLine);
        return sb.ToString();
    }

    private static string OneLine(string s) => s.Replace("\r", " ").Replace("\n", " ");
}
