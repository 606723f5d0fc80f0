namespace Tessel.Core.LinearAlgebra;

/// <summary>Direct solver: nested dissection ordering and multifrontal supernodal Cholesky
/// (<see cref="SupernodalCholesky"/>); caching and refinement as in <see cref="CachedFactorSolver{TFactor}"/>.</summary>
public sealed class SupernodalCholeskySolver : CachedFactorSolver<SupernodalCholesky>
{
    /// <summary>Name reported in <see cref="SolveStats.Method"/>.</summary>
    public const string MethodName = "supernodal-cholesky-nd";

    protected override string Method => MethodName;

    protected override SupernodalCholesky Analyze(CsrMatrix a) => SupernodalCholesky.Analyze(a);
}
