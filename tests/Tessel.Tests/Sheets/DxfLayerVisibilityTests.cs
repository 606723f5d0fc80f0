using System.Globalization;
using System.Text;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Tests.Sheets;

/// <summary>Reads a written DXF the way a cutter's importer does, without any of the writer's code:
/// group codes and values line by line, the LAYER table (group 2 name, 62 colour: a negative colour
/// means the layer is off, group 70 bit 1 frozen; Autodesk DXF Reference, R12 TABLES section), then
/// every entity of the ENTITIES section with its layer (group 8).</summary>
public class DxfLayerVisibilityTests
{
    private sealed record Layer(string Name, int Colour, int Flags)
    {
        public bool Plotted => Colour > 0 && (Flags & 1) == 0;
    }

    private static (Dictionary<string, Layer> Layers, List<(string Type, string Layer)> Entities) Read(string text)
    {
        var lines = text.Replace("\r\n", "\n").Split('\n');
        var pairs = new List<(int, string)>();
        for (int i = 0; i + 1 < lines.Length; i += 2) pairs.Add((int.Parse(lines[i].Trim(), CultureInfo.InvariantCulture), lines[i + 1].Trim()));
        var layers = new Dictionary<string, Layer>();
        var entities = new List<(string, string)>();
        string section = "";
        for (int i = 0; i < pairs.Count; i++)
        {
            var (code, value) = pairs[i];
            if (code != 0) continue;
            if (value == "SECTION") { section = pairs[i + 1].Item2; continue; }
            var groups = new List<(int Code, string Value)>();
            for (int j = i + 1; j < pairs.Count && pairs[j].Item1 != 0; j++) groups.Add(pairs[j]);
            string G(int c, string d) => groups.FirstOrDefault(g => g.Code == c).Value ?? d;
            if (section == "TABLES" && value == "LAYER" && groups.Any(g => g.Code == 2))
                layers[G(2, "")] = new Layer(G(2, ""), int.Parse(G(62, "7"), CultureInfo.InvariantCulture), int.Parse(G(70, "0"), CultureInfo.InvariantCulture));
            else if (section == "ENTITIES" && value is not ("ENDSEC" or "EOF"))
                entities.Add((value, G(8, "0")));
        }
        return (layers, entities);
    }

    private static string Write(Sheet sheet, LineStyleTable styles)
    {
        using var ms = new MemoryStream();
        new DxfSheetWriter().Write(sheet, styles, ms);
        return Encoding.ASCII.GetString(ms.ToArray());
    }

    [Fact]
    public void NotesLayerIsOffSoSendingTheWholeFileCutsOnlyCutterLines()
    {
        var sheet = WriterTestSheets.A4WithEveryClass();
        var (layers, entities) = Read(Write(sheet, LineStyleTable.Default));
        string notes = LineStyleTable.Default[LineClass.Annotation].LayerName;
        Assert.False(layers[notes].Plotted);
        Assert.Equal(-LineStyleTable.Default[LineClass.Annotation].DxfColourIndex, layers[notes].Colour);
        // The notes are still in the file (for reading in CAD), only switched off.
        Assert.Contains(entities, e => e.Layer == notes);
        // Every cut, score and mark layer stays on.
        foreach (LineClass c in new[] { LineClass.CutOutline, LineClass.CutInner, LineClass.Mountain, LineClass.Valley, LineClass.TabFold, LineClass.Label })
            Assert.True(layers[LineStyleTable.Default[c].LayerName].Plotted, $"{c} must stay on");
        // What a cutter sees: every entity on a plotted layer, and none of them a note.
        var seen = entities.Where(e => layers[e.Layer].Plotted).ToList();
        Assert.DoesNotContain(seen, e => e.Layer == notes);
        int notesLines = sheet.Lines.Count(l => l.Class == LineClass.Annotation);
        Assert.True(notesLines > 0);
    }

    [Fact]
    public void ALayerTheJobMarksDrawOnlyIsOffAndOneItCutsIsOn()
    {
        // A shop that engraves the notes instead: the notes layer becomes a mark layer and stays on;
        // a shop that never marks labels sets them draw-only, and that layer goes off.
        var styles = LineStyleTable.Default
            .WithOperation(LineClass.Annotation, LineOperation.Mark)
            .WithOperation(LineClass.Label, LineOperation.DrawOnly);
        var (layers, _) = Read(Write(WriterTestSheets.A4WithEveryClass(), styles));
        Assert.True(layers[styles[LineClass.Annotation].LayerName].Plotted);
        Assert.False(layers[styles[LineClass.Label].LayerName].Plotted);
    }
}
