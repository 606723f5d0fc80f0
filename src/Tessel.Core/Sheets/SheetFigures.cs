using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Line lengths of one fold class over all sheets.</summary>
/// <param name="Class">Mountain, Valley or TabFold.</param>
/// <param name="Method">How the folds of this class are made.</param>
/// <param name="CreaseLengthMm">Total fold length drawn (seam edges not included).</param>
/// <param name="ScoreLengthMm">Part scored (front or back).</param>
/// <param name="PerforationCutLengthMm">Through-cut length of the perforation dashes and slots.</param>
public sealed record FoldFigures(LineClass Class, FoldMethod Method, double CreaseLengthMm, double ScoreLengthMm, double PerforationCutLengthMm);

/// <summary>Totals, estimates and warnings for a layout. Laser times use the material's speeds
/// (starting values, [M]) and ignore acceleration and piercing, so treat them as a lower bound.</summary>
public sealed record SheetFigures
{
    /// <summary>All through-cuts: outlines, inner cuts and perforation dashes.</summary>
    public double TotalCutLengthMm { get; init; }
    public double OutlineCutLengthMm { get; init; }
    public double InnerCutLengthMm { get; init; }
    /// <summary>Scores on front and back jobs.</summary>
    public double ScoreLengthMm { get; init; }
    public double BackScoreLengthMm { get; init; }
    public double PerforationCutLengthMm { get; init; }
    /// <summary>Head travel with the beam off, from the sheet corner through every line in job order.</summary>
    public double TravelLengthMm { get; init; }
    public double EstimatedLaserSeconds { get; init; }
    public FoldFigures[] Folds { get; init; } = [];
    public int SheetCount { get; init; }
    public int PartCount { get; init; }
    /// <summary>Per sheet: area inside part outlines over the usable area (inside the margins, above the annotation strip).</summary>
    public double[] Utilisation { get; init; } = [];
    public string[] SeamCodes { get; init; } = [];
    /// <summary>Facets narrower than the material's minimum (10 t).</summary>
    public int NarrowFacetCount { get; init; }
    /// <summary>Perforated creases too short for two cut/bridge cycles (made a slot or a score).</summary>
    public int ShortPerforationCount { get; init; }
    /// <summary>Tabs that overlap their own part or another tab of it.</summary>
    public int OverlappingTabCount { get; init; }
    /// <summary>Edges whose flat length differs from the folded one by more than the material takes.</summary>
    public int StrainedEdgeCount { get; init; }
    public string[] Warnings { get; init; } = [];
}
