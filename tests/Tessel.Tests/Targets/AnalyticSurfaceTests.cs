using Tessel.Core.Geometry;
using Tessel.Core.Targets;
using Tessel.Core.Targets.Formulas;

namespace Tessel.Tests.Targets;

public class AnalyticSurfaceTests
{
    private static readonly Footprint Square = Footprint.Rectangle(8, 8);

    private static void Relative(double expected, double actual, double tol = 1e-9) =>
        Assert.True(Math.Abs(actual - expected) <= tol * Math.Abs(expected), $"expected {expected:R}, got {actual:R}");

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(2.5, -1.5)]
    [InlineData(-3.7, 3.1)]
    public void SphereHasBothPrincipalCurvaturesOneOverR(double x, double y)
    {
        // A sphere of radius R is umbilic with |k1| = |k2| = 1/R (do Carmo, Differential Geometry of
        // Curves and Surfaces, section 3-2). Seen from above (upper normal) a dome bends away: both negative.
        const double r = 7.5;
        var k = new SphericalCapSurface(Square, r, 2).CurvaturesAt(x, y);
        Relative(-1 / r, k.K1);
        Relative(-1 / r, k.K2);
        Relative(1 / (r * r), k.Gaussian);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(1.0, 3.0)]
    [InlineData(-2.0, -3.5)]
    public void CylinderHasCurvaturesOneOverRAndZero(double x, double y)
    {
        // Circular cylinder: principal curvatures 1/R and 0, K = 0 (do Carmo, section 3-2).
        const double r = 6;
        var k = new CylinderSurface(Square, r, 3).CurvaturesAt(x, y);
        Relative(1 / r, Math.Abs(k.K2));
        Assert.True(k.K2 < 0, "a barrel vault bends away from its upper normal");
        Assert.Equal(0, k.K1, 12);
        Assert.Equal(0, k.Gaussian, 12);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(1.5, -2.0)]
    [InlineData(3.9, 3.3)]
    public void SaddleGaussianCurvatureMatchesMongePatchFormula(double x, double y)
    {
        // z = x*y/c: K = -c^2 / (c^2 + x^2 + y^2)^2 (do Carmo, section 3-3, Monge patch of the saddle).
        const double c = 5;
        double expected = -c * c / Math.Pow(c * c + x * x + y * y, 2);
        Relative(expected, new HyperbolicParaboloidSurface(Square, c).CurvaturesAt(x, y).Gaussian);
        var formula = new FormulaSurface(Square, "x*y/5", FormulaParser.Parse("x*y/5"), 1);
        Relative(expected, formula.CurvaturesAt(x, y).Gaussian);
    }

    public static TheoryData<string> SurfaceNames => new()
    {
        "plane", "cylinder", "spherical-cap", "hyperbolic-paraboloid", "elliptic-paraboloid", "sinusoidal-wave", "formula",
    };

    private static GraphSurface Make(string name) => name switch
    {
        "plane" => new PlaneSurface(Square, 1.5),
        "cylinder" => new CylinderSurface(Square, 6, 3),
        "spherical-cap" => new SphericalCapSurface(Square, 9, 2),
        "hyperbolic-paraboloid" => new HyperbolicParaboloidSurface(Square, 6, 2),
        "elliptic-paraboloid" => new EllipticParaboloidSurface(Square, 8, 12, 2),
        "sinusoidal-wave" => new SinusoidalWaveSurface(Square, 0.5, 3, 0.3, 1),
        _ => new FormulaSurface(Square, "0.05*x^2 - 0.03*x*y + sin(y/2)", FormulaParser.Parse("0.05*x^2 - 0.03*x*y + sin(y/2)"), 1),
    };

    [Theory]
    [MemberData(nameof(SurfaceNames))]
    public void ClosestPointResidualIsParallelToTheNormal(string name)
    {
        // First-order optimality of the nearest point: p - q is along the surface normal at q
        // (geometric fact; common practice, no source).
        var s = Make(name);
        var rng = new Random(1234);
        for (int i = 0; i < 40; i++)
        {
            var q0 = new Vec3(rng.NextDouble() * 6 - 3, rng.NextDouble() * 6 - 3, 0);
            q0 = q0 with { Z = s.HeightAt(q0.X, q0.Y) };
            var p = q0 + (rng.NextDouble() - 0.5) * 0.6 * s.NormalAt(q0.X, q0.Y) + new Vec3(0.1 * rng.NextDouble(), -0.1 * rng.NextDouble(), 0);
            var sp = s.ClosestPoint(p);
            var r = p - sp.Point;
            Assert.Equal(sp.Point.Z, s.HeightAt(sp.Point.X, sp.Point.Y), 9);
            Assert.True(Vec3.Cross(r, sp.Normal).Length <= 1e-8 * Math.Max(1, r.Length), $"{name}: residual not along the normal at {sp.Point}");
            Assert.Equal(r.Length, Math.Abs(sp.SignedDistance), 9);
        }
    }
}
