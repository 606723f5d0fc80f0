namespace Tessel.Core.Targets.Formulas;

/// <summary>A node of a parsed formula z = f(x, y). Evaluating it never runs user code: it walks
/// this tree with <see cref="Jet2"/> arithmetic.</summary>
public abstract record FormulaNode
{
    /// <summary>Value and exact first and second derivatives at (x, y).</summary>
    public Jet2 Evaluate(double x, double y) => Eval(Jet2.VariableX(x), Jet2.VariableY(y));

    /// <summary>Evaluates with the given x and y jets (lets callers change variables).</summary>
    public abstract Jet2 Eval(Jet2 x, Jet2 y);
}

/// <summary>A numeric literal or named constant.</summary>
public sealed record NumberNode(double Value) : FormulaNode
{
    public override Jet2 Eval(Jet2 x, Jet2 y) => Jet2.Constant(Value);
}

/// <summary>The variable x or y.</summary>
public sealed record VariableNode(char Name) : FormulaNode
{
    public override Jet2 Eval(Jet2 x, Jet2 y) => Name == 'x' ? x : y;
}

/// <summary>Unary minus.</summary>
public sealed record NegateNode(FormulaNode Operand) : FormulaNode
{
    public override Jet2 Eval(Jet2 x, Jet2 y) => -Operand.Eval(x, y);
}

/// <summary>One of + - * / ^.</summary>
public sealed record BinaryNode(char Op, FormulaNode Left, FormulaNode Right) : FormulaNode
{
    public override Jet2 Eval(Jet2 x, Jet2 y)
    {
        var a = Left.Eval(x, y);
        var b = Right.Eval(x, y);
        return Op switch
        {
            '+' => a + b,
            '-' => a - b,
            '*' => a * b,
            '/' => a / b,
            '^' => Jet2.Pow(a, b),
            _ => throw new InvalidOperationException($"unknown operator {Op}"),
        };
    }
}

/// <summary>A call of one of <see cref="FormulaParser.Functions"/>.</summary>
public sealed record CallNode(string Function, FormulaNode Argument) : FormulaNode
{
    public override Jet2 Eval(Jet2 x, Jet2 y)
    {
        var u = Argument.Eval(x, y);
        return Function switch
        {
            "sin" => Jet2.Sin(u),
            "cos" => Jet2.Cos(u),
            "tan" => Jet2.Tan(u),
            "asin" => Jet2.Asin(u),
            "acos" => Jet2.Acos(u),
            "atan" => Jet2.Atan(u),
            "exp" => Jet2.Exp(u),
            "log" => Jet2.Log(u),
            "sqrt" => Jet2.Sqrt(u),
            "abs" => Jet2.Abs(u),
            _ => throw new InvalidOperationException($"unknown function {Function}"),
        };
    }
}
