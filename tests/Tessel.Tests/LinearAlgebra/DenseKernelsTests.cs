using Tessel.Core.LinearAlgebra;

namespace Tessel.Tests.LinearAlgebra;

public class DenseKernelsTests
{
    [Fact]
    public void SimdAndScalarPathsGiveTheSameBitsAndTheRightValue()
    {
        // Determinism across machines with and without AVX: both paths use the same fixed lanes.
        // Value check against a plain sequential sum (common practice, no source).
        var m = SparseTestSystems.RandomVector(400, 21);
        foreach (int length in new[] { 0, 3, 4, 7, 8, 13, 37, 96 })
        {
            double naive(long a, long b) { double s = 0; for (int i = 0; i < length; i++) s += m[a + i] * m[b + i]; return s; }
            double simd = DenseKernels.Dot(m, 5, m, 200, length);
            Assert.Equal(DenseKernels.Dot(m, 5, m, 200, length, allowSimd: false), simd);
            Assert.Equal(naive(5, 200), simd, 12);

            DenseKernels.Dot2x2(m, 1, 100, 201, 300, length, out var a, out var b, out var c, out var d);
            DenseKernels.Dot2x2(m, 1, 100, 201, 300, length, out var a2, out var b2, out var c2, out var d2, allowSimd: false);
            Assert.Equal([a2, b2, c2, d2], new[] { a, b, c, d });
            Assert.Equal(naive(1, 201), a, 12);
            Assert.Equal(naive(1, 300), b, 12);
            Assert.Equal(naive(100, 201), c, 12);
            Assert.Equal(naive(100, 300), d, 12);

            DenseKernels.Dot2x1(m, 7, 150, 250, length, out var e, out var f);
            DenseKernels.Dot2x1(m, 7, 150, 250, length, out var e2, out var f2, allowSimd: false);
            Assert.Equal(e2, e);
            Assert.Equal(f2, f);
            Assert.Equal(naive(7, 250), e, 12);
            Assert.Equal(naive(150, 250), f, 12);
        }
    }
}
