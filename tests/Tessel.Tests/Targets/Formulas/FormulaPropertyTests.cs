using FsCheck.Xunit;
using Tessel.Core.Targets.Formulas;

namespace Tessel.Tests.Targets.Formulas;

public class FormulaPropertyTests
{
    private static readonly FormulaNode Square = FormulaParser.Parse("(x + y)^2");
    private static readonly FormulaNode Expanded = FormulaParser.Parse("x^2 + 2*x*y + y^2");

    [Property(MaxTest = 200)]
    public bool AlgebraicallyEqualFormulasHaveEqualJets(int a, int b)
    {
        // (x + y)^2 = x^2 + 2xy + y^2, so value and every derivative must agree (binomial identity).
        double x = (a % 1000) / 37.0, y = (b % 1000) / 53.0;
        var p = Square.Evaluate(x, y);
        var q = Expanded.Evaluate(x, y);
        double tol = 1e-12 * (1 + Math.Abs(p.V));
        return Math.Abs(p.V - q.V) <= tol && Math.Abs(p.X - q.X) <= tol && Math.Abs(p.Y - q.Y) <= tol
            && Math.Abs(p.XX - 2) <= 1e-12 && Math.Abs(q.XY - 2) <= 1e-12 && Math.Abs(p.YY - q.YY) <= 1e-12;
    }
}
