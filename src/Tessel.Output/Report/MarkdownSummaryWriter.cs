using System.Globalization;
using System.Text;

namespace Tessel.Output.Report;

/// <summary>A plain Markdown summary of a build, meant to be committed beside the job file so that
/// changes in accuracy show up in version-control diffs. Deterministic; no dates or paths.</summary>
public static class MarkdownSummaryWriter
{
    /// <summary>The summary as Markdown text with "\n" line ends.</summary>
    public static string Render(ReportModel model)
    {
        model.Validate();
        var (min, max) = DeviationRange.Of(model);
        double n = model.ScaleDenominator;
        var sb = new StringBuilder();
        sb.Append("# ").Append(Inline(model.JobName)).Append('\n').Append('\n');
        if (model.Description.Length > 0) sb.Append(Inline(model.Description)).Append('\n').Append('\n');

        sb.Append("| figure | value |\n| --- | --- |\n");
        foreach (var row in model.Summary) sb.Append("| ").Append(Cell(row.Label)).Append(" | ").Append(Cell(row.Value)).Append(" |\n");
        sb.Append("| distance to target, full scale | ").Append(DeviationFormat.SignedMm(min * 1000)).Append(" to ")
          .Append(DeviationFormat.SignedMm(max * 1000)).Append(" mm |\n");
        sb.Append("| distance to target, model 1:").Append(N(n)).Append(" | ").Append(DeviationFormat.SignedMm(min * 1000 / n)).Append(" to ")
          .Append(DeviationFormat.SignedMm(max * 1000 / n)).Append(" mm |\n\n");

        sb.Append("## Warnings\n\n");
        Items(sb, model.Warnings, "None.");

        if (model.ParetoFront.Length > 0)
        {
            sb.Append("## Accuracy against buildability\n\n| tolerance (deg) | shape error RMS (mm, full scale) | chosen |\n| ---: | ---: | :---: |\n");
            foreach (var p in model.ParetoFront.OrderBy(p => p.EpsilonDeg))
                sb.Append("| ").Append(p.EpsilonDeg.ToString("0.###", CultureInfo.InvariantCulture)).Append(" | ")
                  .Append(DeviationFormat.Mm(p.ShapeRms * 1000)).Append(" | ").Append(model.ChosenEpsilonDeg is double chosen && Math.Abs(p.EpsilonDeg - chosen) < 1e-12 ? "yes" : "").Append(" |\n");
            sb.Append('\n');
        }

        if (model.Convergence.Length > 0)
        {
            var last = model.Convergence.MaxBy(s => s.Iteration);
            int runs = 1 + model.Convergence.Count(s => s.StartsRun);
            sb.Append("Solver: ").Append(model.Convergence.Length).Append(" steps recorded")
              .Append(runs > 1 ? $" in {runs.ToString(CultureInfo.InvariantCulture)} runs (stages, refits or restarts)" : "")
              .Append("; at the last, step ").Append(last.Iteration.ToString(CultureInfo.InvariantCulture)).Append(", the objective was ")
              .Append(last.Objective.ToString("0.###e+0", CultureInfo.InvariantCulture)).Append(" and the largest residual ")
              .Append(last.MaxResidual.ToString("0.###e+0", CultureInfo.InvariantCulture)).Append(".\n\n");
        }

        sb.Append("## Cautions\n\n");
        Items(sb, model.Cautions, "None given.");
        return sb.ToString().TrimEnd('\n') + "\n";
    }

    private static void Items(StringBuilder sb, string[] items, string empty)
    {
        if (items.Length == 0) sb.Append(empty).Append('\n');
        foreach (var item in items) sb.Append("- ").Append(Inline(item)).Append('\n');
        sb.Append('\n');
    }

    /// <summary>One line of text that Markdown shows as written: no line breaks, no raw HTML.</summary>
    private static string Inline(string text) =>
        text.Replace("\r", " ").Replace("\n", " ").Replace("&", "&amp;").Replace("<", "&lt;").Replace(">", "&gt;");

    private static string Cell(string text) => Inline(text).Replace("|", "\\|");

    private static string N(double n) => n.ToString("0.###", CultureInfo.InvariantCulture);
}
