using Tessel.Core.Jobs;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Pipeline;

/// <summary>The laid-out sheets with annotations, plus the layout's parts, seams and figures.</summary>
/// <param name="Sheets">Part sheets in job order, each with its title, print check and legend strip.</param>
/// <param name="Cover">A sheet with the full legend and the safety cautions.</param>
public sealed record SheetStageResult(FabricationSettings Settings, LineStyleTable Styles, SheetLayoutResult Layout,
    IReadOnlyList<Sheet> Sheets, Sheet Cover);

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

    public static SheetStageResult Run(Job job, FlatPattern flat, ProgressReporter progress)
    {
        progress.Stage("sheets", $"laying out at 1:{job.Fabrication.Scale:0.###} on {job.Fabrication.Sheet.Name ?? "custom"} sheets");
        var styles = StylesFor(job);
        var plain = SettingsFor(job);
        var stripContent = new AnnotationContent(job.Name, 1, $"1:{job.Fabrication.Scale:0.###}", IncludeCautions: false);
        double stripWidth = plain.Sheet.WidthMm - 2 * plain.MarginMm;
        var classes = new[] { LineClass.CutOutline, LineClass.Mountain, LineClass.Valley, LineClass.TabFold, LineClass.Label };
        double strip = SheetAnnotations.RequiredStripHeight(stripWidth, stripContent, styles, classes);
        var settings = SettingsFor(job, strip);
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
        var annotated = layout.Sheets
            .Select(s => SheetAnnotations.AddToStrip(s, settings.AnnotationStrip, content, styles).Sheet)
            .ToArray();
        var used = layout.Sheets.SelectMany(s => s.Lines.Select(l => l.Class)).Distinct().ToArray();
        var cover = SheetAnnotations.CoverSheet(0, settings.Sheet.WidthMm, settings.Sheet.HeightMm, settings.MarginMm,
            content with { IncludeCautions = true }, styles, used).Sheet;
        var fig = layout.Figures;
        progress.Step($"{Wording.Count(fig.PartCount, "part")} on {Wording.Count(fig.SheetCount, "sheet")}, {Wording.Count(layout.Seams.Length, "seam")}, laser about {fig.EstimatedLaserSeconds / 60:0.#} min");
        return new SheetStageResult(settings, styles, layout, annotated, cover);
    }

    /// <summary>The job's fold method; null ("material") leaves the material preset's choice.</summary>
    private static FoldMethod? MethodOf(string method) => method switch
    {
        "score" => FoldMethod.Score,
        "perforate" => FoldMethod.Perforate,
        "two-sided" => FoldMethod.ScoreFromBack,
        _ => null,
    };
}
