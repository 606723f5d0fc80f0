using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class CsrMatrixTests
{
    [Fact]
    public void FromTripletsSumsDuplicatesAndSortsColumns()
    {
        // Hand-computed (common practice, no source): (0,2) given twice, (1,0) three times.
        var a = CsrMatrix.FromTriplets(2, 3, [(0, 2, 1.5), (1, 0, 1.0), (0, 0, 2.0), (0, 2, -0.25), (1, 0, 3.0), (1, 0, 0.5)]);
        Assert.Equal([0, 2, 3], a.RowStart);
        Assert.Equal([0, 2, 0], a.ColumnIndices);
        Assert.Equal([2.0, 1.25, 4.5], a.Values);
        Assert.Equal(1.25, a.At(0, 2));
        Assert.Equal(0.0, a.At(0, 1));
    }

    [Fact]
    public void MultiplyMatchesHandComputedProduct()
    {
        // [[2, 0, 1.25], [4.5, 0, 0]] * [1, 7, 2] = [4.5, 4.5] (hand-computed).
        var a = CsrMatrix.FromTriplets(2, 3, [(0, 0, 2.0), (0, 2, 1.25), (1, 0, 4.5)]);
        var y = new double[2];
        a.Multiply([1.0, 7.0, 2.0], y);
        Assert.Equal([4.5, 4.5], y);
    }
}
