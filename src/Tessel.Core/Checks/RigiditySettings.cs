namespace Tessel.Core.Checks;

/// <summary>How the rank of the bar-and-hinge Jacobian is found.</summary>
public enum RankMethod
{
    /// <summary>Dense SVD up to <see cref="RigiditySettings.DenseColumnLimit"/> unknowns, shift-invert beyond.</summary>
    Auto,
    /// <summary>MathNet dense SVD of J: exact to working precision, O(n^3): small meshes and test oracles.</summary>
    DenseSvd,
    /// <summary>Smallest eigenvalues of J^T J by shift-invert subspace iteration on a sparse envelope Cholesky
    /// factor after reverse Cuthill-McKee: singular values below about 1e-8 of the largest are not resolved
    /// (they are square roots of eigenvalues of J^T J).</summary>
    ShiftInvert,
}

/// <summary>Settings of <see cref="RigidityAnalysis.DegreesOfFreedom"/>.</summary>
/// <param name="RankTolerance">A singular value counts as zero when below this fraction of the largest one.</param>
/// <param name="Method">Rank method.</param>
/// <param name="DenseColumnLimit">Largest 3N for which <see cref="RankMethod.Auto"/> uses dense SVD.</param>
public sealed record RigiditySettings(double RankTolerance = 1e-6, RankMethod Method = RankMethod.Auto,
    int DenseColumnLimit = 600);
