namespace Tessel.Core.Checks;

/// <summary>Every buildability figure in one flat record, for the summary JSON. Strains are dimensionless
/// (0.0008 = 0.08 %); singular values are relative to the largest; times in seconds.</summary>
/// <param name="DegreesOfFreedom">3N - rank(J) - 6 at the given folded state (1 = folds with one motion, 0 = locked).</param>
/// <param name="RankTolerance">Relative singular-value threshold used for the rank.</param>
/// <param name="SmallestKeptSingularValue">Last singular value counted in the rank (relative).</param>
/// <param name="LargestDroppedSingularValue">First singular value counted as zero (relative).</param>
/// <param name="RankGapRatio">Kept / dropped: above about 1e3 the rank is clear.</param>
/// <param name="RankMethod">"dense-svd" or "shift-invert-subspace".</param>
/// <param name="PathSimulated">False when the folding path was skipped or could not start (flat input).</param>
/// <param name="PathMaxBarStrain">Largest relative bar-length error along the path (panel strain a rigid fold needs).</param>
/// <param name="PathReachedNearFlat">The rigid path reached every |fold angle| below the near-flat angle.</param>
/// <param name="PathLowestProgress">Smallest fold progress reached (0 flat, 1 given state).</param>
/// <param name="PathHighestProgress">Largest fold progress reached.</param>
/// <param name="PathStopTowardFlat">Why the flat-ward run ended.</param>
/// <param name="PathStopTowardFolded">Why the fold-ward run ended.</param>
/// <param name="CollisionCount">Colliding panel pairs at the given state.</param>
/// <param name="CollisionPairs">Those pairs.</param>
/// <param name="PathKeyframesWithCollisions">Progress values of path keyframes with at least one collision.</param>
/// <param name="LayoutChecked">False when no flat pattern was given.</param>
/// <param name="MaxLayoutStrain">Largest facet strain between flat layout and folded mesh.</param>
/// <param name="StrainLimit">Material strain limit.</param>
/// <param name="FacetsOverStrainLimit">Facets above the limit.</param>
/// <param name="MaxVertexAngleStrain">Largest |angle defect| / (2 pi) over interior vertices.</param>
/// <param name="DofSeconds">Time of the DOF count.</param>
/// <param name="PathSeconds">Time of the folding simulation.</param>
/// <param name="CollisionSeconds">Time of the collision checks (state and keyframes).</param>
/// <param name="StrainSeconds">Time of the strain check.</param>
public sealed record BuildabilityReport(
    int DegreesOfFreedom, double RankTolerance, double SmallestKeptSingularValue, double LargestDroppedSingularValue,
    double RankGapRatio, string RankMethod,
    bool PathSimulated, double PathMaxBarStrain, bool PathReachedNearFlat, double PathLowestProgress,
    double PathHighestProgress, string PathStopTowardFlat, string PathStopTowardFolded,
    int CollisionCount, IReadOnlyList<PanelCollision> CollisionPairs, double[] PathKeyframesWithCollisions,
    bool LayoutChecked, double MaxLayoutStrain, double StrainLimit, int[] FacetsOverStrainLimit, double MaxVertexAngleStrain,
    double DofSeconds, double PathSeconds, double CollisionSeconds, double StrainSeconds);
