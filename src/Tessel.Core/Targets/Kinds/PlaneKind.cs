using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A flat horizontal plane: the test bed, and flat folded screens.</summary>
public sealed class PlaneKind : TargetKind
{
    public override string Name => "plane";
    public override string Summary => "flat horizontal plane at height rise; a test bed and for flat folded screens";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("rise", ParameterType.Number, 0, Description: "Height of the crown or apex (cylinder, spherical-cap: required, >= 0); height offset for plane, hyperbolic-paraboloid, elliptic-paraboloid, sinusoidal-wave (default 0). Length in target.units."),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check) { }

    public override string ScaffoldLines => """
            // Height of the plane.
            "rise": 0,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs) =>
        new PlaneSurface(footprint!, spec.MetresPerUnit * spec.Parameters.Required("rise"));
}
