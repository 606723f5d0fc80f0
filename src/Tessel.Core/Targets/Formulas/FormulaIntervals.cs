namespace Tessel.Core.Targets.Formulas;

/// <summary>What can go wrong with a formula somewhere in a box.</summary>
public enum FormulaTrouble
{
    /// <summary>Smooth over the whole box.</summary>
    None,
    /// <summary>Not twice differentiable somewhere: abs at zero, or an infinite slope (sqrt at zero,
    /// asin or acos at +-1, a fractional power of zero).</summary>
    Kink,
    /// <summary>Undefined or infinite somewhere: division by zero, log or sqrt of a negative number,
    /// tan at its pole, asin or acos beyond +-1.</summary>
    Pole,
}

/// <summary>Finds poles and kinks of a formula anywhere over a region, not only at sample points, by
/// interval arithmetic on the formula tree (Moore, Kearfott and Cloud, Introduction to Interval
/// Analysis, SIAM 2009, ch. 5 and 6): a box whose intervals show no division by an interval holding
/// zero, no logarithm of a non-positive interval and so on is proven free of trouble; a box that
/// might hold some is bisected until it is proven clean or is tiny, and a tiny one is reported.</summary>
/// <remarks>Interval arithmetic over-estimates ranges (the dependency problem), but the over-estimate
/// shrinks with the box, so only true trouble survives to the smallest boxes. Endpoints are not
/// rounded outward; each box is widened by a relative 1e-9 instead, so that trouble exactly on a
/// bisection line lies strictly inside both halves.</remarks>
public static class FormulaIntervals
{
    /// <summary>Closed interval [Lo, Hi]; infinite ends allowed.</summary>
    public readonly record struct Interval(double Lo, double Hi)
    {
        public static Interval Point(double v) => new(v, v);
        public static readonly Interval Everything = new(double.NegativeInfinity, double.PositiveInfinity);
        public bool Contains(double v) => Lo <= v && v <= Hi;
    }

    /// <summary>Evaluates <paramref name="node"/> over the box x in <paramref name="x"/>, y in
    /// <paramref name="y"/>: an interval holding every value, and the worst trouble that may occur.</summary>
    public static (Interval Range, FormulaTrouble Trouble) Evaluate(FormulaNode node, Interval x, Interval y)
    {
        var trouble = FormulaTrouble.None;
        var range = Eval(node, x, y, ref trouble);
        return (range, trouble);
    }

    /// <summary>The first point (x, y) inside the region where the formula has a pole or a kink, with
    /// which; null when the region is proven clean (or the search gave up after <paramref name="maxBoxes"/>
    /// boxes, which only a formula far larger than any surface needs can cause).</summary>
    /// <param name="inside">Whether a point lies in the region (the footprint).</param>
    public static (double X, double Y, FormulaTrouble Trouble)? FirstTrouble(FormulaNode node, double minX, double maxX, double minY, double maxY,
        Func<double, double, bool> inside, int maxBoxes = 50_000)
    {
        double extent = Math.Max(maxX - minX, maxY - minY);
        double smallest = extent * 1e-7, pad = extent * 1e-9;
        int boxes = 0;
        var stack = new Stack<(double X0, double X1, double Y0, double Y1)>();
        stack.Push((minX, maxX, minY, maxY));
        while (stack.Count > 0 && boxes < maxBoxes)
        {
            var (x0, x1, y0, y1) = stack.Pop();
            boxes++;
            if (Math.Max(x1 - x0, y1 - y0) < extent / 64 && !MayOverlap(inside, x0, x1, y0, y1)) continue;
            var (_, trouble) = Evaluate(node, new Interval(x0 - pad, x1 + pad), new Interval(y0 - pad, y1 + pad));
            if (trouble == FormulaTrouble.None) continue;
            double cx = (x0 + x1) / 2, cy = (y0 + y1) / 2;
            if (Math.Max(x1 - x0, y1 - y0) <= smallest)
            {
                if (inside(cx, cy)) return (cx, cy, trouble);
                continue;
            }
            // Split the longer side; the second half pushed is searched first (depth first, so a
            // true pole is reached in about 50 boxes).
            if (x1 - x0 >= y1 - y0) { stack.Push((cx, x1, y0, y1)); stack.Push((x0, cx, y0, y1)); }
            else { stack.Push((x0, x1, cy, y1)); stack.Push((x0, x1, y0, cy)); }
        }
        return null;
    }

