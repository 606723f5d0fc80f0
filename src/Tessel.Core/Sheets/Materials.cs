namespace Tessel.Core.Sheets;

/// <summary>Material presets. Names are ours; values are starting values from docs/reference/fabrication.md tagged
/// [M] (from memory): test them on offcuts before a real job.</summary>
public static class Materials
{
    // Mountain folds scored on the front: the scored side ends up convex, and a mountain's convex side is
    // the top side. Valleys are convex on the back, so card scores them from the back ([CP], docs/reference/fabrication.md).

    /// <summary>220 gsm card, t ~ 0.28 mm (gsm/1000 x 1.1-1.5 [M]); perforation 3 / 0.7 mm [M].</summary>
    public static readonly Material LightCard = new(
        "card-light", "220 gsm card", 0.28, FoldMethod.Score, FoldMethod.ScoreFromBack,
        3.0, 0.7, 10 * 0.28, 0.0008, 25, 80, 300);

    /// <summary>300 gsm card, t ~ 0.40 mm; perforation 3 / 0.8 mm [M].</summary>
    public static readonly Material Card = new(
        "card", "300 gsm card", 0.40, FoldMethod.Score, FoldMethod.ScoreFromBack,
        3.0, 0.8, 10 * 0.40, 0.0008, 20, 70, 300);

    /// <summary>350 gsm card, t ~ 0.45 mm; perforation 4 / 1.0 mm [M].</summary>
    public static readonly Material HeavyCard = new(
        "card-heavy", "350 gsm card", 0.45, FoldMethod.Score, FoldMethod.ScoreFromBack,
        4.0, 1.0, 10 * 0.45, 0.0008, 15, 60, 300);

    /// <summary>0.5 mm polypropylene, perforated both ways: cut 2 / bridge 1.5 mm [M]
    /// (see Nagasawa &amp; Hosokawa, AIMS Materials Science 9(6), 2022 for a study).</summary>
    public static readonly Material Polypropylene = new(
        "pp-sheet", "0.5 mm polypropylene", 0.5, FoldMethod.Perforate, FoldMethod.Perforate,
        2.0, 1.5, 10 * 0.5, 0.0008, 15, 50, 300);

    /// <summary>80 gsm plain paper, t ~ 0.1 mm: too thin to score reliably, so perforated [M].</summary>
    public static readonly Material PlainPaper = new(
        "paper", "80 gsm plain paper", 0.10, FoldMethod.Perforate, FoldMethod.Perforate,
        2.0, 0.5, 10 * 0.10, 0.0008, 40, 120, 300);

    /// <summary>Every preset, in a fixed order.</summary>
    public static readonly Material[] All = [LightCard, Card, HeavyCard, Polypropylene, PlainPaper];

    /// <summary>Finds a preset by name, ignoring case.</summary>
    public static bool TryFind(string name, out Material material)
    {
        foreach (var m in All)
            if (string.Equals(m.Name, name.Trim(), StringComparison.OrdinalIgnoreCase)) { material = m; return true; }
        material = Card;
        return false;
    }
}
