using Tessel.Core.Jobs;

namespace Tessel.Core.Targets;

/// <summary>Files and readers a target may need beyond its parameters.</summary>
/// <param name="BaseDirectory">Folder that relative image and mesh paths resolve against.</param>
/// <param name="DecodeImage">Image reader for height maps; null when the front end has none.</param>
public sealed record TargetInputs(string BaseDirectory, GrayImageDecoder? DecodeImage)
{
    /// <summary>An input path as given in the job, made absolute against <see cref="BaseDirectory"/>.</summary>
    public string Resolve(string path) =>
        Path.IsPathRooted(path) ? path : Path.GetFullPath(Path.Combine(BaseDirectory, path));
}

/// <summary>The descriptor of one target kind: what the job loader, catalog and scaffold read
/// (<see cref="TargetKindInfo"/>) and the surface it builds. Each kind is one class in
/// <c>Targets/Kinds/</c>, registered by one line in <see cref="TargetKinds.All"/>.</summary>
public abstract class TargetKind : TargetKindInfo
{
    /// <summary>Builds the surface in metres from validated parameters.</summary>
    /// <param name="footprint">The job's footprint in metres; null only where <see cref="TargetKindInfo.FootprintOptional"/>.</param>
    /// <exception cref="JobError">An input file or formula that cannot be read.</exception>
    public abstract ITargetSurface Build(TargetSpec spec, Footprint? footprint, TargetInputs inputs);

    /// <summary>Field named when the surface is undefined somewhere over the footprint.</summary>
    public virtual string UndefinedField => "target.footprint";

    /// <summary>What to change when the surface is undefined somewhere over the footprint.</summary>
    public virtual string UndefinedFix => "change the parameters";

    /// <summary>Input file the kind reads (named in messages about its content), or null.</summary>
    public virtual string? InputFile(ParameterBag p) => null;
}
