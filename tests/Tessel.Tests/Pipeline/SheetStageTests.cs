using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Pipeline;

public class SheetStageTests
{
    private static Job WithFolds(string mountain, string valley) => JobLoader.Parse($$"""
        { "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } },
          "fabrication": { "material": "card", "foldMethod": { "mountain": "{{mountain}}", "valley": "{{valley}}" } } }
        """, "folds.json", Path.GetTempPath());

    [Fact]
    public void MaterialFoldMethodLeavesThePresetsChoice()
    {
        // Card: the scored side ends up on the outside of a fold, so valleys are scored from the back
        // (common practice, no source; docs/reference/fabrication.md).
        var settings = SheetStage.SettingsFor(WithFolds("material", "material"));
        Assert.Equal(FoldMethod.Score, settings.MethodFor(CreaseRole.Mountain));
        Assert.Equal(FoldMethod.ScoreFromBack, settings.MethodFor(CreaseRole.Valley));
        Assert.True(settings.NeedsBackJob);
    }

    [Fact]
    public void ExplicitFoldMethodsOverrideThePreset()
    {
        var settings = SheetStage.SettingsFor(WithFolds("perforate", "score"));
        Assert.Equal(FoldMethod.Perforate, settings.MethodFor(CreaseRole.Mountain));
        Assert.Equal(FoldMethod.Score, settings.MethodFor(CreaseRole.Valley));
        Assert.False(settings.NeedsBackJob);
    }

    [Fact]
    public void UnknownMaterialNamesTheField()
    {
        var job = WithFolds("material", "material");
        var bad = job with { Fabrication = job.Fabrication with { Material = "vinyl" } };
        var e = Assert.Throws<JobError>(() => SheetStage.SettingsFor(bad));
        Assert.Equal("fabrication.material", e.Where);
    }

    [Fact]
    public void LoaderRefusesAnUnknownMaterialWithASuggestion()
    {
        var e = Assert.Throws<JobError>(() => JobLoader.Parse("""
            { "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } }, "fabrication": { "material": "cardd" } }
            """, "m.json", Path.GetTempPath()));
        Assert.Equal("fabrication.material", e.Where);
        Assert.Contains("card", e.Problem);
    }
}
