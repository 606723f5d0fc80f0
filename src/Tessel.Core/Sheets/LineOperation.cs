namespace Tessel.Core.Sheets;

/// <summary>What the cutter (or the person with the knife) does with a line. Shops signal this by
/// layer or colour in their own way, so it is part of the user-editable <see cref="LineStyleTable"/>.</summary>
public enum LineOperation
{
    /// <summary>Cut through the material.</summary>
    Cut,
    /// <summary>Half-depth score (low-power vector pass, or a scoring tool by hand); the scored side
    /// ends up on the outside of the fold.</summary>
    Score,
    /// <summary>A light surface mark: engraved or drawn text and tick marks on the part.</summary>
    Mark,
    /// <summary>Printed or displayed only; never sent to the cutter (legend, scale bar, cautions).</summary>
    DrawOnly,
}
