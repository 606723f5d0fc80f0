using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>The user-editable table that says, for every <see cref="LineClass"/>, its colour, layer,
/// display dash pattern and cut/score meaning, plus the stroke width. Immutable: the With* methods
/// return a changed copy.</summary>
/// <remarks>
/// Dash proportions follow the ISO 128-20 line types (dashed: dash 12d gap 3d; long-dash dotted:
/// 24d, 3d, 0.5d, 3d; long-dash double-dotted: 24d, 3d, 0.5d, 3d, 0.5d, 3d). The unit d is
/// <see cref="DashUnitMm"/> (0.25 mm by default, a usual ISO 128 line width) rather than the hairline
/// stroke itself: dashes of 12 x 0.05 mm would print as a grey blur indistinguishable from a solid
/// line. Dashes are for display (SVG, PDF, PNG) only; a perforated crease already arrives as
/// separate segments from the layout stage, and cutters ignore display dashes.
/// Default colours are our own and are chosen so that the classes stay apart on a greyscale print:
/// continuous classes differ in grey level by at least 40 (of 255), and dashed classes differ in pattern.
/// </remarks>
public sealed class LineStyleTable
{
    /// <summary>Default stroke width: a hairline, as laser drivers expect for vector lines.</summary>
    public const double DefaultStrokeWidthMm = 0.05;

    /// <summary>Default dash unit d for the ISO 128-20 proportions.</summary>
    public const double DefaultDashUnitMm = 0.25;

    /// <summary>Layer order in every writer: things drawn or marked first, then scores, then inner
    /// cuts, outlines last, because many laser drivers run layers in file order and the part must
    /// stay in place until its outline is cut.</summary>
    public static IReadOnlyList<LineClass> FabricationOrder { get; } =
    [
        LineClass.Annotation, LineClass.FlatCrease, LineClass.Label, LineClass.TabFold, LineClass.Valley,
        LineClass.Mountain, LineClass.CutInner, LineClass.CutOutline,
    ];

    private readonly Dictionary<LineClass, LineStyle> _styles;

    private LineStyleTable(Dictionary<LineClass, LineStyle> styles, double strokeWidthMm, double dashUnitMm)
    {
        foreach (LineClass c in Enum.GetValues<LineClass>())
        {
            if (!styles.TryGetValue(c, out LineStyle? style))
                throw new ArgumentException($"No line style for {c}.");
            style.Validate();
        }
        if (styles.Values.Select(s => s.LayerName).Distinct().Count() != styles.Count)
            throw new ArgumentException("Every line class needs its own layer name.");
        if (!(strokeWidthMm > 0) || strokeWidthMm > 5) throw new ArgumentOutOfRangeException(nameof(strokeWidthMm), strokeWidthMm, "Stroke width must be in (0, 5] mm.");
        if (!(dashUnitMm > 0) || dashUnitMm > 5) throw new ArgumentOutOfRangeException(nameof(dashUnitMm), dashUnitMm, "Dash unit must be in (0, 5] mm.");
        _styles = styles;
        StrokeWidthMm = strokeWidthMm;
        DashUnitMm = dashUnitMm;
    }

    /// <summary>Stroke width of every line, in millimetres.</summary>
    public double StrokeWidthMm { get; }

    /// <summary>The dash unit d in millimetres; dash patterns are multiples of it.</summary>
    public double DashUnitMm { get; }

    /// <summary>The style of one line class.</summary>
    public LineStyle this[LineClass lineClass] => _styles[lineClass];

    /// <summary>Tessel's default table (our own colours, layer names and dash choices).</summary>
    public static LineStyleTable Default { get; } = new(new Dictionary<LineClass, LineStyle>
    {
        // Grey levels (Rec. 601 luma) in the comments; continuous classes are 20 / 62 / 105 / 149:
        // cut outline darkest, then the notes (they carry the cautions, so they must read well).
        [LineClass.CutOutline] = new("Cut: part outline", "TS-CUT-EDGE", "#141414", 7, [], LineOperation.Cut),          // 20
        [LineClass.CutInner] = new("Cut: inside a part", "TS-CUT-HOLE", "#8B48BE", 6, [], LineOperation.Cut),           // 105
        [LineClass.Mountain] = new("Mountain fold", "TS-CREASE-MTN", "#C4391C", 1, [24, 3, 0.5, 3], LineOperation.Score),  // 95
        [LineClass.Valley] = new("Valley fold", "TS-CREASE-VLY", "#2E8FE6", 5, [12, 3], LineOperation.Score),            // 124
        [LineClass.TabFold] = new("Glue tab fold", "TS-CREASE-TAB", "#3F9A3B", 3, [24, 3, 0.5, 3, 0.5, 3], LineOperation.Score), // 116
        [LineClass.Label] = new("Label (marked)", "TS-MARK-TEXT", "#C49420", 30, [], LineOperation.Mark),                // 149
        [LineClass.Annotation] = new("Notes (print only)", "TS-NOTE-PRINT", "#34404C", 8, [], LineOperation.DrawOnly),  // 62
        // Short dashes with long gaps, unlike every fold's pattern, so a flat crease never reads as a fold on a grey print.
        [LineClass.FlatCrease] = new("Flat crease (leave unfolded)", "TS-CREASE-FLAT", "#8C8C8C", 9, [2, 4], LineOperation.DrawOnly), // 140
    }, DefaultStrokeWidthMm, DefaultDashUnitMm);

    /// <summary>A copy with one class's style replaced.</summary>
    public LineStyleTable With(LineClass lineClass, LineStyle style)
    {
        var styles = new Dictionary<LineClass, LineStyle>(_styles) { [lineClass] = style };
        return new LineStyleTable(styles, StrokeWidthMm, DashUnitMm);
    }

    /// <summary>A copy where <paramref name="lineClass"/> is cut/scored/marked as <paramref name="operation"/> says.</summary>
    public LineStyleTable WithOperation(LineClass lineClass, LineOperation operation) =>
        With(lineClass, _styles[lineClass] with { Operation = operation });

    /// <summary>A copy with another stroke width (millimetres).</summary>
    public LineStyleTable WithStrokeWidth(double strokeWidthMm) => new(new(_styles), strokeWidthMm, DashUnitMm);

    /// <summary>A copy with another dash unit d (millimetres).</summary>
    public LineStyleTable WithDashUnit(double dashUnitMm) => new(new(_styles), StrokeWidthMm, dashUnitMm);

    /// <summary>The display dash pattern of <paramref name="lineClass"/> in millimetres (empty when continuous).</summary>
    public double[] DashLengthsMm(LineClass lineClass) =>
        _styles[lineClass].DashPattern.Select(v => v * DashUnitMm).ToArray();

    /// <summary>The line classes whose lines the cutter acts on with <paramref name="operation"/>.</summary>
    public IEnumerable<LineClass> ClassesFor(LineOperation operation) =>
        FabricationOrder.Where(c => _styles[c].Operation == operation);
}
