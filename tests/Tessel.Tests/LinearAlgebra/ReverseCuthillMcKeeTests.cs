using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class ReverseCuthillMcKeeTests
{
    [Fact]
    public void RestoresTheNaturalBandwidthOfAShuffledGridLaplacian()
    {
        // A 12 x 30 grid numbered along its short side has bandwidth 12 (its natural order). RCM from a
        // pseudo-peripheral corner numbers by anti-diagonal levels of at most 12 nodes; a node's
        // neighbour in the next level sits 12 or 13 places on, so the band is 13 (George & Liu 1981,
        // ch. 4: level-structure orderings give band <= about twice the widest level). The shuffle
        // destroys the band first.
        var grid = SparseTestSystems.GridLaplacian(12, 30, 0.1);
        Assert.Equal(12, SparsityMeasures.Bandwidth(grid));
        var shuffled = SparseTestSystems.Permute(grid, SparseTestSystems.RandomPermutation(grid.Rows, 5));
        Assert.True(SparsityMeasures.Bandwidth(shuffled) > 300);

        int[] order = ReverseCuthillMcKee.Order(shuffled);
        Assert.Equal(Enumerable.Range(0, grid.Rows), order.Order());
        Assert.Equal(13, SparsityMeasures.Bandwidth(shuffled, order));
        Assert.True(SparsityMeasures.EnvelopeSize(shuffled, order) <= SparsityMeasures.EnvelopeSize(grid));
    }

    [Fact]
    public void NumbersEveryComponentOfADisconnectedGraph()
    {
        // Two separate paths 0-2-4 and 1-3 plus an isolated node 5: each component's nodes stay
        // consecutive, so the band is 1 (a path's natural band).
        var a = CsrMatrix.FromTriplets(6, 6,
            [(0, 0, 2.0), (1, 1, 2.0), (2, 2, 2.0), (3, 3, 2.0), (4, 4, 2.0), (5, 5, 2.0),
             (0, 2, -1.0), (2, 0, -1.0), (2, 4, -1.0), (4, 2, -1.0), (1, 3, -1.0), (3, 1, -1.0)]);
        var order = ReverseCuthillMcKee.Order(a);
        Assert.Equal([0, 1, 2, 3, 4, 5], order.Order());
        Assert.Equal(1, SparsityMeasures.Bandwidth(a, order));
        Assert.Equal(2, SparsityMeasures.Bandwidth(a));
    }
}
