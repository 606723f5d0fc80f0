using Tessel.Core.Jobs;

namespace Tessel.Core.Targets.Kinds;

/// <summary>A dome cut from a sphere: synclastic.</summary>
public sealed class SphericalCapKind : TargetKind
{
    public override string Name => "spherical-cap";
    public override string Summary => "dome: part of a sphere of radius R, apex at rise; synclastic (K > 0)";
    public override IReadOnlyList<ParameterSpec> Parameters { get; } =
    [
        new("radius", ParameterType.Number, Positive: true),
        new("rise", ParameterType.Number),
    ];

    public override void Validate(ParameterBag p, ParameterCheck check)
    {
        check.Positive("radius", p.Number("radius"));
        check.NonNegative("rise", p.Number("rise"));
    }

    public override string ScaffoldLines => """
            // Dome: sphere radius and apex height. The footprint must fit inside the base circle.
            "radius": 30,
            "rise": 2.5,
        """;

    public override ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs)
    {
        double s = spec.MetresPerUnit;
        return new SphericalCapSurface(footprint!, s * spec.Parameters.Required("radius"), s * spec.Parameters.Required("rise"));
    }
}
