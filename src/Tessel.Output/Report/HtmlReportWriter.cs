using System.Net;
using System.Text;
using Tessel.Core.Model;

namespace Tessel.Output.Report;

/// <summary>Writes the build report as one self-contained HTML file: previews as inline PNG, the summary
/// table, warnings and cautions, and an interactive folding viewer. Nothing is fetched when it opens.</summary>
/// <remarks>All job text goes through HTML encoding; the viewer data is JSON inside a
/// <c>type="application/json"</c> script element with "&lt;/" escaped. Opening the file with the hash
/// <c>#selftest</c> makes the page test its own viewer and write the result as JSON into
/// <c>&lt;pre id="selftest"&gt;</c>.</remarks>
public static class HtmlReportWriter
{
    /// <summary>The whole page as text (deterministic for the same model).</summary>
    public static string Render(ReportModel model)
    {
        model.Validate();
        var preview = FoldedModelPreview.Render(model);
        var sb = new StringBuilder(1 << 20);
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        sb.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        // No network at all: the policy forbids every fetch except inline data.
        sb.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; img-src data:; style-src 'unsafe-inline'; script-src 'unsafe-inline'\">\n");
        sb.Append("<title>").Append(E(model.JobName)).Append(" \u2014 Tessel report</title>\n");
        sb.Append("<style>").Append(ReportStyleSheet.Css).Append("</style>\n");
        sb.Append("<script>").Append(FoldingViewerScript.Probe).Append("</script>\n");
        // The self-test result sits first in the body: opening "#selftest" scrolls to it, i.e. to the top.
        sb.Append("</head>\n<body>\n<pre id=\"selftest\"></pre>\n<header>\n<h1>").Append(E(model.JobName)).Append("</h1>\n");
        if (model.Description.Length > 0) sb.Append("<p>").Append(E(model.Description)).Append("</p>\n");
        sb.Append("</header>\n<main>\n");

        sb.Append("<section>\n<h2>folding viewer</h2>\n");
        sb.Append("<canvas id=\"tessel-viewer\" width=\"720\" height=\"480\" aria-label=\"folded model, drag to turn\"></canvas>\n");
        sb.Append("<div class=\"controls\">\n<label for=\"tessel-progress\">fold</label>\n");
        sb.Append("<input id=\"tessel-progress\" type=\"range\" min=\"0\" max=\"1000\" step=\"1\" value=\"1000\">\n");
        sb.Append("<output id=\"tessel-progress-value\">100 %</output>\n");
        sb.Append("<button id=\"tessel-play\" type=\"button\">play</button>\n");
        sb.Append("<label>colour <select id=\"tessel-colour-mode\"><option value=\"deviation\">distance to target</option><option value=\"side\">top side / underside</option></select></label>\n");
        sb.Append("</div>\n<p class=\"hint\">Drag to turn the model, scroll to zoom. The slider moves it along the rigid folding path, from the flat sheet (0 %) to the fitted model (100 %), ");
        sb.Append("interpolating linearly between ").Append(model.Keyframes.Length).Append(" computed states. ");
        sb.Append("Colours show each face's mean distance to the target of the fitted model; fold lines: solid = mountain, dashed = valley.</p>\n</section>\n");

        sb.Append("<div class=\"side\">\n<section>\n<h2>summary</h2>\n");
        if (model.Summary.Length == 0) sb.Append("<p class=\"none\">no figures</p>\n");
        else
        {
            sb.Append("<table>\n");
            foreach (var row in model.Summary)
                sb.Append("<tr><td>").Append(E(row.Label)).Append("</td><td>").Append(E(row.Value)).Append("</td></tr>\n");
            sb.Append("</table>\n");
        }
        var bar = preview.Bar;
        sb.Append("<p class=\"hint\">Distance to target ranges from ").Append(E(DeviationFormat.SignedMm(bar.MinFullMm)))
          .Append(" to ").Append(E(DeviationFormat.SignedMm(bar.MaxFullMm))).Append(" mm at full scale (")
          .Append(E(DeviationFormat.SignedMm(bar.MinModelMm))).Append(" to ").Append(E(DeviationFormat.SignedMm(bar.MaxModelMm)))
          .Append(" mm on the model).</p>\n</section>\n");

