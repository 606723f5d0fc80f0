using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Pipeline;

/// <summary>The laid-out sheets with annotations, plus the layout's parts, seams and figures.</summary>
/// <param name="Sheets">Part sheets in job order, each with its title, print check and legend strip.</param>
/// <param name="Cover">A sheet with the full legend and the safety cautions.</param>
public sealed record SheetStageResult(FabricationSettings Settings, LineStyleTable Styles, SheetLayoutResult Layout,
    IReadOnlyList<Sheet> Sheets, Sheet Cover)
{
    /// <summary>Styles for the outputs meant for a printer (PDF, PNG): <see cref="Styles"/>, or with
    /// <see cref="SheetStage.HandScore"/> folds the same table at <see cref="SheetStage.PrintLineMm"/>.
    /// Files for a cutter (SVG, DXF) always keep <see cref="Styles"/> and its hairlines.</summary>
    public LineStyleTable PrintStyles { get; init; } = Styles;
}

/// <summary>Sixth stage: flat pattern -> fabrication sheets at model scale.</summary>
public static class SheetStage
{
    /// <summary>Fabrication settings from the job section (materials and sizes from the sheet stage's tables).</summary>
    /// <exception cref="JobError">An unknown material preset.</exception>
    public static FabricationSettings SettingsFor(Job job, double annotationStripMm = 0)
    {
        var f = job.Fabrication;
        if (!Materials.TryFind(f.Material, out var material))
            throw new JobError("fabrication.material", $"unknown material \"{f.Material}\"; choose one of {string.Join(", ", Materials.All.Select(m => m.Name))}");
        var size = new SheetSize(f.Sheet.Name ?? "custom", f.Sheet.WidthMm, f.Sheet.HeightMm);
        size = f.Orientation == "portrait" ? size.Portrait : size.Landscape;
        return new FabricationSettings
        {
            ScaleDenominator = f.Scale,
            Material = material,
            MountainMethod = MethodOf(f.FoldMethod.Mountain),
            ValleyMethod = MethodOf(f.FoldMethod.Valley),
            Sheet = size,
            MarginMm = f.MarginMm,
            PartGapMm = f.SpacingMm,
            KerfMm = f.KerfMm,
            TabWidthMm = f.Tab.WidthMm,
            TabTaperDegrees = f.Tab.TaperDeg,
            HairlineMm = f.HairlineMm,
            AnnotationStripMm = annotationStripMm,
        };
    }

    /// <summary>Line styles: the default table with the job's colours and pens laid over it.</summary>
    public static LineStyleTable StylesFor(Job job)
    {
        var table = LineStyleTable.Default.WithStrokeWidth(job.Fabrication.HairlineMm);
        foreach (var cls in Enum.GetValues<LineClass>())
        {
            string key = char.ToLowerInvariant(cls.ToString()[0]) + cls.ToString()[1..];
            if (job.Fabrication.Layers.TryGetValue(key, out var layer))
                table = table.With(cls, table[cls] with
                {
                    ColourHex = layer.Colour.ToUpperInvariant(),
                    DxfColourIndex = layer.Pen,
                    Operation = layer.Operation switch
                    {
                        "cut" => LineOperation.Cut,
                        "score" => LineOperation.Score,
                        "mark" => LineOperation.Mark,
                        _ => LineOperation.DrawOnly,
                    },
                });
        }
        return table;
    }

    /// <summary>Job-file fold method for hand work: the fold is drawn on the front sheet (no back job) and
    /// the printed files use <see cref="PrintLineMm"/> so that it can be seen and scored along a rule.</summary>
    public const string HandScore = "hand-score";

    /// <summary>Line width of printed sheets for hand scoring: 0.35 mm, a usual ISO 128-20 line width that
    /// stays legible on an office print (hairlines of 0.05 mm print faint or not at all); the dash unit
    /// follows it, as ISO 128-20 states dash lengths in multiples of the line width.</summary>
    public const double PrintLineMm = 0.35;

