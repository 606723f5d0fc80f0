namespace Tessel.Core.Sheets;

/// <summary>What the annotation strip of a sheet says besides the legend and the print checks.</summary>
/// <param name="JobName">The job's name as the user gave it (unknown characters show as boxes).</param>
/// <param name="SheetCount">How many sheets the job has, for "SHEET 2 OF 5".</param>
/// <param name="ScaleText">The model scale, e.g. "1:100".</param>
/// <param name="TextHeightMm">Capital height of the annotation text; cautions use 0.8 of it.</param>
/// <param name="IncludeCautions">Print the safety cautions (leave on unless a cover sheet carries them).</param>
/// <param name="Heading">The title's second line; null for "SHEET n OF N - side" (part sheets).</param>
/// <param name="KeyNotes">Lines printed under the legend's line samples, e.g. where the back job is.</param>
/// <param name="CautionLine">Print the one-line caution (<see cref="SheetAnnotations.CautionLine"/>).</param>
public sealed record AnnotationContent(
    string JobName,
    int SheetCount,
    string ScaleText,
    double TextHeightMm = 2.5,
    bool IncludeCautions = true,
    string? Heading = null,
    IReadOnlyList<string>? KeyNotes = null,
    bool CautionLine = false);
