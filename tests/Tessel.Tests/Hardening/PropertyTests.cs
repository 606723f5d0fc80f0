using System.Globalization;
using System.Text;
using System.Text.Json;
using FsCheck;
using FsCheck.Fluent;
using Tessel.Core.Jobs;
using Tessel.Core.Targets;
using Tessel.Core.Targets.Formulas;
using Tessel.Core.Targets.Meshes;
using Tessel.Output.IO;
using Tessel.Output.Writers;

namespace Tessel.Tests.Hardening;

/// <summary>FsCheck properties over the formula parser, the job loader and the OBJ writer/reader pair.
/// Every run replays the same seed, so a failure reproduces.</summary>
public class PropertyTests
{
    private static Config Seeded(int tests) => Config.QuickThrowOnFailure.WithMaxTest(tests).WithReplay(20261202UL, 1442695040888963407UL);

    // ---- formulas -------------------------------------------------------------------------------

    private static readonly string[] Fns = FormulaParser.Functions.ToArray();

    private static Gen<FormulaNode> Leaf() => Gen.OneOf(
        Gen.Elements(new FormulaNode[] { new VariableNode('x'), new VariableNode('y'), new NumberNode(Math.PI) }),
        Gen.Choose(0, 100_000).Select(i => (FormulaNode)new NumberNode(i / 100.0)),
        Gen.Choose(1, 9).Select(i => (FormulaNode)new NumberNode(i * Math.Pow(10, 3 * i - 15))));

    /// <summary>Lazily built, so only the branches actually drawn are constructed.</summary>
    private static Gen<FormulaNode> Sub(int size) => Gen.Constant(size).SelectMany(Tree);

    private static Gen<FormulaNode> Tree(int size) => size <= 0 ? Leaf() : Gen.Frequency(
        (2, Leaf()),
        (4, Gen.Elements(new[] { '+', '-', '*', '/' }).SelectMany(op => Sub(size / 2).SelectMany(a => Sub(size / 2).Select(b => (FormulaNode)new BinaryNode(op, a, b))))),
        (1, Sub(size - 1).Select(a => (FormulaNode)new NegateNode(a))),
        (1, Sub(size / 2).SelectMany(a => Gen.Choose(-3, 4).Select(k => (FormulaNode)new BinaryNode('^', a, k < 0 ? new NegateNode(new NumberNode(-k)) : new NumberNode(k))))),
        (2, Gen.Elements(Fns).SelectMany(f => Sub(size - 1).Select(a => (FormulaNode)new CallNode(f, a)))));

    private static int Prec(FormulaNode n) => n switch
    {
        BinaryNode { Op: '+' or '-' } => 1,
        BinaryNode { Op: '*' or '/' } => 2,
        NegateNode => 3,
        BinaryNode { Op: '^' } => 4,
        _ => 5,
    };

    /// <summary>Prints with the fewest parentheses the grammar allows, so the parser's precedence and
    /// associativity are what the round trip tests.</summary>
    public static string Print(FormulaNode n, int need = 1)
    {
        string s = n switch
        {
            NumberNode num when num.Value == Math.PI => "pi",
            NumberNode num => num.Value.ToString("R", CultureInfo.InvariantCulture),
            VariableNode v => v.Name.ToString(),
            NegateNode neg => "-" + Print(neg.Operand, 3),
            BinaryNode { Op: '+' or '-' } b => $"{Print(b.Left, 1)} {b.Op} {Print(b.Right, 2)}",
            BinaryNode { Op: '*' or '/' } b => $"{Print(b.Left, 2)} {b.Op} {Print(b.Right, 3)}",
            BinaryNode b => $"{Print(b.Left, 5)}^{Print(b.Right, 3)}",
            CallNode c => $"{c.Function}({Print(c.Argument, 1)})",
            _ => throw new ArgumentException(n.ToString()),
        };
        return Prec(n) < need ? "(" + s + ")" : s;
    }

    /// <summary>The meaning of a tree, written directly with System.Math (exponents are constants here).</summary>
    public static double Direct(FormulaNode n, double x, double y) => n switch
    {
        NumberNode num => num.Value,
        VariableNode v => v.Name == 'x' ? x : y,
        NegateNode neg => -Direct(neg.Operand, x, y),
        BinaryNode b => b.Op switch
        {
            '+' => Direct(b.Left, x, y) + Direct(b.Right, x, y),
            '-' => Direct(b.Left, x, y) - Direct(b.Right, x, y),
            '*' => Direct(b.Left, x, y) * Direct(b.Right, x, y),
            // As the jet does: a varying denominator is applied as its reciprocal.
            '/' => HasVariable(b.Right) ? Direct(b.Left, x, y) * (1 / Direct(b.Right, x, y)) : Direct(b.Left, x, y) / Direct(b.Right, x, y),
            _ => Direct(b.Right, x, y) switch { 0.0 => 1.0, 1.0 => Direct(b.Left, x, y), var c => Math.Pow(Direct(b.Left, x, y), c) },
        },
        CallNode c => c.Function switch
        {
            "sin" => Math.Sin(Direct(c.Argument, x, y)),
            "cos" => Math.Cos(Direct(c.Argument, x, y)),
            "tan" => Math.Tan(Direct(c.Argument, x, y)),
            "asin" => Math.Asin(Direct(c.Argument, x, y)),
            "acos" => Math.Acos(Direct(c.Argument, x, y)),
            "atan" => Math.Atan(Direct(c.Argument, x, y)),
            "exp" => Math.Exp(Direct(c.Argument, x, y)),
            "log" => Math.Log(Direct(c.Argument, x, y)),
            "sqrt" => Math.Sqrt(Direct(c.Argument, x, y)),
            _ => Math.Abs(Direct(c.Argument, x, y)),
        },
        _ => throw new ArgumentException(n.ToString()),
    };

