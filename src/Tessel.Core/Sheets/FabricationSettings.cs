using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Sheets;

/// <summary>Everything the sheet stage needs besides the flat pattern. Lengths in mm at model scale
/// unless named otherwise. Defaults are starting values (docs/reference/fabrication.md, [M]).</summary>
public sealed record FabricationSettings
{
    /// <summary>n of the model scale 1:n (100 means 1 m full scale becomes 10 mm).</summary>
    public double ScaleDenominator { get; init; } = 100;
    /// <summary>Sheet material; gives thickness, default fold methods, perforation and laser speeds.</summary>
    public Material Material { get; init; } = Materials.Card;
    /// <summary>How to make mountain folds; null takes the material's default.</summary>
    public FoldMethod? MountainMethod { get; init; }
    /// <summary>How to make valley folds; null takes the material's default.</summary>
    public FoldMethod? ValleyMethod { get; init; }
    /// <summary>How to make the fold at the root of a glue tab.</summary>
    public FoldMethod TabFoldMethod { get; init; } = FoldMethod.Score;
    /// <summary>Sheet (or laser bed) to lay out on, in the orientation given.</summary>
    public SheetSize Sheet { get; init; } = SheetSizes.A4;
    /// <summary>Clear border on every side of the sheet (printer margins, bed clamps).</summary>
    public double MarginMm { get; init; } = 8;
    /// <summary>Gap between parts on top of the kerf: parts end up at least kerf + this apart.</summary>
    public double PartGapMm { get; init; } = 1.5;
    /// <summary>Laser kerf; outlines are offset outward by half of it so parts come out true to size.</summary>
    public double KerfMm { get; init; } = 0.2;
    /// <summary>Glue tab width (a handling size: not scaled); capped near 1/3 of the mating facet width.</summary>
    public double TabWidthMm { get; init; } = 7;
    /// <summary>Angle between a tab's end and its fold line, 30-45 deg; never more than the mating facet's corner angle.</summary>
    public double TabTaperDegrees { get; init; } = 40;
    /// <summary>Stroke width the writers use for every line.</summary>
    public double HairlineMm { get; init; } = 0.05;
    /// <summary>Height of seam codes and part numbers; shrunk to fit short edges.</summary>
    public double LabelHeightMm { get; init; } = 2.5;

    /// <summary>Height kept free of parts along the bottom of every sheet, inside the margins, for the
    /// writers' title, scale bar, legend and cautions (0 = none: put those on a cover sheet).</summary>
    public double AnnotationStripMm { get; init; }

    /// <summary>The strip kept free for annotations on every front sheet (height 0 when none).</summary>
    public SheetRegion AnnotationStrip =>
        new(MarginMm, Sheet.HeightMm - MarginMm - AnnotationStripMm, Sheet.WidthMm - 2 * MarginMm, AnnotationStripMm);

    /// <summary>Put seam codes, part numbers and arrows on the back (the hidden side of the glued model)
    /// in the mirrored back job, laid out to read from the back; needs two-sided work.</summary>
    public bool LabelsOnBack { get; init; }

    /// <summary>Which way the stock's grain runs; parts are then turned so their longest crease family
    /// follows it ([CP], docs/reference/fabrication.md), where they fit that way.</summary>
    public GrainDirection Grain { get; init; } = GrainDirection.Any;

    /// <summary>Least distance between two parts' cut outlines.</summary>
    public double SpacingMm => KerfMm + PartGapMm;

    /// <summary>Model millimetres per metre at full scale.</summary>
    public double MillimetresPerMetre => 1000.0 / ScaleDenominator;

    /// <summary>The fold method for a crease role, or null for roles that are not folded (boundary, flat).</summary>
    public FoldMethod? MethodFor(CreaseRole role) => role switch
    {
        CreaseRole.Mountain => MountainMethod ?? Material.MountainMethod,
        CreaseRole.Valley => ValleyMethod ?? Material.ValleyMethod,
        _ => null,
    };

    /// <summary>True when some fold is scored from the back or labels go on the back, so a mirrored back job is needed.</summary>
    public bool NeedsBackJob =>
        MethodFor(CreaseRole.Mountain) == FoldMethod.ScoreFromBack
        || MethodFor(CreaseRole.Valley) == FoldMethod.ScoreFromBack
        || TabFoldMethod == FoldMethod.ScoreFromBack
        || LabelsOnBack;

    /// <summary>Clear zone around every vertex where a perforation must not cut: max(1 mm, 2 t).</summary>
    public double PerforationVertexZoneMm => Math.Max(1.0, 2 * Material.ThicknessMm);
}
