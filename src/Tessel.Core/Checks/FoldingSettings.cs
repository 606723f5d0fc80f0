namespace Tessel.Core.Checks;

/// <summary>Settings of <see cref="RigidFoldingPath.Simulate"/>. Progress is the least-squares scale of the
/// current fold angles onto the given (fitted) ones: 0 = flat, 1 = the given state, above 1 = further folded.</summary>
/// <param name="StepProgress">Progress change per continuation step (halved on a failed corrector).</param>
/// <param name="KeyframeProgress">Progress values at which positions are kept (null: 0.25, 0.5, 0.75, 1, 1.25);
/// values below the near-flat stop or beyond the reached end are skipped. The near-flat end state is always kept.</param>
/// <param name="NearFlatFoldAngleDegrees">Stop toward flat once every |fold angle| is below this: the flat state is a
/// branch point where the path is not unique.</param>
/// <param name="MaxProgress">Furthest progress toward folded.</param>
/// <param name="MaxFoldAngleDegrees">Stop toward folded once some |fold angle| exceeds this.</param>
/// <param name="ConstraintTolerance">Corrector stops when every scaled residual (bar length error over the mean edge
/// length; scaled triple product) is below this.</param>
/// <param name="MaxCorrectorIterations">Newton steps per continuation step before the step is halved.</param>
/// <param name="RankTolerance">Relative singular-value threshold for the null space used by the predictor.</param>
public sealed record FoldingSettings(
    double StepProgress = 0.25,
    double[]? KeyframeProgress = null,
    double NearFlatFoldAngleDegrees = 1.0,
    double MaxProgress = 1.25,
    double MaxFoldAngleDegrees = 175.0,
    double ConstraintTolerance = 1e-12,
    int MaxCorrectorIterations = 12,
    double RankTolerance = 1e-6)
{
    /// <summary>Keyframe progress values in effect.</summary>
    public double[] EffectiveKeyframes => KeyframeProgress ?? [0.25, 0.5, 0.75, 1.0, 1.25];
}
