namespace Tessel.Core.Jobs;

/// <summary>The job's <c>target</c> section: which surface to model and its parameters, all lengths in
/// <see cref="Units"/> (converted to metres when the target is built).</summary>
/// <param name="Kind">One of <see cref="Catalog.TargetKinds"/>.</param>
/// <param name="Parameters">The kind's own fields, validated by its descriptor; absent ones hold the kind's defaults.</param>
public sealed record TargetSpec(string Kind, string Units, ParameterBag Parameters, FootprintSpec? Footprint)
{
    /// <summary>Metres per job length unit.</summary>
    public double MetresPerUnit => Geometry.Units.TryMetresPer(Units, out double m) ? m : double.NaN;
}

/// <summary>The plan region to cover: a <see cref="Width"/> x <see cref="Depth"/> rectangle centred on the
/// origin, or a polygon given by its <see cref="Corners"/> (x, y pairs). Lengths in the target's units.</summary>
public sealed record FootprintSpec(double? Width, double? Depth, double[][]? Corners);
