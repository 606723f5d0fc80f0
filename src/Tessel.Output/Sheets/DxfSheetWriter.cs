using System.Globalization;
using System.Text;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Writes one sheet as a DXF R12 (AC1009) drawing in millimetres for laser software and CAD.</summary>
/// <remarks>
/// Follows the Autodesk DXF Reference for R12: group code / value pairs in a HEADER ($ACADVER,
/// $EXTMIN/$EXTMAX, $LIMMIN/$LIMMAX), a TABLES section with one LTYPE per dashed class and one LAYER
/// per line class (colour index, line type; draw-only layers switched off by a negative colour), and ENTITIES: LINE for two-point lines and
/// POLYLINE/VERTEX/SEQEND (flag 70 = 1 when closed) for longer ones. No LWPOLYLINE (R2000+) and no
/// $INSUNITS (R2000+): the units are millimetres by this writer's contract, and a comment
/// (group 999) says so. DXF y points up, so y is flipped: y_dxf = sheet height - y_sheet.
/// Entities come layer by layer in <see cref="LineStyleTable.FabricationOrder"/>, lines within a
/// layer in the sheet's cutting order, and every entity is on its layer's colour and line type (BYLAYER).
/// </remarks>
public sealed class DxfSheetWriter : ISheetWriter
{
    /// <summary>DXF sheets for cutters. The cover is a guide to read, not a job to cut, so it has no DXF.</summary>
    public static SheetFormat Format { get; } = new("dxf", ".dxf", "dxf", o => o.Dxf,
        CarriesCover: false, OneFilePerSheet: true, ForPrinting: false, _ => new DxfSheetWriter());

    /// <inheritdoc/>
    public string FileExtension => Format.FileExtension;

    /// <inheritdoc/>
    public bool OneFilePerSheet => Format.OneFilePerSheet;

    /// <inheritdoc/>
    public void Write(IReadOnlyList<Sheet> sheets, LineStyleTable styles, Stream output) =>
        Write(SheetWriterGuard.Single(sheets, "DXF"), styles, output);

