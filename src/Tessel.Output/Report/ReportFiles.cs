using System.Text;

namespace Tessel.Output.Report;

/// <summary>Writes the report's files into a folder: the HTML page, the Markdown summary and the PNG
/// previews, each through a temporary file and a rename so no reader sees a half-written file.</summary>
public static class ReportFiles
{
    /// <summary>File names <see cref="WriteAll"/> may write, in the order written (the trade-off and
    /// convergence plots only when the model has their data).</summary>
    public static readonly string[] Names =
        ["report.html", "summary.md", "preview-model.png", "preview-pattern.png", "preview-tradeoff.png", "preview-convergence.png"];

    /// <summary>Writes every report file into <paramref name="folder"/> (created if missing) and returns their paths.</summary>
    public static string[] WriteAll(string folder, ReportModel model)
    {
        Directory.CreateDirectory(folder);
        var contents = Contents(model);
        var paths = new string[contents.Length];
        for (int i = 0; i < contents.Length; i++)
        {
            paths[i] = Path.Combine(folder, contents[i].Name);
            WriteAtomically(paths[i], contents[i].Bytes);
        }
        return paths;
    }

    /// <summary>The report's files as (name, bytes), in the order of <see cref="Names"/>, for a caller
    /// that writes them itself.</summary>
    public static (string Name, byte[] Bytes)[] Contents(ReportModel model)
    {
        model.Validate();
        var preview = FoldedModelPreview.Render(model);
        byte[]?[] contents =
        [
            Encoding.UTF8.GetBytes(HtmlReportWriter.Render(model)),
            Encoding.UTF8.GetBytes(MarkdownSummaryWriter.Render(model)),
            preview.Image.Png,
            CreasePatternPreview.Render(model).Png,
            // Plots of what was not computed are not written.
            model.ParetoFront.Length > 0 ? ParetoPlot.Render(model.ParetoFront, model.ChosenEpsilonDeg).Png : null,
            model.Convergence.Length > 0 ? ConvergencePlot.Render(model.Convergence).Png : null,
        ];
        return Names.Select((n, i) => (n, contents[i])).Where(c => c.Item2 is not null).Select(c => (c.n, c.Item2!)).ToArray();
    }

    /// <summary>Writes bytes to a temporary name beside <paramref name="path"/>, then renames it over the target.</summary>
    public static void WriteAtomically(string path, byte[] bytes) => IO.AtomicFile.Write(path, bytes);
}
