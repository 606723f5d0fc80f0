namespace Tessel.Core.Jobs;

/// <summary>One model to build, as read from a job file. Immutable; every section has defaults.</summary>
/// <param name="Name">Safe file name; outputs go to output/&lt;Name&gt;/.</param>
/// <param name="Description">Free text shown in summaries.</param>
/// <param name="Seed">Seed for every random choice (multi-start fitting), so runs repeat exactly.</param>
public sealed record Job(
    string Name,
    string? Description,
    int Seed,
    TargetSpec Target,
    TessellationSpec Tessellation,
    FittingSpec Fitting,
    FabricationSpec Fabrication,
    OutputsSpec Outputs)
{
    /// <summary>Folder the job file was read from; relative input paths (images, meshes) resolve
    /// against it. The current directory for a job that did not come from a file.</summary>
    public string BaseDirectory { get; init; } = Directory.GetCurrentDirectory();
}