    /// <summary>The settings the layout runs with: <see cref="SettingsFor"/> with room kept for the
    /// annotation strip, as tall as the tallest sheet needs (a front and a back job carry a note about
    /// each other).</summary>
    public static FabricationSettings PlannedSettings(Job job)
    {
        var styles = StylesFor(job);
        var plain = SettingsFor(job);
        var stripContent = StripContent(job);
        double stripWidth = plain.Sheet.WidthMm - 2 * plain.MarginMm;
        var classes = new[] { LineClass.CutOutline, LineClass.Mountain, LineClass.Valley, LineClass.FlatCrease, LineClass.TabFold, LineClass.Label };
        string[] fileTypes = FileTypes(job);
        var sample = new Sheet(1, plain.Sheet.WidthMm, plain.Sheet.HeightMm, []);
        double strip = new[] { sample, sample with { Side = "back" } }
            .Select(s => SheetAnnotations.RequiredStripHeight(stripWidth,
                stripContent with { KeyNotes = plain.NeedsBackJob ? PairNotes(s, plain, fileTypes) : null }, styles, classes))
            .Max();
        if (BoardSettings(job, plain) is { } boards)
            strip = Math.Max(strip, new[] { ThickPanels.BoardsSide, BoardOnFabric.FabricSide }.Max(side => SheetAnnotations.RequiredStripHeight(stripWidth,
                stripContent with { KeyNotes = BoardOnFabric.Notes(sample with { Side = side }, boards, fileTypes) }, styles, classes)));
        return SettingsFor(job, strip);
    }

    private static AnnotationContent StripContent(Job job) =>
        new(job.Name, 1, $"1:{job.Fabrication.Scale:0.###}", IncludeCautions: false, CautionLine: true);

    /// <summary>For <c>"scale": "auto"</c>: the job at the chosen scale, with the reason in
    /// <see cref="FabricationSpec.ScaleReason"/>; any other job unchanged.</summary>
    public static Job ResolveScale(Job job, FlatPattern flat, ProgressReporter progress)
    {
        if (!job.Fabrication.AutoScale) return job;
        progress.Stage("scale", $"choosing a common scale for {Wording.Count(job.Fabrication.MaxSheets, "sheet")} of {job.Fabrication.Sheet.Name ?? "custom"}");
        Job At(double n) => job with { Fabrication = job.Fabrication with { Scale = n } };
        var choice = ScaleChooser.Choose(flat, n => PlannedSettings(At(n)), job.Fabrication.MaxSheets,
            (f, settings) => SheetLayout.Lay(f, settings).Sheets.Select(s => s.Number).Distinct().Count());
        progress.Step(choice.Reason);
        return job with { Fabrication = job.Fabrication with { Scale = choice.Denominator, ScaleReason = choice.Reason } };
    }

    public static SheetStageResult Run(Job job, FlatPattern flat, ProgressReporter progress)
    {
        progress.Stage("sheets", $"laying out at 1:{job.Fabrication.Scale:0.###} on {job.Fabrication.Sheet.Name ?? "custom"} sheets");
        var styles = StylesFor(job);
        var stripContent = StripContent(job);
        string[] fileTypes = FileTypes(job);
        var settings = PlannedSettings(job);
        // Perforation dashes stay on their fold's layer (so the maker still sees mountain from valley);
        // that layer then has to be cut through, not scored.
        foreach (var (role, cls) in new[] { (CreaseRole.Mountain, LineClass.Mountain), (CreaseRole.Valley, LineClass.Valley) })
            if (settings.MethodFor(role) == FoldMethod.Perforate) styles = styles.WithOperation(cls, LineOperation.Cut);

        SheetLayoutResult layout;
        try { layout = SheetLayout.Lay(flat, settings); }
        catch (Exception e) when (e is ArgumentException or InvalidOperationException)
        {
            throw new JobError("fabrication.sheet", $"{e.Message}; choose a larger sheet, smaller margins or tabs, or a smaller scale (larger fabrication.scale)");
        }
        int sheetCount = layout.Sheets.Select(s => s.Number).Distinct().Count();
        var content = stripContent with { SheetCount = sheetCount };
        bool twoJobs = layout.Sheets.Any(s => s.Side != "front");
        var annotated = layout.Sheets
            .Select(s => SheetAnnotations.AddToStrip(s, settings.AnnotationStrip,
                content with { KeyNotes = twoJobs ? PairNotes(s, settings, fileTypes) : null }, styles).Sheet)
            .ToArray();
        var cover = AssemblyGuide.Cover(settings.Sheet.WidthMm, settings.Sheet.HeightMm, settings.MarginMm,
            content with { IncludeCautions = true, CautionLine = false }, styles, layout, flat, fileTypes).Sheet;
        if (BoardSettings(job, settings) is { } board)
        {
            var made = BoardOnFabric.Build(flat, layout, board);
            annotated = [.. annotated, .. made.Boards.Concat(made.Fabric).Select(s => SheetAnnotations.AddToStrip(s, settings.AnnotationStrip,
                content with { KeyNotes = BoardOnFabric.Notes(s, board, fileTypes) }, styles).Sheet)];
            layout = layout with { Figures = layout.Figures with { Warnings = [.. layout.Figures.Warnings, .. made.Warnings] } };
        }
        var fig = layout.Figures;
        progress.Step($"{Wording.Count(fig.PartCount, "part")} on {Wording.Count(fig.SheetCount, "sheet")}, {Wording.Count(layout.Seams.Length, "seam")}, laser about {fig.EstimatedLaserSeconds / 60:0.#} min");
        bool byHand = job.Fabrication.FoldMethod.Mountain == HandScore || job.Fabrication.FoldMethod.Valley == HandScore;
        var print = byHand ? styles.WithStrokeWidth(PrintLineMm).WithDashUnit(PrintLineMm) : styles;
        return new SheetStageResult(settings, styles, layout, annotated, cover) { PrintStyles = print };
    }

