using System.Runtime.CompilerServices;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Composition;

/// <summary>Hands the job loader the tables it validates against: target kinds and families from
/// their stages' registries, materials, sheet sizes and the default layer table from the sheet stage.
/// The only place that knows both Jobs and the stages after it.</summary>
public static class JobVocabularyRegistration
{
    /// <summary>Runs when Tessel.Core loads, before any of its code, so every front end and test sees the
    /// same tables without a set-up call to forget.</summary>
#pragma warning disable CA2255 // the library registers its own tables with its own loader; no caller order to get wrong
    [ModuleInitializer]
    internal static void Register() => JobVocabulary.Register(Build());
#pragma warning restore CA2255

    /// <summary>The vocabulary of this build.</summary>
    public static JobVocabulary Build() => new(
        TargetKinds.All,
        TessellationFamilies.All,
        Materials.All.Select(m => new CatalogEntry(m.Name, FormattableString.Invariant(
            $"{m.Description}, t = {m.ThicknessMm} mm; folds: mountain {JobValue(m.MountainMethod)}, valley {JobValue(m.ValleyMethod)}; perforation {m.PerforationCutMm}/{m.PerforationBridgeMm} mm")))
            .ToArray(),
        SheetSizes.All.Select(Entry).ToArray(),
        name => SheetSizes.TryFind(name, out var size) ? Entry(size) : null,
        Enum.GetValues<LineClass>().ToDictionary(c => char.ToLowerInvariant(c.ToString()[0]) + c.ToString()[1..], c =>
        {
            var style = LineStyleTable.Default[c];
            return new LayerStyle(style.ColourHex.ToLowerInvariant(), style.DxfColourIndex, OperationName(style.Operation));
        }));

    private static SheetSizeEntry Entry(SheetSize s) => new(s.Name, s.Portrait.WidthMm, s.Portrait.HeightMm);

    /// <summary>The job-file value (fabrication.foldMethod) that selects <paramref name="method"/>.</summary>
    public static string JobValue(FoldMethod method) => method switch
    {
        FoldMethod.Score => "score",
        FoldMethod.ScoreFromBack => "two-sided",
        _ => "perforate",
    };

    /// <summary>Job-file name of a cutter operation (one of <see cref="JobLoader.Operations"/>).</summary>
    public static string OperationName(LineOperation operation) => operation switch
    {
        LineOperation.Cut => "cut",
        LineOperation.Score => "score",
        LineOperation.Mark => "mark",
        _ => "draw-only",
    };
}
