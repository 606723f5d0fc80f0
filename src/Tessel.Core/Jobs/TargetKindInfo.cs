namespace Tessel.Core.Jobs;

/// <summary>What the job loader, catalog and scaffold know of a target kind: its name, summary,
/// parameters and their checks. The target stage's descriptor (<c>TargetKind</c>) adds the
/// surface it builds; Jobs sees only this part, so that it depends on no later stage.</summary>
public abstract class TargetKindInfo
{
    /// <summary>The job-file value of <c>target.kind</c>.</summary>
    public abstract string Name { get; }

    /// <summary>One line for 'tessel catalog targets': the shape and what it suits.</summary>
    public abstract string Summary { get; }

    /// <summary>The kind's own fields of the <c>target</c> section (kind, units and footprint apply to
    /// every kind), in the order messages list them.</summary>
    public abstract IReadOnlyList<ParameterSpec> Parameters { get; }

    /// <summary>True when the kind covers its own plan region (an image, a mesh), so that the footprint
    /// may be left out.</summary>
    public virtual bool FootprintOptional => false;

    /// <summary>Plan extent (x, y) in the target's units when the job gives no footprint, for the
    /// memory check before the target exists; null when only the built target knows it.</summary>
    public virtual (double X, double Y)? ExtentWithoutFootprint(ParameterBag p) => null;

    /// <summary>Checks the parameters after the footprint; throws <see cref="JobError"/> naming the field.</summary>
    public abstract void Validate(ParameterBag p, ParameterCheck check);

    /// <summary>The kind's lines of the scaffold's <c>target</c> section: commented example values
    /// that are valid as written, indented by four spaces, without a final line break.</summary>
    public abstract string ScaffoldLines { get; }
}