        sb.Append("<section class=\"warnings\">\n<h2>warnings</h2>\n");
        List(sb, model.Warnings, "no warnings");
        sb.Append("</section>\n</div>\n");

        sb.Append("<section class=\"wide\">\n<h2>figures</h2>\n<div class=\"figures\">\n");
        Figure(sb, preview.Image, "Folded model coloured by distance to the target; bar in mm at model and full scale.");
        Figure(sb, CreasePatternPreview.Render(model), "Flat crease pattern: solid rust = mountain, dashed blue = valley.");
        // Plots of what this build did not compute are left out rather than drawn empty.
        if (model.ParetoFront.Length > 0)
            Figure(sb, ParetoPlot.Render(model.ParetoFront, model.ChosenEpsilonDeg), "Shape error against the developability tolerance of each fit. " + model.ParetoNote);
        if (model.Convergence.Length > 0)
            Figure(sb, ConvergencePlot.Render(model.Convergence), "Solver convergence of the fit used for the sheets: largest constraint residual in radians and the dimensionless objective, per solver step over the whole fit, on a logarithmic scale; a thin grey line marks where a further solver run (continuation stage, refit or restart) starts.");
        sb.Append("</div>\n</section>\n");

        if (model.Sheets.Length > 0)
        {
            sb.Append("<section class=\"wide\">\n<h2>sheets</h2>\n<div class=\"thumbs\">\n");
            foreach (var sheet in model.Sheets)
                Figure(sb, SheetThumbnail.Render(sheet), $"Sheet {sheet.Number} ({sheet.Side}), {sheet.Lines.Length} lines.");
            sb.Append("</div>\n</section>\n");
        }

        if (model.Files.Length > 0)
        {
            sb.Append("<section class=\"wide\">\n<h2>files</h2>\n<ul class=\"files\">\n");
            foreach (string file in model.Files)
                sb.Append("<li><a href=\"").Append(E(Uri.EscapeDataString(file).Replace("%2F", "/"))).Append("\">").Append(E(file)).Append("</a></li>\n");
            sb.Append("</ul>\n</section>\n");
        }

        sb.Append("<section class=\"wide\">\n<h2>cautions</h2>\n");
        List(sb, model.Cautions, "none given");
        sb.Append("</section>\n</main>\n");
        sb.Append("<script type=\"application/json\" id=\"tessel-viewer-data\">")
          .Append(ViewerData.Json(model, bar.MinM, bar.MaxM)).Append("</script>\n");
        sb.Append("<script>").Append(FoldingViewerScript.Viewer).Append("</script>\n</body>\n</html>\n");
        return sb.ToString();
    }

    /// <summary>Writes the page to <paramref name="path"/> (UTF-8, no byte order mark) through a
    /// temporary file in the same folder, so readers never see half a report.</summary>
    public static void WriteFile(string path, ReportModel model) => ReportFiles.WriteAtomically(path, Encoding.UTF8.GetBytes(Render(model)));

    private static void Figure(StringBuilder sb, PreviewImage image, string caption)
    {
        sb.Append("<figure><img alt=\"").Append(E(caption)).Append("\" width=\"").Append(image.Width).Append("\" height=\"").Append(image.Height)
          .Append("\" src=\"data:image/png;base64,").Append(Convert.ToBase64String(image.Png)).Append("\"><figcaption>")
          .Append(E(caption)).Append("</figcaption></figure>\n");
    }

    private static void List(StringBuilder sb, string[] items, string empty)
    {
        if (items.Length == 0) { sb.Append("<p class=\"none\">").Append(E(empty)).Append("</p>\n"); return; }
        sb.Append("<ul>\n");
        foreach (var item in items) sb.Append("<li>").Append(E(item)).Append("</li>\n");
        sb.Append("</ul>\n");
    }

    private static string E(string text) => WebUtility.HtmlEncode(text);
}
