using Tessel.Core.Fitting.Residuals;

namespace Tessel.Tests.Fitting;

/// <summary>Every analytic gradient against central differences on a random non-planar configuration.</summary>
public class ResidualGradientTests
{
    private delegate double Residual(double[] xyz, Span<double> grad);

    private static double[] RandomPoints(int n, int seed)
    {
        var r = new Random(seed);
        var p = new double[3 * n];
        // A convex-ish ring around vertex 0 with some height, so angles stay away from 0 and pi.
        for (int k = 1; k < n; k++)
        {
            double t = 2 * Math.PI * (k - 1) / (n - 1) + 0.2 * r.NextDouble();
            p[3 * k] = Math.Cos(t) * (1 + 0.3 * r.NextDouble());
            p[3 * k + 1] = Math.Sin(t) * (1 + 0.3 * r.NextDouble());
            p[3 * k + 2] = 0.4 * (r.NextDouble() - 0.5);
        }
        p[2] = 0.1;
        return p;
    }

    private static void CheckGradient(Residual f, double[] x, int[] vertices)
    {
        var grad = new double[3 * vertices.Length];
        f(x, grad);
        var scratch = new double[3 * vertices.Length];
        const double h = 1e-6;
        for (int k = 0; k < vertices.Length; k++)
            for (int c = 0; c < 3; c++)
            {
                var xp = (double[])x.Clone(); xp[3 * vertices[k] + c] += h;
                var xm = (double[])x.Clone(); xm[3 * vertices[k] + c] -= h;
                double fd = (f(xp, scratch) - f(xm, scratch)) / (2 * h);
                Assert.True(Math.Abs(fd - grad[3 * k + c]) < 1e-7 * (1 + Math.Abs(fd)), $"vertex {k} comp {c}: analytic {grad[3 * k + c]} vs central difference {fd}");
            }
    }

    [Fact]
    public void CornerAngle_MatchesCentralDifferences() =>
        CheckGradient((x, g) => CornerAngle.Evaluate(x, 0, 1, 2, g), RandomPoints(5, 1), [0, 1, 2]);

    [Fact]
    public void QuadPlanarity_MatchesCentralDifferences() =>
        CheckGradient((x, g) => QuadPlanarity.Evaluate(x, 1, 2, 3, 4, g), RandomPoints(5, 2), [1, 2, 3, 4]);

    [Fact]
    public void FoldAngle_MatchesCentralDifferences() =>
        CheckGradient((x, g) => FoldAngle.Evaluate(x, 0, 1, 2, 4, g), RandomPoints(5, 3), [0, 1, 2, 4]);

    [Fact]
    public void FacetCornerOrder_MatchesCentralDifferences() =>
        CheckGradient((x, g) => FacetCornerOrder.Evaluate(x, 1, 2, 3, 4, 1.7, g), RandomPoints(5, 5), [1, 2, 3, 4]);

    [Fact]
    public void FacetCornerOrderIsSinSquaredOnAParallelogramAndNegativeOnReflexAndCrossedQuads()
    {
        // Worked by hand: opposite corners of a planar parallelogram with sides 2 and 1 and a 60 deg angle
        // give sin^2(60 deg) = 0.75 once divided by the four corner edge lengths (2 * 1 * 2 * 1 = 4).
        double s = Math.Sqrt(3) / 2;
        double[] parallelogram = [0, 0, 0, 2, 0, 0, 2.5, s, 0, 0.5, s, 0];
        var g = new double[12];
        double scale = FacetCornerOrder.Scale(parallelogram, 0, 1, 2, 3);
        Assert.Equal(4, scale, 12);
        Assert.Equal(0.75, FacetCornerOrder.Evaluate(parallelogram, 0, 1, 2, 3, scale, g), 12);
        // An arrowhead: the corner at (1, 0.5) is reflex (about 233 deg), so it turns against (1, 2).
        double[] arrow = [0, 0, 0, 1, 0.5, 0, 2, 0, 0, 1, 2, 0];
        Assert.True(FacetCornerOrder.Evaluate(arrow, 1, 2, 3, 0, 1, g) < 0);
        // A bow-tie (0,0) (1,1) (1,0) (0,1): its edges cross, and both pairs of opposite corners disagree.
        double[] bowTie = [0, 0, 0, 1, 1, 0, 1, 0, 0, 0, 1, 0];
        Assert.True(FacetCornerOrder.Evaluate(bowTie, 0, 1, 2, 3, 1, g) < 0);
        Assert.True(FacetCornerOrder.Evaluate(bowTie, 1, 2, 3, 0, 1, g) < 0);
    }

    [Fact]
    public void KawasakiAndDevelopability_MatchCentralDifferences()
    {
        var star = new VertexStar(0, [1, 2, 3, 4]);
        var x = RandomPoints(5, 4);
        CheckGradient((p, g) => SectorAngleSums.Kawasaki(p, star, g), x, [0, 1, 2, 3, 4]);
        CheckGradient((p, g) => SectorAngleSums.Developability(p, star, g), x, [0, 1, 2, 3, 4]);
    }

    [Fact]
    public void PlanarQuadAndFlatStarGiveZero()
    {
        // Unit square in the plane z = 1: planar; a flat star with sectors 50, 130, 50, 130 degrees is
        // developable and satisfies Kawasaki (Kawasaki 1989: alternating sum zero).
        double[] sq = [0, 0, 1, 1, 0, 1, 1, 1, 1, 0, 1, 1];
        var g = new double[12];
        Assert.Equal(0, QuadPlanarity.Evaluate(sq, 0, 1, 2, 3, g), 15);
        double[] deg = [0, 50, 120, 250];
        var x = new double[15];
        for (int k = 0; k < 4; k++)
        {
            x[3 * (k + 1)] = Math.Cos(deg[k] * Math.PI / 180);
            x[3 * (k + 1) + 1] = Math.Sin(deg[k] * Math.PI / 180);
        }
        var star = new VertexStar(0, [1, 2, 3, 4]);
        var gs = new double[15];
        Assert.Equal(0, SectorAngleSums.Developability(x, star, gs), 12);
        Assert.Equal(0, SectorAngleSums.Kawasaki(x, star, gs), 12);
        // A folded non-flat-foldable star: sectors 60, 100, 60, 140 sum to 360 but alternate to -120 deg.
        deg = [0, 60, 160, 220];
        for (int k = 0; k < 4; k++)
        {
            x[3 * (k + 1)] = Math.Cos(deg[k] * Math.PI / 180);
            x[3 * (k + 1) + 1] = Math.Sin(deg[k] * Math.PI / 180);
        }
        Assert.Equal(-120 * Math.PI / 180, SectorAngleSums.Kawasaki(x, star, gs), 12);
    }
}
