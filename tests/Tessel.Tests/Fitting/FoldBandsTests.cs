using Tessel.Core.Fitting;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Xunit;

namespace Tessel.Tests.Fitting;

/// <summary>The band each crease of a free net is held in when its first fit left folds outside the
/// fold-angle bounds: drawn flat, or folded at least the minimum.</summary>
public class FoldBandsTests
{
    /// <summary>Two unit right triangles on the crease from (0,0,0) to (1,0,0), the second turned about it by
    /// <paramref name="foldDeg"/> (degrees).</summary>
    private static GeneratedPattern Hinge(double foldDeg)
    {
        double t = foldDeg * Math.PI / 180;
        double[] xyz = [0, 0, 0, 1, 0, 0, 0.5, 1, 0, 0.5, -Math.Cos(t), Math.Sin(t)];
        var mesh = new CreaseMesh("free-triangulated", xyz, [[0, 1, 2], [1, 0, 3]], new VertexLayer[4], (_, _) => CreaseRole.Flat);
        return new GeneratedPattern(mesh, FamilyConstraints.Developability, [], 0, 0);
    }

    private static int Crease(CreaseMesh m) => Enumerable.Range(0, m.EdgeCount).Single(m.IsInterior);

    [Fact]
    public void FoldsWithinTheBoundsOrDrawnFlatNeedNoBands()
    {
        var settings = new FitSettings { MinFoldAngleDeg = 1, MaxFoldAngleDeg = 175, DrawnFlatBelowDeg = 0.5 };
        foreach (double deg in new[] { 0.3, 1.2, 40 })
            Assert.Empty(FoldBands.Candidates(Hinge(deg), Hinge(deg).Mesh, settings));
    }

    [Theory]
    // Between the drawn-flat tolerance (0.5 deg) and the minimum (1 deg), the nearer band first: under the
    // midpoint 0.75 deg flat, then folded; above it folded, then flat. No assignment is offered twice.
    [InlineData(0.7, new[] { CreaseRole.Flat, CreaseRole.Mountain })]
    [InlineData(0.9, new[] { CreaseRole.Mountain, CreaseRole.Flat })]
    public void AFoldBetweenTheBandsIsOfferedTheNearerBandFirst(double deg, CreaseRole[] expected)
    {
        var hinge = Hinge(deg);
        int e = Crease(hinge.Mesh);
        double rho = hinge.Mesh.FoldAngle(e);
        Assert.Equal(deg * Math.PI / 180, Math.Abs(rho), 12);
        var folded = rho > 0 ? CreaseRole.Mountain : CreaseRole.Valley;
        var candidates = FoldBands.Candidates(hinge, hinge.Mesh, new FitSettings { MinFoldAngleDeg = 1, DrawnFlatBelowDeg = 0.5 }).ToList();
        Assert.Equal(expected.Select(r => r == CreaseRole.Mountain ? folded : r), candidates.Select(c => c.Pattern.Mesh.EdgeRoles[e]));
        foreach (var c in candidates)
        {
            Assert.Equal(1, c.Outside);
            Assert.True(c.Pattern.Constraints.HasFlag(FamilyConstraints.FoldSigns | FamilyConstraints.FlatCreases | FamilyConstraints.Developability));
            Assert.Equal(1, c.Settings.MinFoldAngleDeg);
            // The drape keeps its positions: the refit starts from the fitted state it is given.
            Assert.Same(hinge.Mesh.Positions, c.Pattern.Mesh.Positions);
        }
    }

    [Fact]
    public void AMinimumInsideTheDrawnFlatToleranceIsRaisedClearOfIt()
    {
        // With a minimum of 0.2 deg a 0.5 deg fold is within bounds; a fold over the maximum still needs a band,
        // and a held fold must stay clear of 0.5 deg, where round-off could draw it flat: 1.1 x 0.5 = 0.55 deg.
        var settings = new FitSettings { MinFoldAngleDeg = 0.2, MaxFoldAngleDeg = 30, DrawnFlatBelowDeg = 0.5 };
        Assert.Empty(FoldBands.Candidates(Hinge(0.6), Hinge(0.6).Mesh, settings));
        var band = Assert.Single(FoldBands.Candidates(Hinge(40), Hinge(40).Mesh, settings));
        Assert.Equal(0.55, band.Settings.MinFoldAngleDeg, 12);
        Assert.NotEqual(CreaseRole.Flat, band.Pattern.Mesh.EdgeRoles[Crease(band.Pattern.Mesh)]);
    }
}
