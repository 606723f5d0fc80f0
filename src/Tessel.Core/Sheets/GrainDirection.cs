namespace Tessel.Core.Sheets;

/// <summary>Direction of the paper or card grain on the sheet: long crease families fold more cleanly
/// along it (common practice, docs/reference/fabrication.md [CP]).</summary>
public enum GrainDirection
{
    /// <summary>No preference: parts turn freely to pack best.</summary>
    Any,
    /// <summary>Grain along the sheet's width (x).</summary>
    AlongWidth,
    /// <summary>Grain along the sheet's height (y).</summary>
    AlongHeight,
}
