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

    /// <summary>Parses <paramref name="text"/>.</summary>
    /// <exception cref="FormulaSyntaxError">With the 1-based column and what was expected.</exception>
    public static FormulaNode Parse(string text)
    {
        var p = new State(text);
        p.SkipSpace();
        if (p.AtEnd) throw new FormulaSyntaxError(1, "a formula in x and y", "nothing");
        var node = p.Sum();
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

        public FormulaNode Sum()
        {
            var left = Product();
            while (true)
            {
                char c = Peek();
                if (c != '+' && c != '-') return left;
                _pos++;
                left = new BinaryNode(c, left, Product());
            }
        }

        private FormulaNode Product()
        {
            var left = Unary();
            while (true)
            {
                char c = Peek();
                if (c != '*' && c != '/') return left;
                _pos++;
                left = new BinaryNode(c, left, Unary());
            }
        }

        private FormulaNode Unary()
        {
            char c = Peek();
            if (c == '-') { _pos++; return new NegateNode(Unary()); }
            if (c == '+') { _pos++; return Unary(); }
            return Power();
        }

        private FormulaNode Power()
        {
            var baseNode = Atom();
            if (Peek() != '^') return baseNode;
            _pos++;
            return new BinaryNode('^', baseNode, Unary());
        }

        private FormulaNode Atom()
        {
            char c = Peek();
            if (char.IsDigit(c) || c == '.') return Number();
            if (c == '(')
            {
                _pos++;
                var inner = Sum();
                if (Peek() != ')') throw Error("')'");
                _pos++;
                return inner;
            }
            if (char.IsLetter(c))
            {
                int start = _pos;
                while (_pos < text.Length && (char.IsLetterOrDigit(text[_pos]) || text[_pos] == '_')) _pos++;
                string name = text[start.._pos];
                switch (name)
                {
                    case "x": return new VariableNode('x');
                    case "y": return new VariableNode('y');
                    case "pi": return new NumberNode(Math.PI);
                    case "e": return new NumberNode(Math.E);
                }
                if (Functions.Contains(name))
                {
                    if (Peek() != '(') throw Error($"'(' after {name}");
                    _pos++;
                    var arg = Sum();
                    if (Peek() != ')') throw Error($"')' closing {name}(");
                    _pos++;
                    return new CallNode(name, arg);
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
