using Tessel.Core.Model;

namespace Tessel.Core.Jobs;

/// <summary>A named choice a job can make, with one line saying what it is and what it suits.</summary>
public sealed record CatalogEntry(string Name, string Summary);

/// <summary>The names a job file accepts for target kinds, families, materials and fold methods.</summary>
public static class Catalog
{
    /// <summary>Target kinds (target.kind), in the order of the target stage's table.</summary>
    public static IReadOnlyList<CatalogEntry> TargetKinds =>
        JobVocabulary.Registered.TargetKinds.Select(k => new CatalogEntry(k.Name, k.Summary)).ToArray();

    /// <summary>Tessellation families (tessellation.family), in the order of the tessellation stage's
    /// table. The egg-box is never offered: it cannot be folded from a flat sheet.</summary>
    public static IReadOnlyList<CatalogEntry> Families =>
        JobVocabulary.Registered.Families.Select(f => new CatalogEntry(f.Name, f.Summary)).ToArray();

    /// <summary>Material presets of the sheet stage (fabrication.material); their figures are starting values to test.</summary>
    public static IReadOnlyList<CatalogEntry> Materials => JobVocabulary.Registered.Materials;

    /// <summary>Ways to make a fold line (fabrication.foldMethod.mountain / .valley).</summary>
    public static readonly IReadOnlyList<CatalogEntry> FoldMethods =
    [
        new("material", "the material preset's own choice (card: mountains scored on the front, valleys on the back)"),
        new("score", "half-depth score from the front"),
        new("perforate", "through-cut dashes with uncut bridges; folds either way"),
        new("two-sided", "half-depth score from the back, in a mirrored second job, so the scored side ends up outside"),
        new("hand-score", "no laser: drawn on the front sheet, printed (PDF, PNG) at 0.35 mm so it reads on paper; score by hand along a steel rule"),
    ];

    /// <summary>Which vertices fitting pins to the target (fitting.anchors).</summary>
    public static readonly IReadOnlyList<string> Anchors = ["none", "corners", "edge"];

    /// <summary>Sheet orientations (fabrication.orientation).</summary>
    public static readonly IReadOnlyList<string> Orientations = ["auto", "portrait", "landscape"];

    /// <summary>Line classes of the layer table, camelCase names of <see cref="Model.LineClass"/>.</summary>
    public static IReadOnlyList<string> LineClasses { get; } =
        Enum.GetNames<Model.LineClass>().Select(n => char.ToLowerInvariant(n[0]) + n[1..]).ToArray();
}