    /// <summary>Thick-panel settings of a board-on-fabric job (fabrication.boardOnFabric); null for any other job.</summary>
    public static ThickPanelSettings? BoardSettings(Job job, FabricationSettings settings) =>
        job.Fabrication.BoardOnFabric is { } b
            ? new ThickPanelSettings(b.BoardThicknessMm, b.FabricSide == "top" ? HingeSide.Top : HingeSide.Bottom, b.HingeGapMm, settings.KerfMm)
            : null;

    /// <summary>File extensions written for each sheet job, in the order the writers run.</summary>
    public static string[] FileTypes(Job job) =>
        new[] { (job.Outputs.Svg, ".svg"), (job.Outputs.Dxf, ".dxf"), (job.Outputs.Png, ".png") }
            .Where(t => t.Item1).Select(t => t.Item2).ToArray();

    /// <summary>What a front job says about its back job and the other way round, so that someone who
    /// prints or cuts one file learns that the other exists and which it is.</summary>
    public static string[] PairNotes(Sheet sheet, FabricationSettings settings, IReadOnlyList<string> fileTypes)
    {
        string types = fileTypes.Count == 0 ? "" : " (" + string.Join(" ", fileTypes) + ")";
        var onBack = new List<string>();
        if (settings.MethodFor(CreaseRole.Mountain) == FoldMethod.ScoreFromBack) onBack.Add("mountain");
        if (settings.MethodFor(CreaseRole.Valley) == FoldMethod.ScoreFromBack) onBack.Add("valley");
        if (settings.TabFoldMethod == FoldMethod.ScoreFromBack) onBack.Add("glue tab");
        string what = onBack.Count == 0 ? "the labels" : string.Join(" and ", onBack) + " folds" + (settings.LabelsOnBack ? " and the labels" : "");
        var front = sheet with { Side = "front" };
        var back = sheet with { Side = "back" };
        return sheet.Side == "front"
            ? [$"BACK JOB: {what} are in {SheetFiles.BaseName(back)}{types}, run first; this front job shows only the rest. See the cover."]
            : [$"BACK JOB of {SheetFiles.BaseName(front)}: run first, then turn the sheet over left to right onto the same corner stop for {SheetFiles.BaseName(front)}. See the cover."];
    }

    /// <summary>The job's fold method; null ("material") leaves the material preset's choice.</summary>
    private static FoldMethod? MethodOf(string method) => method switch
    {
        "score" => FoldMethod.Score,
        "perforate" => FoldMethod.Perforate,
        "two-sided" => FoldMethod.ScoreFromBack,
        HandScore => FoldMethod.Score,
        _ => null,
    };
}
