namespace Tessel.Core.Sheets;

/// <summary>How the laser (or the printer and the hand) makes a fold line.</summary>
public enum FoldMethod
{
    /// <summary>Half-depth score on the front (top side) job; the scored side ends up convex.</summary>
    Score,
    /// <summary>Half-depth score from the back: drawn in the mirrored back job (x' = W - x).</summary>
    ScoreFromBack,
    /// <summary>Through-cut dashes with uncut bridges; folds either way.</summary>
    Perforate,
}
