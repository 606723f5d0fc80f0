using Tessel.Core.Targets.Formulas;

namespace Tessel.Tests.Targets.Formulas;

public class FormulaParserTests
{
    private static double Eval(string f, double x = 0, double y = 0) => FormulaParser.Parse(f).Evaluate(x, y).V;

    [Theory]
    [InlineData("-x^2", 3, -9)]
    [InlineData("2^3^2", 0, 512)]          // right-associative: 2^(3^2)
    [InlineData("(2^3)^2", 0, 64)]
    [InlineData("2^-1", 0, 0.5)]
    [InlineData("-2^2", 0, -4)]             // unary minus binds looser than ^
    [InlineData("(-2)^2", 0, 4)]
    [InlineData("1 - 2 - 3", 0, -4)]        // left-associative
    [InlineData("8 / 4 / 2", 0, 1)]
    [InlineData("2 + 3 * 4", 0, 14)]
    [InlineData("- -x", 5, 5)]
    public void PrecedenceAndAssociativity(string f, double x, double expected)
    {
        Assert.Equal(expected, Eval(f, x), 12);
    }

    [Fact]
    public void ConstantsAndFunctions()
    {
        Assert.Equal(Math.PI, Eval("pi"), 15);
        Assert.Equal(Math.E, Eval("e"), 15);
        Assert.Equal(1500, Eval("1.5e3"), 12);
        Assert.Equal(Math.Sqrt(2) / 2, Eval("sin(pi/4)"), 15);
        Assert.Equal(3, Eval("abs(-3)"), 15);
    }

    [Fact]
    public void RandomFormulasAgreeWithSystemMath()
    {
        // Random expression trees built twice: as text for our parser and as a closure over System.Math.
        var rng = new Random(20261202);
        for (int n = 0; n < 400; n++)
        {
            var (text, fn) = RandomExpr(rng, 4);
            var node = FormulaParser.Parse(text);
            for (int k = 0; k < 5; k++)
            {
                double x = rng.NextDouble() * 4 - 2, y = rng.NextDouble() * 4 - 2;
                double expected = fn(x, y), actual = node.Evaluate(x, y).V;
                if (double.IsNaN(expected)) { Assert.True(double.IsNaN(actual), text); continue; }
                if (double.IsInfinity(expected)) { Assert.Equal(expected, actual); continue; }
                Assert.True(Math.Abs(actual - expected) <= 1e-12 * Math.Max(1, Math.Abs(expected)), $"{text} at ({x}, {y}): {actual} vs {expected}");
            }
        }
    }

    private static (string, Func<double, double, double>) RandomExpr(Random rng, int depth)
    {
        if (depth == 0 || rng.Next(4) == 0)
        {
            switch (rng.Next(3))
            {
                case 0: return ("x", (x, y) => x);
                case 1: return ("y", (x, y) => y);
                default:
                    double c = Math.Round(rng.NextDouble() * 5, 2);
                    string s = c.ToString("R", System.Globalization.CultureInfo.InvariantCulture);
                    return (s, (x, y) => c);
            }
        }
        var (a, fa) = RandomExpr(rng, depth - 1);
        var (b, fb) = RandomExpr(rng, depth - 1);
        return rng.Next(12) switch
        {
            0 => ($"({a} + {b})", (x, y) => fa(x, y) + fb(x, y)),
            1 => ($"({a} - {b})", (x, y) => fa(x, y) - fb(x, y)),
            2 => ($"({a} * {b})", (x, y) => fa(x, y) * fb(x, y)),
            3 => ($"({a} / {b})", (x, y) => fa(x, y) / fb(x, y)),
            4 => ($"({a})^2", (x, y) => Math.Pow(fa(x, y), 2)),
            5 => ($"-({a})", (x, y) => -fa(x, y)),
            6 => ($"sin({a})", (x, y) => Math.Sin(fa(x, y))),
            7 => ($"cos({a})", (x, y) => Math.Cos(fa(x, y))),
            8 => ($"atan({a})", (x, y) => Math.Atan(fa(x, y))),
            9 => ($"exp({a} / 10)", (x, y) => Math.Exp(fa(x, y) / 10)),
            10 => ($"sqrt(abs({a}))", (x, y) => Math.Sqrt(Math.Abs(fa(x, y)))),
            _ => ($"log(1 + ({a})^2)", (x, y) => Math.Log(1 + Math.Pow(fa(x, y), 2))),
        };
    }

    [Theory]
    [InlineData("x +", 4, "a number, x, y")]
    [InlineData("2x", 2, "an operator")]
    [InlineData("sin x", 5, "'(' after sin")]
    [InlineData("(x + y", 7, "')'")]
    [InlineData("x * foo(y)", 5, "x, y, pi, e or one of the functions")]
    [InlineData("x $ y", 3, "an operator")]
    [InlineData("", 1, "a formula")]
    [InlineData("sqrt(x", 7, "')' closing sqrt(")]
    public void SyntaxErrorsGiveTheColumnAndWhatWasExpected(string text, int column, string expected)
    {
        var e = Assert.Throws<FormulaSyntaxError>(() => FormulaParser.Parse(text));
        Assert.Equal(column, e.Column);
        Assert.Contains(expected, e.Expected);
    }

    [Theory]
    [InlineData("0.1*(x^2 - y^2) + x*y/7")]
    [InlineData("sin(x) * cos(2*y) + exp(x*y/10)")]
    [InlineData("sqrt(9 + x^2 + y^2) - log(3 + x) + atan(y/2)")]
    [InlineData("(x + 3)^(1 + y/5)")]
    [InlineData("tan(x/4) + asin(y/4) + acos(x/5)/(2 + y)")]
    [InlineData("-x^2/(1 + abs(y)) + x^3 - y^4")]
    public void DerivativesMatchFiniteDifferences(string text)
    {
        // Central differences, error O(h^2) (common practice, no source); h chosen so truncation and
        // rounding are both near 1e-7.
        var f = FormulaParser.Parse(text);
        double V(double x, double y) => f.Evaluate(x, y).V;
        var rng = new Random(99);
        for (int i = 0; i < 20; i++)
        {
            double x = rng.NextDouble() * 2 - 1, y = rng.NextDouble() * 2 - 1;
            var j = f.Evaluate(x, y);
            const double h = 1e-4;
            double fx = (V(x + h, y) - V(x - h, y)) / (2 * h);
            double fy = (V(x, y + h) - V(x, y - h)) / (2 * h);
            double fxx = (V(x + h, y) - 2 * V(x, y) + V(x - h, y)) / (h * h);
            double fyy = (V(x, y + h) - 2 * V(x, y) + V(x, y - h)) / (h * h);
            double fxy = (V(x + h, y + h) - V(x + h, y - h) - V(x - h, y + h) + V(x - h, y - h)) / (4 * h * h);
            Assert.Equal(fx, j.X, 6);
            Assert.Equal(fy, j.Y, 6);
            Assert.Equal(fxx, j.XX, 4);
            Assert.Equal(fyy, j.YY, 4);
            Assert.Equal(fxy, j.XY, 4);
        }
    }
}
