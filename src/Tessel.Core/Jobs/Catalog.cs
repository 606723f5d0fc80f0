using Tessel.Core.Model;

namespace Tessel.Core.Jobs;

/// <summary>A named choice a job can make, with one line saying what it is and what it suits.</summary>
public sealed record CatalogEntry(string Name, string Summary);

/// <summary>The names a job file accepts for target kinds, families, materials and fold methods.</summary>
public static class Catalog
{
    /// <summary>Target kinds (target.kind).</summary>
    public static readonly IReadOnlyList<CatalogEntry> TargetKinds =
    [
        new("plane", "flat horizontal plane at height rise; a test bed and for flat folded screens"),
        new("cylinder", "barrel vault of radius R, axis along x, crown at rise; single curvature (K = 0)"),
        new("spherical-cap", "dome: part of a sphere of radius R, apex at rise; synclastic (K > 0)"),
        new("hyperbolic-paraboloid", "saddle canopy z = rise + x*y/c; anticlastic (K < 0)"),
        new("elliptic-paraboloid", "dome with different apex radii radiusX and radiusY"),
        new("sinusoidal-wave", "corrugated roof: amplitude, wavelength and phase along x"),
        new("formula", "any z = f(x, y) you type, with exact derivatives; e.g. 0.1*(x^2 - y^2)"),
        new("height-map", "grayscale PNG over width x depth, black = minHeight, white = maxHeight"),
        new("mesh", "OBJ or STL surface, seen from above; curvature is an estimate"),
    ];

    /// <summary>Tessellation families (tessellation.family). The egg-box is never offered: it cannot
    /// be folded from a flat sheet.</summary>
    public static readonly IReadOnlyList<CatalogEntry> Families =
        new[] { "miura", "reverse-curvature", "yoshimura", "waterbomb", "free-triangulated" }
            .Select(f => new CatalogEntry(f, Tessellation.FamilyAdvice.Describe(f)[(f.Length + 2)..]))
            .ToArray();

    /// <summary>Material presets of the sheet stage (fabrication.material); their figures are starting values to test.</summary>
    public static IReadOnlyList<CatalogEntry> Materials { get; } = Sheets.Materials.All
        .Select(m => new CatalogEntry(m.Name, FormattableString.Invariant(
            $"{m.Description}, t = {m.ThicknessMm} mm; folds: mountain {JobValue(m.MountainMethod)}, valley {JobValue(m.ValleyMethod)}; perforation {m.PerforationCutMm}/{m.PerforationBridgeMm} mm")))
        .ToArray();

    /// <summary>The job-file value (fabrication.foldMethod) that selects <paramref name="method"/>.</summary>
    public static string JobValue(Sheets.FoldMethod method) => method switch
    {
        Sheets.FoldMethod.Score => "score",
        Sheets.FoldMethod.ScoreFromBack => "two-sided",
        _ => "perforate",
    };

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
