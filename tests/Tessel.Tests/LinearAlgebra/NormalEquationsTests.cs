using MathNet.Numerics.LinearAlgebra.Double;
using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class NormalEquationsTests
{
    private static DenseMatrix Dense(CsrMatrix a)
    {
        var d = new DenseMatrix(a.Rows, a.Columns);
        for (int r = 0; r < a.Rows; r++)
            for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++) d[r, a.ColumnIndices[k]] = a.Values[k];
        return d;
    }

    [Fact]
    public void RefillEqualsDenseWeightedNormalMatrix()
    {
        // Oracle: MathNet dense J^T W J + diag(d).
        var (jacobian, _) = SparseTestSystems.EdgeLengthJacobian(5, 4);
        var normal = NormalEquations.Analyze(jacobian);
        int n = normal.Unknowns;
        Assert.Equal(60, n);
        var rng = new Random(11);
        for (int round = 0; round < 2; round++)
        {
            // New Jacobian values on the same pattern: the refill must not keep anything from before.
            for (int k = 0; k < jacobian.NonZeroCount; k++) jacobian.Values[k] = 2 * rng.NextDouble() - 1;
            var weights = Enumerable.Range(0, jacobian.Rows).Select(_ => 0.1 + rng.NextDouble()).ToArray();
            var diagonal = Enumerable.Range(0, n).Select(_ => rng.NextDouble()).ToArray();
            var a = normal.Fill(jacobian, weights, diagonal);

            var j = Dense(jacobian);
            var expected = j.Transpose() * DenseMatrix.OfDiagonalArray(weights) * j + DenseMatrix.OfDiagonalArray(diagonal);
            var actual = Dense(a);
            double scale = expected.FrobeniusNorm();
            Assert.True((actual - expected).FrobeniusNorm() <= 1e-12 * scale, $"round {round}");
            // Bit-exact symmetry by construction.
            for (int r = 0; r < n; r++)
                for (int k = a.RowStart[r]; k < a.RowStart[r + 1]; k++)
                    Assert.Equal(a.Values[k], a.At(a.ColumnIndices[k], r));
        }
    }

    [Fact]
    public void PatternHoldsExactlyTheCouplingsAndTheDiagonal()
    {
        // Edge-length rows couple the 6 unknowns of an edge's two vertices. Vertex 0 of a 3 x 3
        // triangulated grid has edges to 1, 3 and 4, so row 0 of N has 4 vertices x 3 = 12 entries;
        // the centre vertex 4 touches 1, 3, 5, 7 and diagonals 0, 8: 7 x 3 = 21 (hand count).
        var (jacobian, _) = SparseTestSystems.EdgeLengthJacobian(3, 3);
        var a = NormalEquations.Analyze(jacobian).Matrix;
        Assert.Equal(12, a.RowStart[1] - a.RowStart[0]);
        Assert.Equal(21, a.RowStart[13] - a.RowStart[12]);
        for (int r = 0; r < a.Rows; r++)
        {
            Assert.True(a.ColumnIndices.AsSpan(a.RowStart[r], a.RowStart[r + 1] - a.RowStart[r]).Contains(r));
            for (int k = a.RowStart[r] + 1; k < a.RowStart[r + 1]; k++) Assert.True(a.ColumnIndices[k - 1] < a.ColumnIndices[k]);
        }
        // An unknown that no residual touches still gets its diagonal slot.
        var lonely = CsrMatrix.FromTriplets(1, 3, [(0, 0, 1.0), (0, 2, 2.0)]);
        var filled = NormalEquations.Analyze(lonely).Fill(lonely, [], [0.5, 0.25, 0.125]);
        Assert.Equal(0.25, filled.At(1, 1));
        Assert.Equal(2.0, filled.At(2, 0));
        Assert.Equal(4.125, filled.At(2, 2));
    }

    [Fact]
    public void GradientEqualsDenseTransposeTimesWeightedResiduals()
    {
        // Oracle: MathNet dense J^T (W r).
        var (jacobian, residuals) = SparseTestSystems.EdgeLengthJacobian(4, 6);
        var normal = NormalEquations.Analyze(jacobian);
        var weights = SparseTestSystems.RandomVector(jacobian.Rows, 3).Select(v => 1.5 + v).ToArray();
        var g = new double[normal.Unknowns];
        normal.Gradient(jacobian, weights, residuals, g);
        var expected = Dense(jacobian).Transpose() * DenseVector.OfArray(residuals.Zip(weights, (r, w) => r * w).ToArray());
        Assert.True(SparseTestSystems.RelativeDifference(g, expected.AsArray()) <= 1e-12);
        Assert.True(expected.L2Norm() > 1e-3); // the residuals are not trivially zero
    }

    [Fact]
    public void RejectsAJacobianWithADifferentPattern()
    {
        var (jacobian, _) = SparseTestSystems.EdgeLengthJacobian(3, 3);
        var normal = NormalEquations.Analyze(jacobian);
        var (other, _) = SparseTestSystems.EdgeLengthJacobian(3, 4);
        Assert.Throws<ArgumentException>(() => normal.Fill(other, [], []));
    }
}
