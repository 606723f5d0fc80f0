namespace Tessel.Core.Sheets;

/// <summary>What the annotation strip of a sheet says besides the legend and the print checks.</summary>
/// <param name="JobName">The job's name as the user gave it (unknown characters show as boxes).</param>
/// <param name="SheetCount">How many sheets the job has, for "SHEET 2 OF 5".</param>
/// <param name="ScaleText">The model scale, e.g. "1:100".</param>
/// <param name="TextHeightMm">Capital height of the annotation text; cautions use 0.8 of it.</param>
/// <param name="IncludeCautions">Print the safety cautions (leave on unless a cover sheet carries them).</param>
public sealed record AnnotationContent(
    string JobName,
    int SheetCount,
    string ScaleText,
    double TextHeightMm = 2.5,
    bool IncludeCautions = true);
