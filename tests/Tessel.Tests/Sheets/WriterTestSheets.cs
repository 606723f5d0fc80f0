using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

/// <summary>Hand-built sheets for the writer tests: known geometry of every line class.</summary>
internal static class WriterTestSheets
{
    /// <summary>ISO 216 A4 portrait, 210 x 297 mm, with a part, its tab, creases of each kind, a
    /// label and the whole character set as annotation text.</summary>
    public static Sheet A4WithEveryClass()
    {
        var lines = new List<SheetLine>
        {
            new(LineClass.CutOutline, [new(20, 20), new(120, 20), new(120, 100), new(20, 100)], Closed: true),
            new(LineClass.CutOutline, [new(120, 30), new(128, 36), new(128, 84), new(120, 90)]),
            new(LineClass.CutInner, [new(90, 70), new(100, 70), new(100, 80), new(90, 80)], Closed: true),
            new(LineClass.Mountain, [new(20, 60), new(120, 60)]),
            new(LineClass.Valley, [new(70, 20), new(70, 100)]),
            new(LineClass.Valley, [new(20, 20), new(45, 40), new(70, 60)]),
            new(LineClass.TabFold, [new(120, 30), new(120, 90)]),
        };
        lines.AddRange(StrokeFont.Layout("PART 1 - SEAM A7", new Vec2(25, 95), 3)
            .Select(s => new SheetLine(LineClass.Label, s)));
        lines.AddRange(StrokeFont.Layout("ABCDEFGHIJKLM\nNOPQRSTUVWXYZ\n0123456789\n.,:;-+/()#=%'\"!?<>_*\u00B0\u00D7 \u20AC",
                new Vec2(20, 130), 6)
            .Select(s => new SheetLine(LineClass.Annotation, s)));
        return new Sheet(1, 210, 297, lines.ToArray());
    }

    /// <summary>A small sheet with one horizontal cut line, for pixel-position checks.</summary>
    public static Sheet SmallWithOneLine(LineClass lineClass = LineClass.CutOutline) =>
        new(2, 100, 50, [new SheetLine(lineClass, [new(10, 25), new(90, 25)])]);
}
