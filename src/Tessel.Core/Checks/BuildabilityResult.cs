namespace Tessel.Core.Checks;

/// <summary>All detailed check results plus the summary.</summary>
public sealed record BuildabilityResult(BuildabilityReport Summary, RigidityResult Rigidity, FoldingPathResult? Path,
    CollisionResult Collisions, IReadOnlyList<PathCollisionFrame> PathCollisions, FlatStrainResult? Strain);