    /// <summary>Whether a small box may touch the region: a corner, the centre or an edge midpoint
    /// inside. Large boxes are always searched, since the region may cross them without touching these
    /// points; for the tiny boxes that are reported the test is as good as exact.</summary>
    private static bool MayOverlap(Func<double, double, bool> inside, double x0, double x1, double y0, double y1)
    {
        double cx = (x0 + x1) / 2, cy = (y0 + y1) / 2;
        return inside(cx, cy) || inside(x0, y0) || inside(x1, y0) || inside(x0, y1) || inside(x1, y1)
            || inside(cx, y0) || inside(cx, y1) || inside(x0, cy) || inside(x1, cy);
    }

    private static void Worse(ref FormulaTrouble t, FormulaTrouble found)
    {
        if (found > t) t = found;
    }

    private static Interval Eval(FormulaNode node, Interval x, Interval y, ref FormulaTrouble t)
    {
        switch (node)
        {
            case NumberNode n: return Interval.Point(n.Value);
            case VariableNode v: return v.Name == 'x' ? x : y;
            case NegateNode neg:
            {
                var a = Eval(neg.Operand, x, y, ref t);
                return new(-a.Hi, -a.Lo);
            }
            case BinaryNode b:
            {
                var a = Eval(b.Left, x, y, ref t);
                var c = Eval(b.Right, x, y, ref t);
                return b.Op switch
                {
                    '+' => new(a.Lo + c.Lo, a.Hi + c.Hi),
                    '-' => new(a.Lo - c.Hi, a.Hi - c.Lo),
                    // u*u is a square, never negative (the interval product alone would not know).
                    '*' => b.Left.Equals(b.Right) ? IntegerPower(a, 2) : Multiply(a, c),
                    '/' => Divide(a, c, ref t),
                    '^' => Power(a, c, IsConstant(b.Right), ref t),
                    _ => Interval.Everything,
                };
            }
            case CallNode call:
            {
                var u = Eval(call.Argument, x, y, ref t);
                return call.Function switch
                {
                    "sin" => Sine(u, 0),
                    "cos" => Sine(u, Math.PI / 2),
                    "tan" => Tangent(u, ref t),
                    "asin" => Arcsine(u, ref t, Math.Asin, increasing: true),
                    "acos" => Arcsine(u, ref t, Math.Acos, increasing: false),
                    "atan" => new(Math.Atan(u.Lo), Math.Atan(u.Hi)),
                    "exp" => new(Math.Exp(u.Lo), Math.Exp(u.Hi)),
                    "log" => Logarithm(u, ref t),
                    "sqrt" => SquareRoot(u, ref t),
                    "abs" => Absolute(u, ref t),
                    _ => Interval.Everything,
                };
            }
            default: return Interval.Everything;
        }
    }

    private static bool IsConstant(FormulaNode node) => node switch
    {
        NumberNode => true,
        VariableNode => false,
        NegateNode n => IsConstant(n.Operand),
        BinaryNode b => IsConstant(b.Left) && IsConstant(b.Right),
        CallNode c => IsConstant(c.Argument),
        _ => false,
    };

    private static Interval Multiply(Interval a, Interval b)
    {
        double p1 = a.Lo * b.Lo, p2 = a.Lo * b.Hi, p3 = a.Hi * b.Lo, p4 = a.Hi * b.Hi;
        if (double.IsNaN(p1) || double.IsNaN(p2) || double.IsNaN(p3) || double.IsNaN(p4)) return Interval.Everything; // 0 * infinity
        return new(Math.Min(Math.Min(p1, p2), Math.Min(p3, p4)), Math.Max(Math.Max(p1, p2), Math.Max(p3, p4)));
    }

    private static Interval Divide(Interval a, Interval b, ref FormulaTrouble t)
    {
        if (b.Contains(0))
        {
            Worse(ref t, FormulaTrouble.Pole);
            return Interval.Everything;
        }
        return Multiply(a, new Interval(1 / b.Hi, 1 / b.Lo));
    }

    private static Interval IntegerPower(Interval a, int n)
    {
        double lo = Math.Pow(a.Lo, n), hi = Math.Pow(a.Hi, n);
        if (n % 2 == 1) return new(lo, hi);
        if (a.Contains(0)) return new(0, Math.Max(lo, hi));
        return new(Math.Min(lo, hi), Math.Max(lo, hi));
    }