    private static bool HasVariable(FormulaNode n) => n switch
    {
        VariableNode => true,
        NegateNode g => HasVariable(g.Operand),
        BinaryNode b => HasVariable(b.Left) || HasVariable(b.Right),
        CallNode c => HasVariable(c.Argument),
        _ => false,
    };

    private static bool Same(double a, double b) =>
        a.Equals(b) || (double.IsNaN(a) && double.IsNaN(b)) || Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Abs(a));

    [Fact]
    public void PrintedTreesParseBackToTheSameTreeAndValue()
    {
        var gen = Gen.Sized(s => Tree(Math.Min(s, 24)))
            .SelectMany(t => Gen.Choose(-300, 300).Two().Select(p => (Tree: t, X: p.Item1 / 97.0, Y: p.Item2 / 89.0)));
        int checkedCount = 0;
        Check.One(Seeded(500), Prop.ForAll(gen.ToArbitrary(), c =>
        {
            string text = Print(c.Tree);
            var parsed = FormulaParser.Parse(text);
            double expected = Direct(c.Tree, c.X, c.Y), actual = parsed.Evaluate(c.X, c.Y).V;
            checkedCount++;
            return parsed.Equals(c.Tree) && Same(expected, actual);
        }));
        Assert.Equal(500, checkedCount);
        // The printer really drops parentheses: precedence decides, not brackets.
        Assert.Equal("-x^2 + y * (x - 1)", Print(new BinaryNode('+', new NegateNode(new BinaryNode('^', new VariableNode('x'), new NumberNode(2))),
            new BinaryNode('*', new VariableNode('y'), new BinaryNode('-', new VariableNode('x'), new NumberNode(1))))));
    }

    private const string FormulaChars = "xy0123456789.+-*/^() \teEsincotaqrlgbp_,;$#'\"\\é∑\u0000";

    [Fact]
    public void RandomTextOnlyEverGivesTheParsersOwnErrorWithAColumnInsideTheText()
    {
        var gen = Gen.ArrayOf(Gen.Elements(FormulaChars.ToCharArray())).Select(cs => new string(cs));
        int errors = 0;
        Check.One(Seeded(2000), Prop.ForAll(gen.ToArbitrary(), text =>
        {
            try { FormulaParser.Parse(text); return true; }
            catch (FormulaSyntaxError e)
            {
                errors++;
                // Column text.Length + 1 is "the end of the formula", just after the last character.
                return e.Column >= 1 && e.Column <= Math.Max(1, text.Length + 1) && e.Message.StartsWith($"column {e.Column}: expected ", StringComparison.Ordinal);
            }
        }));
        Assert.True(errors > 1000, $"only {errors} of 2000 random texts were refused; the generator is too tame");
    }

    [Theory]
    [InlineData(10_001, FormulaParser.MaxLength + 1)]
    [InlineData(250_000, FormulaParser.MaxLength + 1)]
    public void OverlongFormulasAreRefusedAtTheLengthLimit(int length, int column)
    {
        string text = "x" + new string(' ', length - 1);
        var e = Assert.Throws<FormulaSyntaxError>(() => FormulaParser.Parse(text));
        Assert.Equal(column, e.Column);
        Assert.Contains("limited to 10000 characters", e.Message);
    }

    [Theory]
    [InlineData(200, true)]
    [InlineData(201, false)]
    public void NestingIsLimitedTo200Levels(int depth, bool accepted)
    {
        string parens = new string('(', depth) + "x" + new string(')', depth);
        string chain = string.Join("+", Enumerable.Repeat("x", depth + 1)); // depth operators in a chain
        string signs = new string('-', depth) + "x";
        foreach (var text in new[] { parens, chain, signs })
        {
            if (accepted) { Assert.NotNull(FormulaParser.Parse(text)); continue; }
            var e = Assert.Throws<FormulaSyntaxError>(() => FormulaParser.Parse(text));
            Assert.Contains("at most 200 nested", e.Message);
            Assert.InRange(e.Column, 1, text.Length + 1);
        }
    }

    // ---- job loader -----------------------------------------------------------------------------

    private static readonly string[] Words = JobLoader.KnownFieldPaths().Select(p => p.Split('.')[^1])
        .Concat(Catalog.TargetKinds.Select(k => k.Name)).Concat(Catalog.Families.Select(f => f.Name))
        .Concat(["", "A3", "m", "score", "none", "auto", "#ff0000", "../x", "/etc/passwd", "NaN", "Infinity", "\u0000", "é"]).Distinct().ToArray();

    private static Gen<string> JsonValue(int size) => size <= 0
        ? Gen.OneOf(
            Gen.Elements(new[] { "null", "true", "false", "0", "-1", "1e308", "-1e308", "1e999", "5e-324", "2147483648", "0.5", "12", "500", "501" }),
            Gen.Elements(Words).Select(w => JsonSerializer.Serialize(w)))
        : Gen.Frequency(
            (3, JsonValue(0)),
            (1, Gen.ListOf(JsonValue(size / 3)).Select(xs => "[" + string.Join(", ", xs) + "]")),
            (2, Gen.Choose(0, 6).SelectMany(n => Gen.CollectToArray(Enumerable.Range(0, n).Select(_ =>
                Gen.Elements(Words).SelectMany(k => JsonValue(size / 3).Select(v => JsonSerializer.Serialize(k) + ": " + v)))))
                .Select(kv => "{ " + string.Join(", ", kv) + " }")));

    [Fact]
    public void RandomJsonOnlyEverGivesJobError()
    {
        string dir = TestPaths.NewTempFolder();
        var paths = JobLoader.KnownFieldPaths().ToArray();
        string[] bases = JobCorpus.Bases.Select(b => b.Text).ToArray();
        // Either a random document, or a valid job with one known field replaced by a random value.
        var gen = Gen.OneOf(
            Gen.Sized(s => JsonValue(Math.Min(s, 30))),
            Gen.Elements(bases).SelectMany(b => Gen.Elements(paths).SelectMany(p => JsonValue(6).Select(v => JobCorpus.WithField(b, p, v)))));
        int refused = 0, loaded = 0;
        Check.One(Seeded(600), Prop.ForAll(gen.ToArbitrary(), text =>
        {
            try
            {
                var job = JobLoader.Parse(text, "fuzz.json", dir);
                TargetFactory.Build(job.Target, job.BaseDirectory, HeightMapImage.Decode);
                loaded++;
            }
            catch (JobError e)
            {
                refused++;
                Assert.False(string.IsNullOrWhiteSpace(e.Where));
                Assert.DoesNotContain('\n', e.Message);
            }
            return true; // any other exception fails the property
        }));
        Assert.True(refused > 300, $"{refused} refused");
        Assert.True(loaded > 0, "no random edit left a valid job; the generator never reaches the deeper checks");
    }

    // ---- OBJ writer -> reader -------------------------------------------------------------------

    private static readonly Gen<double> Coordinate = Gen.OneOf(
        Gen.Choose(-1_000_000, 1_000_000).Select(i => i / 1000.0),
        Gen.Elements(new[] { 0.0, -0.0, 1e-300, -1e300, double.Epsilon, 1.0 / 3, Math.PI, 123456789.123456789, double.MaxValue, double.MinValue }),
        Gen.Choose(-300, 300).SelectMany(e => Gen.Choose(1, 999_999).Select(m => m * Math.Pow(10, e - 6))));

    private static readonly Gen<TriangleMesh> Meshes =
        Gen.Choose(3, 40).SelectMany(v =>
            Gen.ArrayOf(Coordinate, 3 * v).SelectMany(pos =>
                Gen.Choose(1, 60).SelectMany(t =>
                    Gen.ArrayOf(Gen.Choose(0, v - 1), 3 * t).Select(tri => new TriangleMesh(pos, tri)))));

    [Fact]
    public void ObjWriterOutputReadsBackToTheSameMesh()
    {
        var comment = Gen.Elements(new[] { "", "job x", "two\nlines", "v 1 2 3\nf 1 2 3", "\r\n# already\nf -1 -2 -3", "é ∑ \u0000" });
        int meshes = 0;
        Check.One(Seeded(300), Prop.ForAll(Meshes.SelectMany(m => comment.Select(c => (m, c))).ToArbitrary(), p =>
        {
            byte[] bytes = ObjWriter.Write(p.m, p.c);
            var back = ObjMeshReader.Parse(Encoding.UTF8.GetString(bytes), "round.obj");
            meshes++;
            // Bit-for-bit: "R" formatting round-trips every double; comments cannot add records.
            return back.Triangles.SequenceEqual(p.m.Triangles)
                && back.Positions.Length == p.m.Positions.Length
                && back.Positions.Zip(p.m.Positions).All(z => BitConverter.DoubleToInt64Bits(z.First) == BitConverter.DoubleToInt64Bits(z.Second));
        }));
        Assert.Equal(300, meshes);
    }
}
