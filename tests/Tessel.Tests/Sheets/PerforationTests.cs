using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class PerforationTests
{
    [Fact]
    public void LongCreaseGetsExactDashesCentredWithEqualEnds()
    {
        // 40 mm crease, cut 3 / bridge 0.8, zone 1: room 38 mm holds n = floor((38 + 0.8) / 3.8) = 10 dashes.
        var plan = Perforation.Plan(40, 3, 0.8, 1);
        Assert.Equal(PerforationKind.Pattern, plan.Kind);
        Assert.Equal(10, plan.Cuts.Length);
        foreach (var (s, e) in plan.Cuts) Assert.Equal(3, e - s, 12);
        for (int i = 1; i < plan.Cuts.Length; i++) Assert.Equal(0.8, plan.Cuts[i].Start - plan.Cuts[i - 1].End, 12);
        // 10 x 3 + 9 x 0.8 = 37.2 mm used, 2.8 mm left for both ends.
        Assert.Equal(1.4, plan.Cuts[0].Start, 12);
        Assert.Equal(1.4, 40 - plan.Cuts[^1].End, 12);
    }

    [Fact]
    public void EndsKeepTheVertexZoneAndAtLeastHalfABridge()
    {
        // Polypropylene 2 / 1.5 with a 1 mm zone: half bridge 0.75 < zone, so the zone rules.
        var pp = Perforation.Plan(20, 2, 1.5, 1);
        Assert.True(pp.Cuts[0].Start >= 1 - 1e-12 && 20 - pp.Cuts[^1].End >= 1 - 1e-12);
        // Bridge 3 with zone 1: half bridge 1.5 rules.
        var wide = Perforation.Plan(20, 2, 3, 1);
        Assert.True(wide.Cuts[0].Start >= 1.5 - 1e-12 && 20 - wide.Cuts[^1].End >= 1.5 - 1e-12);
    }

    [Fact]
    public void ShortCreasesBecomeASlotOrAScore()
    {
        // 6 mm: room 4 < two cycles (3 + 0.8 + 3) -> one centred 3 mm slot.
        var slot = Perforation.Plan(6, 3, 0.8, 1);
        Assert.Equal(PerforationKind.Slot, slot.Kind);
        Assert.Single(slot.Cuts);
        Assert.Equal((1.5, 4.5), slot.Cuts[0]);
        // 3 mm: room 1 < half a dash -> score.
        var score = Perforation.Plan(3, 3, 0.8, 1);
        Assert.Equal(PerforationKind.Score, score.Kind);
        Assert.Empty(score.Cuts);
    }
}
