namespace Tessel.Core.Jobs;

/// <summary>A named sheet size a job can give as <c>fabrication.sheet.name</c>, portrait, in mm.</summary>
public sealed record SheetSizeEntry(string Name, double WidthMm, double HeightMm);

/// <summary>Everything a job file may name that later stages define: target kinds, families,
/// materials, sheet sizes and the default layer table. The loader validates against it.</summary>
/// <param name="FindSheet">Looks a sheet size up as the sheet stage does (case-insensitively).</param>
public sealed record JobVocabulary(
    IReadOnlyList<TargetKindInfo> TargetKinds,
    IReadOnlyList<FamilyInfo> Families,
    IReadOnlyList<CatalogEntry> Materials,
    IReadOnlyList<SheetSizeEntry> SheetSizes,
    Func<string, SheetSizeEntry?> FindSheet,
    IReadOnlyDictionary<string, LayerStyle> DefaultLayers)
{
    private static JobVocabulary? _registered;

    /// <summary>The vocabulary this build registered (Tessel.Core's <c>Composition</c> does it when
    /// the assembly loads). Jobs cannot name the stages that own these tables, so they are handed in.</summary>
    public static JobVocabulary Registered =>
        _registered ?? throw new InvalidOperationException("no job vocabulary registered; Tessel.Core's Composition registers it when the assembly loads");

    /// <summary>Installs the vocabulary the loader, catalog and scaffold read.</summary>
    public static void Register(JobVocabulary vocabulary) => _registered = vocabulary;

    /// <summary>The target kind named <paramref name="name"/>, or null.</summary>
    public TargetKindInfo? Kind(string name) => TargetKinds.FirstOrDefault(k => k.Name == name);

    /// <summary>The family named <paramref name="name"/>, or null.</summary>
    public FamilyInfo? Family(string name) => Families.FirstOrDefault(f => f.Name == name);
}
