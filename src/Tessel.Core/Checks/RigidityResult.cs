namespace Tessel.Core.Checks;

/// <summary>Infinitesimal mobility of a folded crease pattern with rigid panels.</summary>
/// <param name="DegreesOfFreedom">3N - rank(J) - 6: internal folding motions (1 for a rigid-foldable Miura,
/// 0 for a locked pattern); can be negative only for a degenerate mesh with fewer than 3 vertices.</param>
/// <param name="Unknowns">3N.</param>
/// <param name="ConstraintRows">Rows of J: bars (edges and panel diagonals) plus planarity rows.</param>
/// <param name="Rank">Numerical rank of J at <paramref name="RankTolerance"/>.</param>
/// <param name="RankTolerance">Relative threshold: singular values below RankTolerance * LargestSingularValue are zero.</param>
/// <param name="LargestSingularValue">Of J in units of the mean edge length (dimensionless).</param>
/// <param name="SmallestKeptSingularValue">Last singular value above the threshold, relative to the largest.</param>
/// <param name="LargestDroppedSingularValue">First singular value below the threshold, relative to the largest
/// (0 when all dropped values are implicit zeros of a J with fewer rows than columns).</param>
/// <param name="GapRatio">SmallestKept / LargestDropped: how clearly the rank is revealed (large is clear).</param>
/// <param name="Method">"dense-svd" or "shift-invert-subspace".</param>
/// <param name="Elapsed">Wall time of the computation.</param>
public sealed record RigidityResult(int DegreesOfFreedom, int Unknowns, int ConstraintRows, int Rank,
    double RankTolerance, double LargestSingularValue, double SmallestKeptSingularValue,
    double LargestDroppedSingularValue, double GapRatio, string Method, TimeSpan Elapsed);
