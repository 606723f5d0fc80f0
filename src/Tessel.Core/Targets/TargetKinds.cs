using Tessel.Core.Targets.Kinds;

namespace Tessel.Core.Targets;

/// <summary>The table of target kinds: one registration line per kind. Catalog, job loader,
/// scaffold and <see cref="TargetFactory"/> read it, in this order.</summary>
public static class TargetKinds
{
    public static readonly IReadOnlyList<TargetKind> All =
    [
        new PlaneKind(),
        new CylinderKind(),
        new SphericalCapKind(),
        new HyperbolicParaboloidKind(),
        new EllipticParaboloidKind(),
        new SinusoidalWaveKind(),
        new FormulaKind(),
        new HeightMapKind(),
        new MeshKind(),
    ];

    /// <summary>The kind named <paramref name="name"/>, or null.</summary>
    public static TargetKind? Find(string name) => All.FirstOrDefault(k => k.Name == name);
}
