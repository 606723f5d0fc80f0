using System.Text;
using System.Text.Json;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Output.Report;

/// <summary>The folding viewer's data as JSON text, safe to inline in an HTML script element.</summary>
/// <remarks>Positions are rounded to 10 micrometres at full scale: far below anything visible on screen,
/// and it keeps the page small. "&lt;/" is escaped so no job text can close the script element.</remarks>
public static class ViewerData
{
    /// <summary>JSON with keys folded (#V*3 m), faces, edges (triples v0, v1, role index), deviation
    /// (#V m), barMin/barMax (m), smallestSpan (m, the colour scale's least half-range), scale, keyframes [{p, x}], palette (5 CSS stops) and roleColours.</summary>
    public static string Json(ReportModel model, double barMinM, double barMaxM)
    {
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = false }))
        {
            w.WriteStartObject();
            w.WriteString("name", model.JobName);
            w.WriteNumber("scale", model.ScaleDenominator);
            Numbers(w, "folded", model.FoldedPositions, 5);
            w.WriteStartArray("faces");
            foreach (var f in model.Faces)
            {
                w.WriteStartArray();
                foreach (int v in f) w.WriteNumberValue(v);
                w.WriteEndArray();
            }
            w.WriteEndArray();
            w.WriteStartArray("edges");
            for (int e = 0; e < model.EdgeRoles.Length; e++)
            {
                w.WriteNumberValue(model.EdgeVertices[2 * e]);
                w.WriteNumberValue(model.EdgeVertices[2 * e + 1]);
                w.WriteNumberValue((int)model.EdgeRoles[e]);
            }
            w.WriteEndArray();
            Numbers(w, "deviation", model.VertexDeviationM, 7);
            w.WriteNumber("barMin", barMinM);
            w.WriteNumber("barMax", barMaxM);
            w.WriteNumber("smallestSpan", DeviationPalette.SmallestSpanM);
            w.WriteStartArray("keyframes");
            foreach (var k in model.Keyframes.OrderBy(k => k.Progress))
            {
                w.WriteStartObject();
                w.WriteNumber("p", k.Progress);
                Numbers(w, "x", k.Positions, 5);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("palette");
            foreach (var s in DeviationPalette.CssStops()) w.WriteStringValue(s);
            w.WriteEndArray();
            w.WriteStartArray("roleColours");
            foreach (var r in new[] { CreaseRole.Boundary, CreaseRole.Mountain, CreaseRole.Valley, CreaseRole.Flat })
                w.WriteStringValue(CreaseStyle.Css(r));
            w.WriteEndArray();
            w.WriteEndObject();
        }
        // The default encoder already writes '<' as \u003C; the replace guards against a future change of encoder.
        return Encoding.UTF8.GetString(buffer.ToArray()).Replace("</", "<\\/");
    }

    private static void Numbers(Utf8JsonWriter w, string name, double[] values, int decimals)
    {
        w.WriteStartArray(name);
        foreach (double v in values)
        {
            if (!double.IsFinite(v)) throw new ArgumentException($"{name} holds a value that is not finite");
            double r = Math.Round(v, decimals);
            w.WriteNumberValue(r == 0 ? 0 : r); // no "-0"
        }
        w.WriteEndArray();
    }
}
