namespace Tessel.Core.Model;

/// <summary>What an edge of a crease pattern is. Mountain and valley are seen from the top side
/// (the side facing the target's normal).</summary>
public enum CreaseRole
{
    /// <summary>Outline of the sheet: cut, not folded.</summary>
    Boundary,
    /// <summary>Fold whose ridge points to the top side.</summary>
    Mountain,
    /// <summary>Fold whose ridge points away from the top side.</summary>
    Valley,
    /// <summary>An edge that stays flat (a panel diagonal or an unused crease): not drawn as a fold.</summary>
    Flat,
}

/// <summary>Which surface a vertex of the folded model is meant to lie on.</summary>
public enum VertexLayer
{
    /// <summary>No distance term for this vertex.</summary>
    Free,
    /// <summary>On the target surface.</summary>
    Top,
    /// <summary>On the offset surface at the fold depth below the target.</summary>
    Bottom,
}
