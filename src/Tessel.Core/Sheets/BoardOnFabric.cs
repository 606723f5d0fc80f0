using System.Globalization;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Board sheets and fabric sheets of a board-on-fabric model.</summary>
/// <param name="Boards">Per layout sheet (Side "boards"): one board panel per facet to cut from board, the
/// part outline drawn only.</param>
/// <param name="Fabric">Per layout sheet (Side "fabric"): each part's whole flat outline (with its glue tabs)
/// to cut from fabric, the board panels drawn only, as the glue-up guide.</param>
/// <param name="Panels">The panels behind <paramref name="Boards"/>, with the gap at every edge.</param>
/// <param name="Warnings">At most one line: facets too small for the boards.</param>
public sealed record BoardOnFabricSheets(Sheet[] Boards, Sheet[] Fabric, ThickPanelResult Panels, string[] Warnings);

/// <summary>Board-on-fabric models (deployable-structure study models): rigid boards glued onto one sheet of
/// fabric that is the hinge at every crease. The boards come from <see cref="ThickPanels"/>; the fabric is the
/// layout's part outlines, cut in one piece per part so that no crease is a seam.</summary>
public static class BoardOnFabric
{
    /// <summary>Side name of the fabric sheets: "sheet-01-fabric".</summary>
    public const string FabricSide = "fabric";

    /// <summary>Builds both kinds of sheet for a layout made from <paramref name="pattern"/>. Fold angles (and so
    /// the gaps) are those of the fitted model: the boards clear each other up to the fitted state.</summary>
    public static BoardOnFabricSheets Build(FlatPattern pattern, SheetLayoutResult layout, ThickPanelSettings settings)
    {
        var panels = ThickPanels.Build(pattern, layout, settings);
        var fabric = new List<Sheet>();
        foreach (var like in layout.Sheets.Where(s => s.Side == "front").OrderBy(s => s.Number))
        {
            var guide = layout.Parts.Where(p => p.Sheet == like.Number).OrderBy(p => p.Number)
                .SelectMany(p => p.Faces).Where(f => panels.Panels[f].Length > 0)
                .Select(f => new SheetLine(LineClass.Annotation, panels.Panels[f], true));
            // Fabric is neither scored nor folded on a line: creases go, tab folds stay as drawn guides.
            var kept = like.Lines
                .Where(l => l.Class is LineClass.CutOutline or LineClass.CutInner or LineClass.Label or LineClass.TabFold)
                .Select(l => l.Class == LineClass.TabFold ? l with { Class = LineClass.Annotation } : l);
            var lines = guide.Concat(kept).ToArray();
            var ordered = LineStyleTable.FabricationOrder.SelectMany(c => lines.Where(l => l.Class == c)).ToArray();
            fabric.Add(new Sheet(like.Number, like.WidthMm, like.HeightMm, ordered) { Side = FabricSide, Utilisation = like.Utilisation });
        }
        var vanished = Enumerable.Range(0, panels.Panels.Length).Where(f => panels.Panels[f].Length == 0).ToArray();
        string[] warnings = vanished.Length == 0 ? [] :
        [
            string.Create(CultureInfo.InvariantCulture,
                $"{vanished.Length} facet(s) too small for {settings.BoardThicknessMm:0.###} mm boards get no board (facets {string.Join(", ", vanished.Take(8))}{(vanished.Length > 8 ? ", ..." : "")}); use thinner board or a larger scale"),
        ];
        return new BoardOnFabricSheets(panels.Sheets, fabric.ToArray(), panels, warnings);
    }

    /// <summary>What the annotation strip of a board or fabric sheet tells the maker.</summary>
    public static string[] Notes(Sheet sheet, ThickPanelSettings settings, IReadOnlyList<string> fileTypes)
    {
        string types = fileTypes.Count == 0 ? "" : " (" + string.Join(" ", fileTypes) + ")";
        string side = settings.Hinge == HingeSide.Top ? "top side" : "underside";
        var boards = sheet with { Side = ThickPanels.BoardsSide };
        var fabric = sheet with { Side = FabricSide };
        string t = settings.BoardThicknessMm.ToString("0.###", CultureInfo.InvariantCulture);
        return sheet.Side == FabricSide
            ? [$"FABRIC: cut each part in one piece from the fabric; glue the boards of {SheetFiles.BaseName(boards)}{types} on the drawn outlines, fabric on the {side} of the boards."]
            : [$"BOARDS: cut every panel from {t} mm board; glue them onto the fabric of {SheetFiles.BaseName(fabric)}{types} on its drawn outlines, fabric on the {side}. The crease sheet shows the folds."];
    }
}
