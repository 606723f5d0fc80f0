using Tessel.Core.Targets;

namespace Tessel.Tests.Targets;

public class HeightMapSurfaceTests
{
    private static HeightMapSurface Random(int cols, int rows, int seed)
    {
        var rng = new Random(seed);
        var z = Enumerable.Range(0, cols * rows).Select(_ => rng.NextDouble() * 2).ToArray();
        return new HeightMapSurface(Footprint.Rectangle(10, 6), cols, rows, z, 10, 6);
    }

    [Fact]
    public void PassesThroughEverySampleAtItsPixelCentre()
    {
        // Catmull-Rom / cubic convolution interpolates: weights (0, 1, 0, 0) at t = 0 (Keys 1981).
        var s = Random(7, 5, 1);
        for (int r = 0; r < 5; r++)
            for (int c = 0; c < 7; c++)
            {
                var (x, y) = s.PixelCentre(c, r);
                Assert.Equal(s.Sample(c, r), s.HeightAt(x, y), 12);
            }
    }

    [Fact]
    public void RowZeroIsTheFarEdge()
    {
        var s = Random(4, 3, 2);
        var (_, yTop) = s.PixelCentre(0, 0);
        var (_, yBottom) = s.PixelCentre(0, 2);
        Assert.True(yTop > yBottom);
        Assert.Equal(2, yTop, 12); // depth 6 / 3 rows: centres at 2, 0, -2
    }

    [Fact]
    public void HeightAndNormalAreContinuousAcrossPixelBorders()
    {
        // C1 continuity of the Catmull-Rom spline (Catmull and Rom 1974): value and slope agree from both
        // sides of each knot; checked at every vertical and horizontal border between pixel centres.
        var s = Random(6, 5, 3);
        double dx = 10.0 / 6, dy = 6.0 / 5;
        const double eps = 1e-9;
        for (int c = 0; c < 6; c++)
        {
            double xb = -5 + (c + 0.5) * dx; // pixel centres are the spline's knots
            for (double y = -2.9; y < 2.9; y += 0.37)
            {
                var a = s.Jet(xb - eps, y); var b = s.Jet(xb + eps, y);
                Close(a.Z, b.Z, 1e-7);
                Close(a.Zx, b.Zx, 1e-6);
                Close(a.Zy, b.Zy, 1e-6);
                var na = s.NormalAt(xb - eps, y); var nb = s.NormalAt(xb + eps, y);
                Assert.True((na - nb).Length < 1e-6);
            }
        }
        for (int r = 0; r < 5; r++)
        {
            double yb = 3 - (r + 0.5) * dy;
            for (double x = -4.9; x < 4.9; x += 0.41)
            {
                var a = s.Jet(x, yb - eps); var b = s.Jet(x, yb + eps);
                Close(a.Z, b.Z, 1e-7);
                Close(a.Zx, b.Zx, 1e-6);
                Close(a.Zy, b.Zy, 1e-6);
            }
        }
    }

    private static void Close(double a, double b, double tol) =>
        Assert.True(Math.Abs(a - b) <= tol, $"{a:R} and {b:R} differ by more than {tol}");

    [Fact]
    public void SecondDerivativesDoJumpAcrossBordersAndTheCheckWouldSeeIt()
    {
        // Guards the continuity test: a first derivative of a C0-only interpolant would jump here; the
        // Catmull-Rom second derivative does jump in general, and the check detects a jump that size.
        var s = Random(6, 5, 3);
        double xb = -5 + 2.5 * 10.0 / 6;
        var a = s.Jet(xb - 1e-9, 0.1); var b = s.Jet(xb + 1e-9, 0.1);
        Assert.True(Math.Abs(a.Zxx - b.Zxx) > 1e-6);
    }

    [Fact]
    public void DerivativesMatchFiniteDifferencesInsideAPixel()
    {
        var s = Random(6, 5, 4);
        const double h = 1e-5;
        foreach (var (x, y) in new[] { (0.3, 0.2), (-3.1, 1.7), (4.4, -2.6), (-4.9, 2.9) })
        {
            var j = s.Jet(x, y);
            Assert.Equal((s.HeightAt(x + h, y) - s.HeightAt(x - h, y)) / (2 * h), j.Zx, 6);
            Assert.Equal((s.HeightAt(x, y + h) - s.HeightAt(x, y - h)) / (2 * h), j.Zy, 6);
        }
    }

    [Fact]
    public void ReproducesALinearRampExactly()
    {
        // Cubic convolution reproduces polynomials up to degree 2 in the interior (Keys 1981); a ramp
        // along x has constant slope there.
        int cols = 8, rows = 4;
        var z = new double[cols * rows];
        for (int r = 0; r < rows; r++) for (int c = 0; c < cols; c++) z[r * cols + c] = 0.5 * c;
        var s = new HeightMapSurface(Footprint.Rectangle(8, 4), cols, rows, z, 8, 4);
        Assert.Equal(0.5, s.Jet(0.3, 0.1).Zx, 12);
        Assert.Equal(0, s.Jet(0.3, 0.1).Zy, 12);
        Assert.Equal(0, s.CurvaturesAt(0.3, 0.1).Gaussian, 12);
    }

    [Fact]
    public void OutsideTheImageIsUndefined()
    {
        Assert.True(double.IsNaN(Random(4, 4, 5).HeightAt(5.5, 0)));
    }
}
