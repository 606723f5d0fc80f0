using Tessel.Core.Checks;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Tests.Checks;

public class RigidityAnalysisTests
{
    [Theory]
    // Check values from docs/reference/geometry.md section 4 (derived; Tachi, J. IASS 50(3) 2009 for the Miura sheets):
    // one degree-4 vertex (1x1 cell = 2x2 quads), Miura 3x3 and 4x4 cells all fold with one DOF.
    [InlineData(1, 1)]
    [InlineData(3, 3)]
    [InlineData(4, 4)]
    public void FoldedMiuraHasOneDegreeOfFreedom(int cellsX, int cellsY)
    {
        var mesh = CheckMeshes.Miura(cellsX, cellsY);
        var dense = RigidityAnalysis.DegreesOfFreedom(mesh, new RigiditySettings(Method: RankMethod.DenseSvd));
        var sparse = RigidityAnalysis.DegreesOfFreedom(mesh, new RigiditySettings(Method: RankMethod.ShiftInvert));
        Assert.Equal(1, dense.DegreesOfFreedom);
        Assert.Equal(1, sparse.DegreesOfFreedom);
        // Naive constraint counting (Pellegrino & Calladine 1986) predicts fewer: rows exceed 3N - 7 for the sheets.
        int naive = Math.Max(0, dense.Unknowns - dense.ConstraintRows - 6);
        if (cellsX >= 3) Assert.Equal(0, naive);
        Assert.True(dense.GapRatio > 1e6, $"dense gap {dense.GapRatio}");
        Assert.True(sparse.GapRatio > 1e2, $"sparse gap {sparse.GapRatio}");
        Assert.Equal(dense.Rank, sparse.Rank);
    }

    [Theory]
    [InlineData(3, 11)]
    [InlineData(4, 12)]
    public void GenericTriangulatedDiskHasBoundaryMinusThreeDegreesOfFreedom(int n, int seed)
    {
        // Derived here (docs/reference/geometry.md section 4): E = 3V - Vb - 3 independent bars leave Vb - 3 motions.
        var mesh = CheckMeshes.RandomTriangulatedDisk(n, seed);
        int boundary = mesh.BoundaryVertices().Count(b => b);
        Assert.Equal(4 * n, boundary);
        var dense = RigidityAnalysis.DegreesOfFreedom(mesh, new RigiditySettings(Method: RankMethod.DenseSvd));
        var sparse = RigidityAnalysis.DegreesOfFreedom(mesh, new RigiditySettings(Method: RankMethod.ShiftInvert));
        Assert.Equal(boundary - 3, dense.DegreesOfFreedom);
        Assert.Equal(boundary - 3, sparse.DegreesOfFreedom);
    }

    [Fact]
    public void DegreeThreeCapAndSingleHexagonalPanelAreRigid()
    {
        // Derived here: three triangles round a raised vertex form a tetrahedron without its base (4 vertices,
        // 6 bars: 12 - 6 - 6 = 0); a hexagonal panel carries 3*6 - 6 = 12 constraints (6 sides, 3 fan diagonals,
        // 3 planarity rows): 18 - 12 - 6 = 0, even lying flat, because planarity rows hold it out of plane.
        var cap = new CreaseMesh("cap", [0, 0, 0.5, 1, 0, 0, -0.5, 0.8, 0, -0.5, -0.8, 0],
            [[0, 1, 2], [0, 2, 3], [0, 3, 1]], new VertexLayer[4], (_, _) => CreaseRole.Mountain);
        var hexPositions = new double[18];
        for (int k = 0; k < 6; k++) { hexPositions[3 * k] = Math.Cos(k * Math.PI / 3); hexPositions[3 * k + 1] = Math.Sin(k * Math.PI / 3); }
        var hexagon = new CreaseMesh("panel", hexPositions, [[0, 1, 2, 3, 4, 5]], new VertexLayer[6], (_, _) => CreaseRole.Flat);
        foreach (var mesh in new[] { cap, hexagon })
            foreach (var method in new[] { RankMethod.DenseSvd, RankMethod.ShiftInvert })
                Assert.Equal(0, RigidityAnalysis.DegreesOfFreedom(mesh, new RigiditySettings(Method: method)).DegreesOfFreedom);
        var path = RigidFoldingPath.Simulate(cap);
        Assert.Equal(0, path.DegreesOfFreedom);
        Assert.False(path.ReachedNearFlat);
        Assert.StartsWith("rigid", path.StopTowardFlat);
    }

    [Fact]
    public void AutoMethodSwitchesToShiftInvertForLargerSheets()
    {
        // 8x8 Miura cells: 867 unknowns, above the dense limit of 600; still one DOF (Tachi 2009), and the
        // kept/dropped singular values straddle the tolerance by orders of magnitude (about 7e-3 vs 1e-15 here).
        var r = RigidityAnalysis.DegreesOfFreedom(CheckMeshes.Miura(8, 8));
        Assert.Equal("shift-invert-subspace", r.Method);
        Assert.Equal(867, r.Unknowns);
        Assert.Equal(1, r.DegreesOfFreedom);
        Assert.True(r.SmallestKeptSingularValue > 1e-3 && r.LargestDroppedSingularValue < 1e-10,
            $"kept {r.SmallestKeptSingularValue}, dropped {r.LargestDroppedSingularValue}");
    }

    [Fact]
    public void FlatMiuraIsABranchPointWithExtraMobility()
    {
        // At theta = 0 every crease can start to fold: the rank drops (docs/reference/geometry.md section 4, derived).
        var flat = CheckMeshes.Miura(3, 3, thetaDeg: 0);
        var r = RigidityAnalysis.DegreesOfFreedom(flat, new RigiditySettings(Method: RankMethod.DenseSvd));
        Assert.True(r.DegreesOfFreedom > 1, $"flat DOF {r.DegreesOfFreedom}");
    }
}
