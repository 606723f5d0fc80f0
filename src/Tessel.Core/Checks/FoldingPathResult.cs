namespace Tessel.Core.Checks;

/// <summary>A state kept along the rigid folding path.</summary>
/// <param name="Progress">Fold-angle scale relative to the given state (0 flat, 1 given).</param>
/// <param name="MaxFoldAngleDegrees">Largest |fold angle| of the state.</param>
/// <param name="Positions">#V*3 vertex positions in metres, in the frame of the reference panel (which does not move).</param>
/// <param name="MaxBarStrain">Largest |length - rest| / rest over edges and panel diagonals at this state.</param>
public sealed record FoldingKeyframe(double Progress, double MaxFoldAngleDegrees, double[] Positions, double MaxBarStrain);

/// <summary>Outcome of a rigid folding simulation.</summary>
/// <param name="DegreesOfFreedom">Null-space dimension of the constraint Jacobian with the reference panel fixed, at the given state.</param>
/// <param name="ReachedNearFlat">True when the path got below the near-flat fold angle without breaking constraints.</param>
/// <param name="LowestProgress">Smallest progress reached (toward flat).</param>
/// <param name="HighestProgress">Largest progress reached (toward folded).</param>
/// <param name="MaxBarStrain">Path drift: largest relative bar-length error (panel strain) over all accepted states.</param>
/// <param name="MaxPlanarityResidual">Largest scaled triple product over all accepted states.</param>
/// <param name="Steps">Accepted continuation steps.</param>
/// <param name="NewtonIterations">Corrector iterations in total (each one sparse factorisation).</param>
/// <param name="StopTowardFlat">Why the flat-ward run ended.</param>
/// <param name="StopTowardFolded">Why the fold-ward run ended.</param>
/// <param name="Keyframes">Kept states in ascending progress.</param>
/// <param name="Elapsed">Wall time.</param>
public sealed record FoldingPathResult(int DegreesOfFreedom, bool ReachedNearFlat, double LowestProgress,
    double HighestProgress, double MaxBarStrain, double MaxPlanarityResidual, int Steps, int NewtonIterations,
    string StopTowardFlat, string StopTowardFolded, IReadOnlyList<FoldingKeyframe> Keyframes, TimeSpan Elapsed);
