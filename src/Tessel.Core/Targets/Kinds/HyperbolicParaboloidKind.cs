using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A saddle canopy z = rise + x y / c: anticlastic.</summary>
public sealed class HyperbolicParaboloidKind : TargetKind
{
    public override string Name => "hyperbolic-paraboloid";
    public override string Summary => "saddle canopy z = rise + x*y/c; anticlastic (K < 0)";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("c", ParameterType.Number, Description: "hyperbolic-paraboloid: z = rise + x*y/c; non-zero. Length in target.units."),
        new("rise", ParameterType.Number, 0),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        var c = p.Number("c");
        if (c is null) throw check.Error("c", $"missing; z = rise + x*y/c needs c, a non-zero {check.Length}");
        if (c == 0) throw check.Error("c", $"must be a non-zero {check.Length} (got 0)");
    }

    public override string ScaffoldLines => """
            // Saddle z = rise + x*y/c: a smaller c twists more.
            "c": 30,
            "rise": 3,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        double s = spec.MetresPerUnit;
        return new HyperbolicParaboloidSurface(footprint!, s * spec.Parameters.Required("c"), s * spec.Parameters.Required("rise"));
    }
}
