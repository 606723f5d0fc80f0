using Tessel.Core.Jobs;
using Tessel.Core.Targets.Formulas;

namespace Tessel.Core.Targets.Kinds;

/// <summary>Any z = f(x, y) typed in the job, with exact derivatives.</summary>
public sealed class FormulaKind : TargetKind
{
    public override string Name => "formula";
    public override string Summary => "any z = f(x, y) you type, with exact derivatives; e.g. 0.1*(x^2 - y^2)";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("formula", ParameterType.Text, Description: "formula: z = f(x, y) with + - * / ^ (right-associative), unary minus (-x^2 = -(x^2)), parentheses, sin cos tan asin acos atan exp log sqrt abs, pi, e; x, y, z in target.units."),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        if (string.IsNullOrWhiteSpace(p.Text("formula")))
            throw check.Error("formula", "missing; write z as a function of x and y, e.g. \"0.1*(x^2 - y^2)\"");
    }

    public override string ScaffoldLines => """
            // z as a function of x and y in the units above: + - * / ^, sin cos tan asin acos atan
            // exp log sqrt abs, pi and e. -x^2 means -(x^2); write 2*x, not 2x.
            // This one is a gentle vault curved across y; try e.g. 2 + 0.01*(x^2 - y^2) for a saddle.
            "formula": "2.5 - 0.02*y^2",
        """;

    public override string UndefinedField => "target.formula";
    public override string UndefinedFix => "change the formula";

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        string text = spec.Parameters.Text("formula")!;
        try
        {
            return new FormulaSurface(footprint!, text, FormulaParser.Parse(text), spec.MetresPerUnit);
        }
        catch (FormulaSyntaxError e)
        {
            // A long formula is quoted by its start; the column locates the problem.
            string quoted = text.Length <= 80 ? text : text[..77] + "...";
            throw new JobError("target.formula", $"{e.Message} in \"{quoted}\"");
        }
    }
}
