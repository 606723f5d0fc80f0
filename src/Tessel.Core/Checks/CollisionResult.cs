namespace Tessel.Core.Checks;

/// <summary>Panel collisions of one state.</summary>
/// <param name="Pairs">Colliding face pairs, sorted by (FaceA, FaceB).</param>
/// <param name="TrianglePairsTested">Narrow-phase tests after the box tree (a cost figure).</param>
/// <param name="Elapsed">Wall time.</param>
public sealed record CollisionResult(IReadOnlyList<PanelCollision> Pairs, int TrianglePairsTested, TimeSpan Elapsed)
{
    public int Count => Pairs.Count;
}

/// <summary>Panel collisions at a keyframe of a folding path.</summary>
public sealed record PathCollisionFrame(double Progress, CollisionResult Collisions);