    private static Interval Power(Interval a, Interval c, bool constantExponent, ref FormulaTrouble t)
    {
        if (constantExponent && c.Lo == c.Hi)
        {
            double e = c.Lo;
            if (e == 0) return Interval.Point(1);
            if (e == Math.Floor(e) && Math.Abs(e) <= 64)
            {
                var p = IntegerPower(a, (int)Math.Abs(e));
                return e > 0 ? p : Divide(Interval.Point(1), p, ref t);
            }
            // A fractional power: defined for a >= 0 only, steep or singular at 0.
            if (a.Lo < 0) { Worse(ref t, FormulaTrouble.Pole); return Interval.Everything; }
            if (a.Lo == 0)
            {
                if (e < 0) { Worse(ref t, FormulaTrouble.Pole); return Interval.Everything; }
                if (e < 2) Worse(ref t, FormulaTrouble.Kink);
            }
            double lo = Math.Pow(a.Lo, e), hi = Math.Pow(a.Hi, e);
            return new(Math.Min(lo, hi), Math.Max(lo, hi));
        }
        // a^b = exp(b log a): a > 0 only.
        var log = Logarithm(a, ref t);
        if (log.Lo == double.NegativeInfinity) return Interval.Everything;
        var prod = Multiply(c, log);
        return new(Math.Exp(prod.Lo), Math.Exp(prod.Hi));
    }

    /// <summary>sin(u + shift): the ends, widened to +-1 where a crest or trough lies inside.</summary>
    private static Interval Sine(Interval u, double shift)
    {
        double lo = u.Lo + shift, hi = u.Hi + shift;
        if (!double.IsFinite(lo) || !double.IsFinite(hi) || hi - lo >= 2 * Math.PI) return new(-1, 1);
        double a = Math.Sin(lo), b = Math.Sin(hi);
        double min = Math.Min(a, b), max = Math.Max(a, b);
        // Crests at pi/2 + 2k pi, troughs at -pi/2 + 2k pi.
        if (Math.Ceiling((lo - Math.PI / 2) / (2 * Math.PI)) * 2 * Math.PI + Math.PI / 2 <= hi) max = 1;
        if (Math.Ceiling((lo + Math.PI / 2) / (2 * Math.PI)) * 2 * Math.PI - Math.PI / 2 <= hi) min = -1;
        return new(min, max);
    }

    private static Interval Tangent(Interval u, ref FormulaTrouble t)
    {
        // Poles at pi/2 + k pi.
        if (!double.IsFinite(u.Lo) || !double.IsFinite(u.Hi) || Math.Ceiling((u.Lo - Math.PI / 2) / Math.PI) * Math.PI + Math.PI / 2 <= u.Hi)
        {
            Worse(ref t, FormulaTrouble.Pole);
            return Interval.Everything;
        }
        return new(Math.Tan(u.Lo), Math.Tan(u.Hi));
    }

    private static Interval Arcsine(Interval u, ref FormulaTrouble t, Func<double, double> f, bool increasing)
    {
        if (u.Lo < -1 || u.Hi > 1) { Worse(ref t, FormulaTrouble.Pole); return Interval.Everything; }
        if (u.Lo == -1 || u.Hi == 1) Worse(ref t, FormulaTrouble.Kink);
        return increasing ? new(f(u.Lo), f(u.Hi)) : new(f(u.Hi), f(u.Lo));
    }

    private static Interval Logarithm(Interval u, ref FormulaTrouble t)
    {
        if (u.Lo <= 0) { Worse(ref t, FormulaTrouble.Pole); return Interval.Everything; }
        return new(Math.Log(u.Lo), Math.Log(u.Hi));
    }

    private static Interval SquareRoot(Interval u, ref FormulaTrouble t)
    {
        if (u.Lo < 0) { Worse(ref t, FormulaTrouble.Pole); return Interval.Everything; }
        if (u.Lo == 0) Worse(ref t, FormulaTrouble.Kink);
        return new(Math.Sqrt(u.Lo), Math.Sqrt(u.Hi));
    }

    private static Interval Absolute(Interval u, ref FormulaTrouble t)
    {
        if (u.Lo < 0 && u.Hi > 0)
        {
            Worse(ref t, FormulaTrouble.Kink);
            return new(0, Math.Max(-u.Lo, u.Hi));
        }
        return u.Lo >= 0 ? u : new(-u.Hi, -u.Lo);
    }
}
