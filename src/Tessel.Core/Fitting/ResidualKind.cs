namespace Tessel.Core.Fitting;

/// <summary>Kinds of rows in the fitting problem: objective terms first, then constraints.</summary>
public enum ResidualKind
{
    /// <summary>Objective: signed distance of a top vertex to the target (Gauss-Newton point-to-tangent-plane form).</summary>
    TopDistance,
    /// <summary>Objective: signed distance of a bottom vertex to the offset surface S - d n.</summary>
    BottomDistance,
    /// <summary>Objective (regularisation): one component of the tangential second difference of a stencil.</summary>
    Fairness,
    /// <summary>Equality: scaled triple product of a quad facet.</summary>
    Planarity,
    /// <summary>Equality: Kawasaki's alternating sector-angle sum at an interior vertex.</summary>
    Kawasaki,
    /// <summary>|sum of sector angles - 2 pi| &lt;= epsilon at an interior vertex.</summary>
    Developability,
    /// <summary>Bound: a facet corner (sector) angle within [min, max].</summary>
    SectorAngleBound,
    /// <summary>Bound: an edge no shorter than its minimum (scaled by the mean edge length).</summary>
    EdgeLengthBound,
    /// <summary>Bound: a crease's signed fold angle keeps its role's sign, away from flat and from closed.</summary>
    FoldAngleBound,
    /// <summary>Bound: two opposite corners of a quad facet turn the same way (no reflex corner, no crossed facet).</summary>
    FacetCornerOrder,
}
