namespace Tessel.Core.Checks;

/// <summary>How two panels collide.</summary>
public enum CollisionKind
{
    /// <summary>Panels with no common vertex intersect (Moller 1997 triangle test).</summary>
    Crossing,
    /// <summary>Panels sharing a vertex or a crease overlap beyond it: folded through each other, or folded flat
    /// (180 degrees) onto each other.</summary>
    OverlapAtSharedCorner,
}

/// <summary>A pair of colliding panels (face indices, FaceA &lt; FaceB).</summary>
public sealed record PanelCollision(int FaceA, int FaceB, CollisionKind Kind);
