namespace Tessel.Core.Targets.Formulas;

/// <summary>A formula that does not parse: the 1-based column where parsing stopped and what was
/// expected there.</summary>
public sealed class FormulaSyntaxError(int column, string expected, string found)
    : Exception($"column {column}: expected {expected}, found {found}")
{
    /// <summary>1-based character column in the formula text.</summary>
    public int Column { get; } = column;

    /// <summary>What the parser wanted at <see cref="Column"/> ("a number, x, y, a function or '('").</summary>
    public string Expected { get; } = expected;

    /// <summary>What it found there, quoted, or "the end of the formula".</summary>
    public string Found { get; } = found;
}
