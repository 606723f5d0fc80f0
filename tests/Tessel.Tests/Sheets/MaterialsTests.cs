using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Sheets;

public class MaterialsTests
{
    [Fact]
    public void CardThicknessFollowsTheGrammageRuleOfThumb()
    {
        // docs/reference/fabrication.md [M] (value from memory): t(mm) ~ gsm/1000 x 1.1-1.5.
        foreach (var (m, gsm) in new[] { (Materials.LightCard, 220.0), (Materials.Card, 300.0), (Materials.HeavyCard, 350.0), (Materials.PlainPaper, 80.0) })
        {
            Assert.InRange(m.ThicknessMm, gsm / 1000 * 1.1, gsm / 1000 * 1.5);
            Assert.Equal(10 * m.ThicknessMm, m.MinFacetWidthMm, 12);
        }
    }

    [Fact]
    public void PerforationStartingValuesAreInTheQuotedRanges()
    {
        // docs/reference/fabrication.md [M] (values from memory): 250-300 gsm cut 2-4 / bridge 0.5-1; 350 gsm cut 3-5 /
        // bridge 0.8-1.2; 0.5 mm polypropylene cut 2 / bridge 1.5.
        Assert.InRange(Materials.Card.PerforationCutMm, 2, 4);
        Assert.InRange(Materials.Card.PerforationBridgeMm, 0.5, 1);
        Assert.InRange(Materials.HeavyCard.PerforationCutMm, 3, 5);
        Assert.InRange(Materials.HeavyCard.PerforationBridgeMm, 0.8, 1.2);
        Assert.Equal((2.0, 1.5, 0.5), (Materials.Polypropylene.PerforationCutMm, Materials.Polypropylene.PerforationBridgeMm, Materials.Polypropylene.ThicknessMm));
        Assert.All(Materials.All, m => Assert.Equal(0.0008, m.StrainLimit));
        Assert.True(Materials.TryFind("PP-SHEET", out var pp));
        Assert.Same(Materials.Polypropylene, pp);
        Assert.False(Materials.TryFind("balsa", out _));
    }

    [Fact]
    public void SettingsResolveFoldMethodsAndVertexZone()
    {
        var s = new FabricationSettings { Material = Materials.Card };
        // Scored side ends up convex (docs/reference/fabrication.md [CP]): mountains from the front, valleys from the back.
        Assert.Equal(FoldMethod.Score, s.MethodFor(CreaseRole.Mountain));
        Assert.Equal(FoldMethod.ScoreFromBack, s.MethodFor(CreaseRole.Valley));
        Assert.Null(s.MethodFor(CreaseRole.Flat));
        Assert.True(s.NeedsBackJob);
        var p = s with { Material = Materials.Polypropylene, ValleyMethod = FoldMethod.Score };
        Assert.Equal(FoldMethod.Perforate, p.MethodFor(CreaseRole.Mountain));
        Assert.False(p.NeedsBackJob);
        // max(1 mm, 2 t), docs/reference/fabrication.md [CP/M].
        Assert.Equal(1.0, p.PerforationVertexZoneMm, 12);
        Assert.Equal(1.0, (s with { Material = Materials.HeavyCard with { ThicknessMm = 0.8 } }).PerforationVertexZoneMm - 0.6, 12);
        Assert.Equal(0.2 + 1.5, s.SpacingMm, 12);
        Assert.Equal(10.0, s.MillimetresPerMetre, 12);
    }
}
