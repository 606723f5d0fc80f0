namespace Tessel.Core.Targets.Formulas;

/// <summary>A value with its exact first and second partial derivatives in x and y: a second-order
/// forward-mode automatic-differentiation number. Arithmetic follows the product, quotient and chain
/// rules, so derivatives carry no truncation error.</summary>
public readonly record struct Jet2(double V, double X, double Y, double XX, double XY, double YY)
{
    /// <summary>A constant (all derivatives zero).</summary>
    public static Jet2 Constant(double v) => new(v, 0, 0, 0, 0, 0);

    /// <summary>The independent variable x at value <paramref name="v"/>.</summary>
    public static Jet2 VariableX(double v) => new(v, 1, 0, 0, 0, 0);

    /// <summary>The independent variable y at value <paramref name="v"/>.</summary>
    public static Jet2 VariableY(double v) => new(v, 0, 1, 0, 0, 0);

    /// <summary>True when every derivative is zero, so the value acts as a constant at this point.</summary>
    public bool IsLocallyConstant => X == 0 && Y == 0 && XX == 0 && XY == 0 && YY == 0;

    public static Jet2 operator +(Jet2 a, Jet2 b) => new(a.V + b.V, a.X + b.X, a.Y + b.Y, a.XX + b.XX, a.XY + b.XY, a.YY + b.YY);
    public static Jet2 operator -(Jet2 a, Jet2 b) => new(a.V - b.V, a.X - b.X, a.Y - b.Y, a.XX - b.XX, a.XY - b.XY, a.YY - b.YY);
    public static Jet2 operator -(Jet2 a) => new(-a.V, -a.X, -a.Y, -a.XX, -a.XY, -a.YY);

    public static Jet2 operator *(Jet2 a, Jet2 b) => new(
        a.V * b.V,
        a.X * b.V + a.V * b.X,
        a.Y * b.V + a.V * b.Y,
        a.XX * b.V + 2 * a.X * b.X + a.V * b.XX,
        a.XY * b.V + a.X * b.Y + a.Y * b.X + a.V * b.XY,
        a.YY * b.V + 2 * a.Y * b.Y + a.V * b.YY);

    public static Jet2 operator /(Jet2 a, Jet2 b)
    {
        if (b.IsLocallyConstant) return new(a.V / b.V, a.X / b.V, a.Y / b.V, a.XX / b.V, a.XY / b.V, a.YY / b.V);
        double u = b.V;
        return a * Chain(b, 1 / u, -1 / (u * u), 2 / (u * u * u));
    }

    /// <summary>g(u) for a scalar function g with g(u.V) = <paramref name="f"/>, g' = <paramref name="f1"/>,
    /// g'' = <paramref name="f2"/> (second-order chain rule).</summary>
    public static Jet2 Chain(Jet2 u, double f, double f1, double f2) => new(
        f,
        f1 * u.X,
        f1 * u.Y,
        f2 * u.X * u.X + f1 * u.XX,
        f2 * u.X * u.Y + f1 * u.XY,
        f2 * u.Y * u.Y + f1 * u.YY);

    /// <summary>a^b. A locally constant exponent uses the power rule (valid for negative bases and
    /// integer exponents); otherwise exp(b log a), defined for a &gt; 0 only.</summary>
    public static Jet2 Pow(Jet2 a, Jet2 b)
    {
        if (b.IsLocallyConstant)
        {
            double c = b.V, u = a.V;
            if (c == 0) return Constant(Math.Pow(u, 0));
            if (c == 1) return a;
            double f1 = c * Math.Pow(u, c - 1);
            double f2 = c == 2 ? 2 : c * (c - 1) * Math.Pow(u, c - 2);
            return Chain(a, Math.Pow(u, c), f1, f2);
        }
        return Exp(b * Log(a));
    }

    public static Jet2 Sin(Jet2 u) { double s = Math.Sin(u.V), c = Math.Cos(u.V); return Chain(u, s, c, -s); }
    public static Jet2 Cos(Jet2 u) { double s = Math.Sin(u.V), c = Math.Cos(u.V); return Chain(u, c, -s, -c); }
    public static Jet2 Tan(Jet2 u) { double t = Math.Tan(u.V), d = 1 + t * t; return Chain(u, t, d, 2 * t * d); }
    public static Jet2 Asin(Jet2 u) { double q = 1 - u.V * u.V; return Chain(u, Math.Asin(u.V), 1 / Math.Sqrt(q), u.V / (q * Math.Sqrt(q))); }
    public static Jet2 Acos(Jet2 u) { double q = 1 - u.V * u.V; return Chain(u, Math.Acos(u.V), -1 / Math.Sqrt(q), -u.V / (q * Math.Sqrt(q))); }
    public static Jet2 Atan(Jet2 u) { double q = 1 + u.V * u.V; return Chain(u, Math.Atan(u.V), 1 / q, -2 * u.V / (q * q)); }
    public static Jet2 Exp(Jet2 u) { double e = Math.Exp(u.V); return Chain(u, e, e, e); }
    public static Jet2 Log(Jet2 u) => Chain(u, Math.Log(u.V), 1 / u.V, -1 / (u.V * u.V));
    public static Jet2 Sqrt(Jet2 u) { double s = Math.Sqrt(u.V); return Chain(u, s, 0.5 / s, -0.25 / (s * s * s)); }
    public static Jet2 Abs(Jet2 u) => Chain(u, Math.Abs(u.V), u.V > 0 ? 1 : u.V < 0 ? -1 : double.NaN, 0);
}
