namespace Tessel.Output.Report;

/// <summary>One state along the rigid folding path, for the report's folding viewer.</summary>
/// <param name="Progress">Where on the path this state lies: 0 = flat sheet, 1 = the fitted folded model.</param>
/// <param name="Positions">#V*3 vertex positions in metres at full scale, same vertex indices as the folded model.</param>
public sealed record FoldKeyframe(double Progress, double[] Positions);
