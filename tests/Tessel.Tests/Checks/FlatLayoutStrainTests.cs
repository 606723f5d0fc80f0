using Tessel.Core.Checks;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Core.Unfolding;

namespace Tessel.Tests.Checks;

public class FlatLayoutStrainTests
{
    private static FlatPattern FlatMiura(CreaseMesh folded, Action<double[]>? edit = null)
    {
        // The flat state of a regular Miura sheet is the same sheet at theta = 0 (Schenk & Guest 2013).
        var flat3 = CheckMeshes.Miura(2, 2, thetaDeg: 0).Positions;
        var flat2 = new double[folded.VertexCount * 2];
        for (int v = 0; v < folded.VertexCount; v++) { flat2[2 * v] = flat3[3 * v]; flat2[2 * v + 1] = flat3[3 * v + 1]; }
        edit?.Invoke(flat2);
        return new FlatPattern(folded, flat2, new double[folded.EdgeCount]);
    }

    [Fact]
    public void ExactMiuraUnfoldingHasNoStrain()
    {
        var folded = CheckMeshes.Miura(2, 2, thetaDeg: 35);
        var r = FlatLayoutStrain.Measure(FlatMiura(folded));
        Assert.True(r.MaxStrain < 1e-12, $"max strain {r.MaxStrain}");
        Assert.Empty(r.FacetsOverLimit);
        Assert.True(r.MaxVertexAngleStrain < 1e-12); // developable: angle sum 2 pi at every interior vertex
        Assert.Equal(0.0008, r.StrainLimit);
    }

    [Fact]
    public void StretchedCornerIsReportedOnItsFacetOnly()
    {
        // Corner vertex 0 moved 1 mm back along its b-edge (length 0.8 m) stretches that edge by exactly
        // 0.001 / 0.8 = 1.25e-3 (derived); its other edge and the diagonals stretch less to first order.
        var folded = CheckMeshes.Miura(2, 2, thetaDeg: 35);
        var flat = FlatMiura(folded, p =>
        {
            var dir = (new Vec2(p[2], p[3]) - new Vec2(p[0], p[1])).Normalized();
            p[0] -= 0.001 * dir.X; p[1] -= 0.001 * dir.Y;
        });
        var r = FlatLayoutStrain.Measure(flat);
        Assert.Equal(1.25e-3, r.MaxStrain, 12);
        Assert.Equal(0, r.WorstFacet);
        Assert.Equal([0], r.FacetsOverLimit);
        Assert.True(r.FacetMaxStrain.Skip(1).All(s => s < 1e-12));
    }

    [Fact]
    public void PyramidApexNeedsItsAngleDefectOverTwoPiAsStrain()
    {
        // Square pyramid, base corners (+-1, +-1, 0), apex (0, 0, 1): each apex angle is acos(1/3), so the
        // defect is 2 pi - 4 acos(1/3) = 1.3593476 rad and the estimate 0.2163469 (derived; docs/reference/geometry.md section 7).
        var pos = new double[] { 0, 0, 1, 1, -1, 0, 1, 1, 0, -1, 1, 0, -1, -1, 0 };
        int[][] faces = [[0, 1, 2], [0, 2, 3], [0, 3, 4], [0, 4, 1]];
        var mesh = new CreaseMesh("pyramid", pos, faces, new VertexLayer[5], (_, _) => CreaseRole.Mountain);
        var s = FlatLayoutStrain.VertexAngleStrain(mesh);
        Assert.Equal(0.2163469, s[0], 7);
        Assert.Equal(0.0, s[1]);
    }
}
