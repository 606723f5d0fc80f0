using Tessel.Core.Model;

namespace Tessel.Core.Jobs;

/// <summary>The job's <c>fabrication</c> section: scale, material, sheets and line styles.</summary>
/// <param name="Scale">n of the model scale 1:n.</param>
/// <param name="Material">Material preset name (resolved by the sheet stage).</param>
/// <param name="FoldMethod">How mountain and valley folds are made.</param>
/// <param name="Sheet">Sheet size.</param>
/// <param name="Orientation">portrait, landscape or auto.</param>
/// <param name="MarginMm">Empty border kept on every sheet.</param>
/// <param name="SpacingMm">Gap between parts.</param>
/// <param name="KerfMm">Width of material the cutter removes.</param>
/// <param name="Tab">Glue tab shape.</param>
/// <param name="HairlineMm">Stroke width of cut and fold lines.</param>
/// <param name="Layers">Line class (camelCase name of a <see cref="LineClass"/>) to style; always holds every class.</param>
public sealed record FabricationSpec(
    double Scale,
    string Material,
    FoldMethodSpec FoldMethod,
    SheetSpec Sheet,
    string Orientation,
    double MarginMm,
    double SpacingMm,
    double KerfMm,
    TabSpec Tab,
    double HairlineMm,
    IReadOnlyDictionary<string, LayerStyle> Layers)
{
    /// <summary>The job asked for <c>"scale": "auto"</c>: the sheet stage chooses <see cref="Scale"/> from the
    /// common architectural scales; until then <see cref="Scale"/> is NaN.</summary>
    public bool AutoScale { get; init; }

    /// <summary>With <see cref="AutoScale"/>, once chosen: which scale and why, for the summary.</summary>
    public string? ScaleReason { get; init; }

    /// <summary>Most sheets an automatic scale may use (fabrication.maxSheets).</summary>
    public int MaxSheets { get; init; } = 1;

    /// <summary>fabrication.boardOnFabric: board and fabric sheets besides the crease sheets; null when absent.</summary>
    public BoardOnFabricSpec? BoardOnFabric { get; init; }
}

/// <summary>Board-on-fabric output: board thickness and least hinge gap at model scale, and which face of the
/// boards the fabric is glued to ("top" or "bottom").</summary>
public sealed record BoardOnFabricSpec(double BoardThicknessMm, double HingeGapMm, string FabricSide);

/// <summary>score, perforate or two-sided, for each fold direction.</summary>
public sealed record FoldMethodSpec(string Mountain, string Valley);

/// <summary>A named sheet size (ISO 216 or US) or an explicit size; <see cref="WidthMm"/> and
/// <see cref="HeightMm"/> are always filled (portrait, width &lt;= height for named sizes).</summary>
public sealed record SheetSpec(string? Name, double WidthMm, double HeightMm);

/// <summary>Glue tab width (a handling size, not scaled) and end taper.</summary>
public sealed record TabSpec(double WidthMm, double TaperDeg);

/// <summary>How one line class is drawn and sent to the cutter: colour (#rrggbb), pen number (also the
/// DXF colour index) and operation (cut, score, mark or draw-only).</summary>
public sealed record LayerStyle(string Colour, int Pen, string Operation);
