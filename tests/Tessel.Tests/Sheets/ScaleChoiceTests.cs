using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Sheets;

/// <summary>"scale": "auto" on flat patterns simple enough to work by hand.</summary>
public class ScaleChoiceTests
{
    /// <summary>One rectangular facet, <paramref name="w"/> x <paramref name="d"/> metres.</summary>
    private static FlatPattern Rectangle(double w, double d)
    {
        double[] xyz = [0, 0, 0, w, 0, 0, w, d, 0, 0, d, 0];
        var mesh = new CreaseMesh("test", xyz, [[0, 1, 2, 3]], [VertexLayer.Top, VertexLayer.Top, VertexLayer.Top, VertexLayer.Top],
            (_, _) => CreaseRole.Flat);
        return new FlatPattern(mesh, [0, 0, w, 0, w, d, 0, d], new double[mesh.EdgeCount]);
    }

    // An invented job: a plain card panel on A4, scale left to Tessel.
    private static Job Auto(int maxSheets = 1) => JobLoader.Parse($$"""
        { "name": "signal-box-panel", "target": { "kind": "plane", "footprint": { "width": 3, "depth": 2 } },
          "fabrication": { "scale": "auto", "maxSheets": {{maxSheets}}, "material": "card", "sheet": { "name": "A4" } } }
        """, "panel.json", Path.GetTempPath());

    [Fact]
    public void LoaderReadsAutoAndMaxSheets()
    {
        var job = Auto(3);
        Assert.True(job.Fabrication.AutoScale);
        Assert.Equal(3, job.Fabrication.MaxSheets);
        Assert.True(double.IsNaN(job.Fabrication.Scale));
        var e = Assert.Throws<JobError>(() => JobLoader.Parse("""{ "target": { "kind": "plane", "footprint": { "width": 3, "depth": 2 } }, "fabrication": { "scale": "big" } }""", "x.json", "."));
        Assert.Equal("fabrication.scale: must be a number or \"auto\" (got \"big\")", e.Message);
        e = Assert.Throws<JobError>(() => JobLoader.Parse("""{ "target": { "kind": "plane", "footprint": { "width": 3, "depth": 2 } }, "fabrication": { "maxSheets": 0 } }""", "x.json", "."));
        Assert.Equal("fabrication.maxSheets", e.Where);
    }

    [Fact]
    public void ThreeByTwoMetrePanelOnA4IsOneToTwenty()
    {
        // Worked by hand: A4 landscape 297 x 210 mm less 8 mm margins leaves 281 mm across. At 1:10 the
        // panel is 300 x 200 mm, too long in either turning; at 1:20 it is 150 x 100 mm, which fits as long
        // as the annotation strip leaves 100 mm of height (checked below). Card is 0.4 mm thick, so facets
        // need 4 mm; the panel's 2 m side is 100 mm at 1:20.
        var job = Auto();
        var settings = SheetStage.PlannedSettings(job with { Fabrication = job.Fabrication with { Scale = 20 } });
        Assert.Equal(281, settings.Sheet.WidthMm - 2 * settings.MarginMm, 6);
        Assert.True(settings.Sheet.HeightMm - 2 * settings.MarginMm - settings.AnnotationStripMm - settings.SpacingMm >= 100,
            "precondition of the hand calculation: 100 mm of height above the strip");
        var chosen = SheetStage.ResolveScale(job, Rectangle(3, 2), ProgressReporter.Silent);
        Assert.Equal(20, chosen.Fabrication.Scale);
        Assert.StartsWith("1:20: the parts fit 1 of 1 A4 sheet and the narrowest facet is 100 mm, at least 10 x the 0.4 mm card (4 mm); at 1:10 the parts", chosen.Fabrication.ScaleReason);
    }

    [Fact]
    public void NarrowFacetThatOnlyFitsAtOneToTwentyIsExplained()
    {
        // Worked by hand: a 3 m x 30 mm facet. Facets need 4 mm, so 30 mm / n >= 4 mm gives n <= 7.5 (1:5
        // at most); but a single facet cannot be split, and 3000 / n <= 281 mm needs n >= 10.7, so 1:20 is
        // the largest scale that fits, with a 1.5 mm facet. No scale meets both: the reason says so.
        var chosen = SheetStage.ResolveScale(Auto(), Rectangle(3, 0.03), ProgressReporter.Silent);
        Assert.Equal(20, chosen.Fabrication.Scale);
        Assert.Contains("no common scale gives facets of 10 x the 0.4 mm card (4 mm) on 1 sheet: the narrowest facet is 1.5 mm here", chosen.Fabrication.ScaleReason);
        Assert.Contains("fabrication.maxSheets", chosen.Fabrication.ScaleReason);
    }

    [Fact]
    public void NarrowestFacetIsTheSmallerSideOfARectangle()
    {
        Assert.Equal(0.03, ScaleChooser.NarrowestFacetMetres(Rectangle(3, 0.03)), 12);
        Assert.Equal(2, ScaleChooser.NarrowestFacetMetres(Rectangle(3, 2)), 12);
    }

    [Fact]
    public void AScaleGivenAsANumberIsKept()
    {
        var job = Auto() with { Fabrication = Auto().Fabrication with { AutoScale = false, Scale = 75 } };
        Assert.Same(job, SheetStage.ResolveScale(job, Rectangle(3, 2), ProgressReporter.Silent));
    }
}
