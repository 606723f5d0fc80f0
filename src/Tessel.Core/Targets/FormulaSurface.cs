using Tessel.Core.Targets.Formulas;

namespace Tessel.Core.Targets;

/// <summary>A target z = f(x, y) typed by the user, with x, y and z in the job's length unit.
/// Derivatives are exact (forward-mode automatic differentiation), so curvatures are exact too.</summary>
public sealed class FormulaSurface : GraphSurface
{
    private readonly FormulaNode _formula;
    private readonly double _metresPerUnit;

    /// <param name="footprint">Plan region in metres.</param>
    /// <param name="text">The formula as typed.</param>
    /// <param name="formula">Its parsed tree.</param>
    /// <param name="metresPerUnit">Metres per unit of x, y and z in the formula.</param>
    public FormulaSurface(Footprint footprint, string text, FormulaNode formula, double metresPerUnit)
        : base(footprint)
    {
        Text = text;
        _formula = formula;
        _metresPerUnit = metresPerUnit;
    }

    /// <summary>The formula as typed.</summary>
    public string Text { get; }

    /// <summary>The parsed formula, in the job's length unit.</summary>
    public FormulaNode Tree => _formula;

    public override string Description => $"formula z = {Text}";

    /// <summary>With s metres per unit, z(x) = s f(x / s): first derivatives carry over unchanged,
    /// second derivatives are divided by s.</summary>
    public override HeightJet Jet(double x, double y)
    {
        double s = _metresPerUnit;
        var j = _formula.Evaluate(x / s, y / s);
        if (!double.IsFinite(j.V)) return new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        return new(s * j.V, j.X, j.Y, j.XX / s, j.XY / s, j.YY / s);
    }
}
