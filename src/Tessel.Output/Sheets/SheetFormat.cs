using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Everything a build needs to know about one sheet file format; <see cref="SheetFormats.All"/>
/// lists them, and the build, the command line, the tests and the docs read that table.</summary>
/// <param name="Name">Lower-case format name, e.g. "svg".</param>
/// <param name="FileExtension">File extension with the dot, e.g. ".svg".</param>
/// <param name="OutputsFlag">The field of the job's <c>outputs</c> section that switches the format on.</param>
/// <param name="IsWanted">Reads that field from a loaded job's outputs.</param>
/// <param name="CarriesCover">True when the cover (the assembly guide) is written in this format too.</param>
/// <param name="OneFilePerSheet">True: one file per sheet (<c>sheets/sheet-NN.ext</c>, cover as
/// <c>sheets/cover.ext</c>); false: one multi-page file <c>sheets/sheets.ext</c>, cover first.</param>
/// <param name="ForPrinting">True when the file goes to a printer and takes the print line weights;
/// false when it goes to a cutter and keeps hairlines.</param>
/// <param name="CreateWriter">Makes the writer for one build.</param>
public sealed record SheetFormat(
    string Name,
    string FileExtension,
    string OutputsFlag,
    Func<OutputsSpec, bool> IsWanted,
    bool CarriesCover,
    bool OneFilePerSheet,
    bool ForPrinting,
    Func<SheetWriterOptions, ISheetWriter> CreateWriter)
{
    /// <summary>Base name of the multi-page file when <see cref="OneFilePerSheet"/> is false.</summary>
    public const string MultiPageBaseName = "sheets";

    /// <summary>The files of this format for one build, as paths under the output folder with the sheets
    /// each holds, in the order they are written.</summary>
    public IEnumerable<(string Path, IReadOnlyList<Sheet> Sheets)> Files(Sheet cover, IReadOnlyList<Sheet> sheets)
    {
        if (!OneFilePerSheet)
        {
            yield return ($"sheets/{MultiPageBaseName}{FileExtension}", CarriesCover ? [cover, .. sheets] : [.. sheets]);
            yield break;
        }
        if (CarriesCover) yield return ($"sheets/cover{FileExtension}", [cover]);
        foreach (var sheet in sheets) yield return ($"sheets/{SheetFiles.BaseName(sheet)}{FileExtension}", [sheet]);
    }
}

/// <summary>What a build tells a sheet writer when it makes one.</summary>
/// <param name="JobName">The job's name, for document titles; null outside a build.</param>
/// <param name="PngDpi">Raster resolution, for raster formats.</param>
public sealed record SheetWriterOptions(string? JobName, int PngDpi);
