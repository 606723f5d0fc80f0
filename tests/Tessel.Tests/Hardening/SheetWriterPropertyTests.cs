using System.Xml.Linq;
using FsCheck;
using FsCheck.Fluent;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;
using Tessel.Tests.Sheets;

namespace Tessel.Tests.Hardening;

/// <summary>FsCheck properties over the sheet writers: any sheet of lines survives the DXF round trip
/// (Autodesk DXF Reference, R12 group codes) and gives a well-formed true-size SVG.</summary>
public class SheetWriterPropertyTests
{
    private static Config Seeded(int tests) => Config.QuickThrowOnFailure.WithMaxTest(tests).WithReplay(20261202UL, 2718281828459045UL);

    private static Gen<Sheet> Sheets() =>
        from w in Gen.Choose(50, 1000)
        from h in Gen.Choose(50, 1000)
        from count in Gen.Choose(1, 12)
        from lines in Line(w, h).ListOf(count)
        select new Sheet(1, w, h, lines.ToArray());

    private static Gen<SheetLine> Line(int w, int h) =>
        from cls in Gen.Elements(Enum.GetValues<LineClass>())
        from n in Gen.Choose(2, 6)
        from xs in Gen.Choose(0, w * 100).ListOf(n)
        from ys in Gen.Choose(0, h * 100).ListOf(n)
        from closed in Gen.Elements(false, true)
        select new SheetLine(cls, xs.Zip(ys, (x, y) => new Vec2(x / 100.0, y / 100.0)).ToArray(), closed && n >= 3);

    [Fact]
    public void AnySheetRoundTripsThroughDxfAndGivesTrueSizeSvg()
    {
        int sheets = 0;
        Check.One(Seeded(200), Prop.ForAll(Sheets().ToArbitrary(), sheet =>
        {
            var styles = LineStyleTable.Default;
            using var dxf = new MemoryStream();
            new DxfSheetWriter().Write([sheet], styles, dxf);
            var entities = new WriterDxfReader(System.Text.Encoding.ASCII.GetString(dxf.ToArray())).Entities();
            Assert.Equal(sheet.Lines.Length, entities.Count);
            for (int i = 0; i < entities.Count; i++)
            {
                var (layer, points, closed) = entities[i];
                // Layers come in the writer's order, lines within a layer in sheet order.
                var line = sheet.Lines.Where(x => styles[x.Class].LayerName == layer)
                    .ElementAt(entities.Take(i).Count(e => e.Layer == layer));
                Assert.Equal(line.Points.Length, points.Count);
                Assert.Equal(line.Closed, closed);
                for (int k = 0; k < points.Count; k++)
                {
                    // DXF y points up: y' = H - y (millimetres, written to 1e-4 mm).
                    Assert.Equal(line.Points[k].X, points[k].X, 3);
                    Assert.Equal(sheet.HeightMm - line.Points[k].Y, points[k].Y, 3);
                }
            }

            using var svg = new MemoryStream();
            new SvgSheetWriter().Write([sheet], styles, svg);
            var root = XDocument.Parse(System.Text.Encoding.UTF8.GetString(svg.ToArray())).Root!;
            // CSS Values and Units Level 3: lengths in mm; one user unit = 1 mm through the viewBox.
            Assert.Equal($"{sheet.WidthMm}mm", root.Attribute("width")!.Value);
            Assert.Equal($"{sheet.HeightMm}mm", root.Attribute("height")!.Value);
            Assert.Equal($"0 0 {sheet.WidthMm} {sheet.HeightMm}", root.Attribute("viewBox")!.Value);
            sheets++;
            return true;
        }));
        Assert.Equal(200, sheets);
    }
}
