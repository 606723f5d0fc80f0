using System.Text;

namespace Tessel.Output.Report;

/// <summary>Writes the report's files into a folder: the HTML page, the Markdown summary and the PNG
/// previews, each through a temporary file and a rename so no reader sees a half-written file.</summary>
public static class ReportFiles
{
    /// <summary>File names written by <see cref="WriteAll"/>, in the order written.</summary>
    public static readonly string[] Names =
        ["report.html", "summary.md", "preview-model.png", "preview-pattern.png", "preview-tradeoff.png", "preview-convergence.png"];

    /// <summary>Writes every report file into <paramref name="folder"/> (created if missing) and returns their paths.</summary>
    public static string[] WriteAll(string folder, ReportModel model)
    {
        model.Validate();
        Directory.CreateDirectory(folder);
        var preview = FoldedModelPreview.Render(model);
        byte[][] contents =
        [
            Encoding.UTF8.GetBytes(HtmlReportWriter.Render(model)),
            Encoding.UTF8.GetBytes(MarkdownSummaryWriter.Render(model)),
            preview.Image.Png,
            CreasePatternPreview.Render(model).Png,
            ParetoPlot.Render(model.ParetoFront).Png,
            ConvergencePlot.Render(model.Convergence).Png,
        ];
        var paths = new string[Names.Length];
        for (int i = 0; i < Names.Length; i++)
        {
            paths[i] = Path.Combine(folder, Names[i]);
            WriteAtomically(paths[i], contents[i]);
        }
        return paths;
    }

    /// <summary>Writes bytes to a temporary name beside <paramref name="path"/>, then renames it over the target.</summary>
    public static void WriteAtomically(string path, byte[] bytes)
    {
        string full = Path.GetFullPath(path);
        string temp = Path.Combine(Path.GetDirectoryName(full)!, "." + Path.GetFileName(full) + ".tmp");
        File.WriteAllBytes(temp, bytes);
        File.Move(temp, full, overwrite: true);
    }
}
