namespace Tessel.Core.Sheets;

/// <summary>Which point of a laid-out text line sits at the origin given to
/// <see cref="StrokeFont.Layout"/>: a vertical reference (top of capitals, middle of capitals,
/// baseline) combined with a horizontal one (left end, centre, right end).</summary>
public enum TextAnchor
{
    /// <summary>Left end of the baseline (the default).</summary>
    BaselineLeft,
    /// <summary>Centre of the baseline.</summary>
    BaselineCentre,
    /// <summary>Right end of the baseline.</summary>
    BaselineRight,
    /// <summary>Left end of the cap line (top of the capitals).</summary>
    TopLeft,
    /// <summary>Centre of the cap line.</summary>
    TopCentre,
    /// <summary>Right end of the cap line.</summary>
    TopRight,
    /// <summary>Left end, half way up the capitals.</summary>
    MiddleLeft,
    /// <summary>Centre of the capitals' box.</summary>
    MiddleCentre,
    /// <summary>Right end, half way up the capitals.</summary>
    MiddleRight,
}
