using System.Globalization;

namespace Tessel.Core.Targets.Formulas;

/// <summary>Recursive-descent parser for z = f(x, y) formulas.</summary>
/// <remarks>Grammar (lowest precedence first):
/// <code>
/// sum     = product { ("+" | "-") product }
/// product = unary { ("*" | "/") unary }
/// unary   = ("-" | "+") unary | power
/// power   = atom [ "^" unary ]          (right-associative; -x^2 = -(x^2); 2^-1 allowed)
/// atom    = number | "x" | "y" | "pi" | "e" | function "(" sum ")" | "(" sum ")"
/// </code>
/// There is no implicit multiplication: write 2*x, not 2x.</remarks>
public static class FormulaParser
{
    /// <summary>The functions a formula may call, each with one argument (angles in radians).</summary>
    public static readonly IReadOnlyList<string> Functions =
        ["sin", "cos", "tan", "asin", "acos", "atan", "exp", "log", "sqrt", "abs"];

    /// <summary>Longest formula accepted, in characters.</summary>
    public const int MaxLength = 10_000;

    /// <summary>Deepest formula accepted: operations nested inside one another (a chain such as x+x+x
    /// counts one level per operator, a minus sign or a function call one level) and, separately,
    /// parentheses, calls and signs open at once. Parsing and
    /// evaluation recurse, so this bound keeps them far from the thread's stack limit.</summary>
    public const int MaxDepth = 200;

    /// <summary>Parses <paramref name="text"/>.</summary>
    /// <exception cref="FormulaSyntaxError">With the 1-based column and what was expected.</exception>
    public static FormulaNode Parse(string text)
    {
        if (text.Length > MaxLength)
            throw new FormulaSyntaxError(MaxLength + 1, $"the end of the formula (formulas are limited to {MaxLength} characters)", $"{text.Length} characters");
        var p = new State(text);
        p.SkipSpace();
        if (p.AtEnd) throw new FormulaSyntaxError(1, "a formula in x and y", "nothing");
        var node = p.Sum().Node;
        p.SkipSpace();
        if (!p.AtEnd) throw p.Error("an operator (+ - * / ^) or the end of the formula");
        return node;
    }

    private sealed class State(string text)
    {
        private int _pos;

        public bool AtEnd => _pos >= text.Length;

        public void SkipSpace()
        {
            while (_pos < text.Length && char.IsWhiteSpace(text[_pos])) _pos++;
        }

        private char Peek() { SkipSpace(); return AtEnd ? '\0' : text[_pos]; }

        public FormulaSyntaxError Error(string expected)
        {
            SkipSpace();
            string found = AtEnd ? "the end of the formula" : Quote(Token());
            return new FormulaSyntaxError(_pos + 1, expected, found);
        }

        private string Token()
        {
            int end = _pos;
            if (char.IsLetterOrDigit(text[end]) || text[end] == '.')
                while (end < text.Length && (char.IsLetterOrDigit(text[end]) || text[end] == '.' || text[end] == '_')) end++;
            else end++;
            return text[_pos..end];
        }

        private static string Quote(string s) => "'" + s + "'";

        // Each method returns the node and the depth of its tree; _nesting counts the open
        // parentheses, calls and unary signs the recursion is inside.
        private int _nesting;

        private (FormulaNode Node, int Depth) Deeper(FormulaNode node, int depth)
        {
            if (depth > MaxDepth) throw Error($"a simpler formula (at most {MaxDepth} nested operations)");
            return (node, depth);
        }

        private void Enter()
        {
            if (++_nesting > MaxDepth) throw Error($"a simpler formula (at most {MaxDepth} nested parentheses, calls or signs)");
        }

        public (FormulaNode Node, int Depth) Sum()
        {
            var left = Product();
            while (true)
            {
                char c = Peek();
                if (c != '+' && c != '-') return left;
                _pos++;
                var right = Product();
                left = Deeper(new BinaryNode(c, left.Node, right.Node), 1 + Math.Max(left.Depth, right.Depth));
            }
        }

        private (FormulaNode Node, int Depth) Product()
        {
            var left = Unary();
            while (true)
            {
                char c = Peek();
                if (c != '*' && c != '/') return left;
                _pos++;
                var right = Unary();
                left = Deeper(new BinaryNode(c, left.Node, right.Node), 1 + Math.Max(left.Depth, right.Depth));
            }
        }

        private (FormulaNode Node, int Depth) Unary()
        {
            char c = Peek();
            if (c == '-' || c == '+')
            {
                Enter();
                _pos++;
                var inner = Unary();
                _nesting--;
                return c == '-' ? Deeper(new NegateNode(inner.Node), inner.Depth + 1) : inner;
            }
            return Power();
        }

        private (FormulaNode Node, int Depth) Power()
        {
            var baseNode = Atom();
            if (Peek() != '^') return baseNode;
            _pos++;
            var exponent = Unary();
            return Deeper(new BinaryNode('^', baseNode.Node, exponent.Node), 1 + Math.Max(baseNode.Depth, exponent.Depth));
        }

        private (FormulaNode Node, int Depth) Atom()
        {
            char c = Peek();
            if (char.IsDigit(c) || c == '.') return (Number(), 0);
            if (c == '(')
            {
                Enter();
                _pos++;
                var inner = Sum();
                if (Peek() != ')') throw Error("')'");
                _pos++;
                _nesting--;
                return inner;
            }
            if (char.IsLetter(c))
            {
                int start = _pos;
                while (_pos < text.Length && (char.IsLetterOrDigit(text[_pos]) || text[_pos] == '_')) _pos++;
                string name = text[start.._pos];
                switch (name)
                {
                    case "x": return (new VariableNode('x'), 0);
                    case "y": return (new VariableNode('y'), 0);
                    case "pi": return (new NumberNode(Math.PI), 0);
                    case "e": return (new NumberNode(Math.E), 0);
                }
                if (Functions.Contains(name))
                {
                    if (Peek() != '(') throw Error($"'(' after {name}");
                    Enter();
                    _pos++;
                    var arg = Sum();
                    if (Peek() != ')') throw Error($"')' closing {name}(");
                    _pos++;
                    _nesting--;
                    return Deeper(new CallNode(name, arg.Node), arg.Depth + 1);
                }
                _pos = start;
                throw Error("x, y, pi, e or one of the functions " + string.Join(", ", Functions));
            }
            throw Error("a number, x, y, pi, e, a function or '('");
        }

        private FormulaNode Number()
        {
            int start = _pos;
            while (_pos < text.Length && char.IsDigit(text[_pos])) _pos++;
            if (_pos < text.Length && text[_pos] == '.')
            {
                _pos++;
                while (_pos < text.Length && char.IsDigit(text[_pos])) _pos++;
            }
            // An exponent only when digits follow, so "2e" is not half a number.
            if (_pos < text.Length && (text[_pos] == 'e' || text[_pos] == 'E'))
            {
                int save = _pos++;
                if (_pos < text.Length && (text[_pos] == '+' || text[_pos] == '-')) _pos++;
                if (_pos < text.Length && char.IsDigit(text[_pos]))
                    while (_pos < text.Length && char.IsDigit(text[_pos])) _pos++;
                else _pos = save;
            }
            string s = text[start.._pos];
            if (s == "." || !double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
            {
                _pos = start;
                throw Error("a number");
            }
            return new NumberNode(v);
        }
    }
}
