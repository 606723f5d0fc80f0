using Tessel.Core.Checks;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Checks;

public class FoldAngleTableTests
{
    [Fact]
    public void MiuraStraightCreasesFoldByTwiceTheFacetTilt()
    {
        // Schenk & Guest, PNAS 2013: theta is each facet's tilt to the xy-plane and the straight (b) creases are
        // horizontal, so the two facets at a straight crease meet at a fold angle of 2 theta (derived here).
        var mesh = CheckMeshes.Miura(1, 1, thetaDeg: 40);
        var rows = FoldAngleTable.Build(mesh, scaleDenominator: 50);
        Assert.Equal(4, rows.Count); // one degree-4 vertex: four interior creases
        var straight = rows.Where(r => Math.Abs(r.LengthMetres - 0.8) < 1e-12).ToArray();
        Assert.Equal(2, straight.Length);
        foreach (var r in straight)
        {
            Assert.Equal(80.0, Math.Abs(r.FoldAngleDegrees), 9);
            Assert.Equal(16.0, r.ModelLengthMillimetres, 9); // 0.8 m at 1:50
            Assert.Equal(r.FoldAngleDegrees > 0 ? CreaseRole.Mountain : CreaseRole.Valley, r.Role);
        }
        // Maekawa-Justin: |M - V| = 2 at a flat-foldable vertex (Kawasaki 1989; Justin 1986).
        Assert.Equal(2, Math.Abs(rows.Count(r => r.Role == CreaseRole.Mountain) - rows.Count(r => r.Role == CreaseRole.Valley)));
    }

    [Fact]
    public void RejectsNonPositiveScale()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FoldAngleTable.Build(CheckMeshes.Miura(1, 1), 0));
    }
}
