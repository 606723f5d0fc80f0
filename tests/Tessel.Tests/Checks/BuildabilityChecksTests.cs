using Tessel.Core.Checks;
using Tessel.Core.Model;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Checks;

public class BuildabilityChecksTests
{
    [Fact]
    public void MiuraWithExactLayoutPassesEveryCheck()
    {
        var folded = CheckMeshes.Miura(2, 2, thetaDeg: 35);
        var flat3 = CheckMeshes.Miura(2, 2, thetaDeg: 0).Positions; // Schenk & Guest 2013 flat state
        var flat2 = new double[folded.VertexCount * 2];
        for (int v = 0; v < folded.VertexCount; v++) { flat2[2 * v] = flat3[3 * v]; flat2[2 * v + 1] = flat3[3 * v + 1]; }
        var result = BuildabilityChecks.Run(folded, new FlatPattern(folded, flat2, new double[folded.EdgeCount]));
        var s = result.Summary;
        Assert.Equal(1, s.DegreesOfFreedom); // Tachi 2009
        Assert.True(s.PathSimulated && s.PathReachedNearFlat);
        Assert.True(s.PathMaxBarStrain < 1e-9);
        Assert.Equal(1.25, s.PathHighestProgress, 12);
        Assert.Equal(0, s.CollisionCount);
        Assert.Empty(s.PathKeyframesWithCollisions);
        Assert.True(s.LayoutChecked);
        Assert.True(s.MaxLayoutStrain < 1e-12);
        Assert.Empty(s.FacetsOverStrainLimit);
        Assert.True(s.MaxVertexAngleStrain < 1e-12);
    }

    [Fact]
    public void FlatInputIsReportedNotThrown()
    {
        var s = BuildabilityChecks.Run(CheckMeshes.Miura(2, 2, thetaDeg: 0)).Summary;
        Assert.False(s.PathSimulated);
        Assert.Contains("folded", s.PathStopTowardFlat);
        Assert.False(s.LayoutChecked);
        Assert.True(double.IsNaN(s.MaxLayoutStrain));
        Assert.True(s.DegreesOfFreedom > 1); // flat state: branch point with extra infinitesimal mobility
    }
}
