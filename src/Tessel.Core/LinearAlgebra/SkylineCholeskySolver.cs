namespace Tessel.Core.LinearAlgebra;

/// <summary>Direct solver: reverse Cuthill-McKee ordering and skyline Cholesky (<see cref="SkylineCholesky"/>);
/// caching and refinement as in <see cref="CachedFactorSolver{TFactor}"/>.</summary>
public sealed class SkylineCholeskySolver : CachedFactorSolver<SkylineCholesky>
{
    /// <summary>Name reported in <see cref="SolveStats.Method"/>.</summary>
    public const string MethodName = "skyline-cholesky-rcm";

    protected override string Method => MethodName;

    protected override SkylineCholesky Analyze(CsrMatrix a) => SkylineCholesky.Analyze(a);
}
