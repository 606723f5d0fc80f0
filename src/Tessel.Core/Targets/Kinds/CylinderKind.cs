using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A barrel vault: single curvature, the axis along x.</summary>
public sealed class CylinderKind : TargetKind
{
    public override string Name => "cylinder";
    public override string Summary => "barrel vault of radius R, axis along x, crown at rise; single curvature (K = 0)";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("radius", ParameterType.Number, Description: "cylinder, spherical-cap: radius R (positive). Length in target.units.", Positive: true),
        new("rise", ParameterType.Number),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        check.Positive("radius", p.Number("radius"));
        check.NonNegative("rise", p.Number("rise"));
    }

    public override string ScaffoldLines => """
            // Barrel vault: radius of the circle and height of the crown; the axis runs along x.
            "radius": 12,
            "rise": 3,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        double s = spec.MetresPerUnit;
        return new CylinderSurface(footprint!, s * spec.Parameters.Required("radius"), s * spec.Parameters.Required("rise"));
    }
}