    /// <summary>Writes <paramref name="sheet"/> to <paramref name="output"/> as ASCII DXF R12.</summary>
    public void Write(Sheet sheet, LineStyleTable styles, Stream output)
    {
        SheetWriterGuard.Check(sheet);
        ArgumentNullException.ThrowIfNull(styles);
        ArgumentNullException.ThrowIfNull(output);

        var dxf = new Dxf();
        dxf.Pair(999, Ascii($"Tessel fabrication sheet {sheet.Number} ({sheet.Side}); units: millimetres; 1 drawing unit = 1 mm"));

        // Extents: the sheet rectangle, grown if any line strays outside it.
        double minX = 0, minY = 0, maxX = sheet.WidthMm, maxY = sheet.HeightMm;
        foreach (Vec2 p in sheet.Lines.SelectMany(l => l.Points))
        {
            minX = Math.Min(minX, p.X); maxX = Math.Max(maxX, p.X);
            minY = Math.Min(minY, sheet.HeightMm - p.Y); maxY = Math.Max(maxY, sheet.HeightMm - p.Y);
        }

        dxf.Pair(0, "SECTION").Pair(2, "HEADER");
        dxf.Pair(9, "$ACADVER").Pair(1, "AC1009");
        dxf.Pair(9, "$INSBASE").Point(10, 0, 0);
        dxf.Pair(9, "$EXTMIN").Point(10, minX, minY);
        dxf.Pair(9, "$EXTMAX").Point(10, maxX, maxY);
        dxf.Pair(9, "$LIMMIN").Pair(10, Num(0)).Pair(20, Num(0));
        dxf.Pair(9, "$LIMMAX").Pair(10, Num(sheet.WidthMm)).Pair(20, Num(sheet.HeightMm));
        dxf.Pair(9, "$LTSCALE").Pair(40, Num(1));
        dxf.Pair(0, "ENDSEC");

        LineClass[] dashed = LineStyleTable.FabricationOrder.Where(c => !styles[c].IsContinuous).ToArray();
        dxf.Pair(0, "SECTION").Pair(2, "TABLES");
        dxf.Pair(0, "TABLE").Pair(2, "LTYPE").Pair(70, Int(1 + dashed.Length));
        dxf.Pair(0, "LTYPE").Pair(2, "CONTINUOUS").Pair(70, "0").Pair(3, "Solid line")
           .Pair(72, "65").Pair(73, "0").Pair(40, Num(0));
        foreach (LineClass c in dashed)
        {
            double[] mm = styles.DashLengthsMm(c);
            dxf.Pair(0, "LTYPE").Pair(2, LineTypeName(styles[c])).Pair(70, "0")
               .Pair(3, Ascii($"{styles[c].DisplayName}: " + string.Join(" ", styles[c].DashPattern.Select(v => v.ToString(CultureInfo.InvariantCulture) + "d"))
                    + $", d = {styles.DashUnitMm.ToString(CultureInfo.InvariantCulture)} mm"))
               .Pair(72, "65").Pair(73, Int(mm.Length)).Pair(40, Num(mm.Sum()));
            // Dashes positive, gaps negative (DXF convention).
            for (int i = 0; i < mm.Length; i++) dxf.Pair(49, Num(i % 2 == 0 ? mm[i] : -mm[i]));
        }
        dxf.Pair(0, "ENDTAB");

        dxf.Pair(0, "TABLE").Pair(2, "LAYER").Pair(70, Int(LineStyleTable.FabricationOrder.Count));
        foreach (LineClass c in LineStyleTable.FabricationOrder)
        {
            LineStyle s = styles[c];
            // A negative colour number turns a layer off (R12 layer table): print-only notes stay in
            // the file for reading, and a cutter sent the whole drawing skips them.
            int colour = s.Operation == LineOperation.DrawOnly ? -s.DxfColourIndex : s.DxfColourIndex;
            dxf.Pair(0, "LAYER").Pair(2, s.LayerName).Pair(70, "0").Pair(62, Int(colour))
               .Pair(6, s.IsContinuous ? "CONTINUOUS" : LineTypeName(s));
        }
        dxf.Pair(0, "ENDTAB");
        dxf.Pair(0, "ENDSEC");

        dxf.Pair(0, "SECTION").Pair(2, "ENTITIES");
        foreach (LineClass c in LineStyleTable.FabricationOrder)
        {
            string layer = styles[c].LayerName;
            foreach (SheetLine line in SheetWriterGuard.LinesOf(sheet, c))
            {
                if (line.Points.Length == 2 && !line.Closed)
                {
                    Vec2 a = line.Points[0], b = line.Points[1];
                    dxf.Pair(0, "LINE").Pair(8, layer)
                       .Point(10, a.X, sheet.HeightMm - a.Y).Point(11, b.X, sheet.HeightMm - b.Y);
                    continue;
                }
                dxf.Pair(0, "POLYLINE").Pair(8, layer).Pair(66, "1").Point(10, 0, 0).Pair(70, line.Closed ? "1" : "0");
                foreach (Vec2 p in line.Points)
                    dxf.Pair(0, "VERTEX").Pair(8, layer).Point(10, p.X, sheet.HeightMm - p.Y).Pair(70, "0");
                dxf.Pair(0, "SEQEND").Pair(8, layer);
            }
        }
        dxf.Pair(0, "ENDSEC");
        dxf.Pair(0, "EOF");

        byte[] bytes = Encoding.ASCII.GetBytes(dxf.ToString());
        output.Write(bytes, 0, bytes.Length);
    }

    /// <summary>The LTYPE name used for a dashed class: its layer name with a suffix.</summary>
    internal static string LineTypeName(LineStyle style) => style.LayerName + "_LT";

    private static string Num(double v) => SheetNumberFormat.Fixed(v, 4);

    private static string Int(int v) => v.ToString(CultureInfo.InvariantCulture);

    /// <summary>R12 files are ASCII: anything else becomes '?', and line breaks would end the value.</summary>
    private static string Ascii(string s) =>
        new(s.Select(c => c is >= ' ' and <= '~' ? c : '?').ToArray());

    /// <summary>Accumulates group code / value lines: the code right-aligned in three columns as
    /// AutoCAD writes it, then the value, each on its own line.</summary>
    private sealed class Dxf
    {
        private readonly StringBuilder _text = new();

        public Dxf Pair(int code, string value)
        {
            _text.Append(code.ToString(CultureInfo.InvariantCulture).PadLeft(3)).Append('\n').Append(value).Append('\n');
            return this;
        }

        /// <summary>A 3D point (z = 0) under codes first, first + 10, first + 20.</summary>
        public Dxf Point(int first, double x, double y) =>
            Pair(first, Num(x)).Pair(first + 10, Num(y)).Pair(first + 20, Num(0));

        public override string ToString() => _text.ToString();
    }
}
