using Tessel.Core.Fitting;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;
using Tessel.Core.Tessellation.Miura;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

/// <summary>An invented job for report tests: a regular Miura canopy module for a made-up courtyard
/// ("Larkfield Yard shade trial"), folded rigidly along its one-parameter path. The geometry is real
/// (Schenk &amp; Guest closed form); the deviations, the trade-off curve and the solver history are
/// synthetic, for display only.</summary>
internal static class ReportDemoData
{
    /// <summary>A trade-off point with only the plotted values (epsilon, shape RMS) set; invented demo data.</summary>
    public static ParetoPoint Front(double epsilonDeg, double shapeRmsM) => new(epsilonDeg, shapeRmsM, shapeRmsM, 0, 0, 0, 0, true);

    public const double Deg = Math.PI / 180;
    public const double Scale = 50;
    public const int CellsX = 5, CellsY = 4;

    /// <summary>The regular sheet at fold angle theta (degrees).</summary>
    public static CreaseMesh Miura(double thetaDeg) =>
        RegularMiuraSheet.Build(new MiuraCell(0.6, 0.5, 60 * Deg, thetaDeg * Deg), CellsX, CellsY);

    public static ReportModel Build(double finalThetaDeg = 55)
    {
        var folded = Miura(finalThetaDeg);
        var flat3 = Miura(0).Positions;
        var flat = new double[folded.VertexCount * 2];
        for (int i = 0; i < folded.VertexCount; i++) { flat[2 * i] = flat3[3 * i]; flat[2 * i + 1] = flat3[3 * i + 1]; }

        // Synthetic deviation: a smooth bump, -9 mm .. +14 mm at full scale, not symmetric on purpose.
        var dev = new double[folded.VertexCount];
        for (int i = 0; i < dev.Length; i++)
        {
            var p = folded.Vertex(i);
            dev[i] = 0.0025 + 0.0115 * Math.Sin(1.9 * p.X) * Math.Cos(1.3 * p.Y);
        }

        var keyframes = new List<FoldKeyframe>();
        for (int k = 0; k <= 5; k++)
        {
            double t = k / 5.0;
            keyframes.Add(new FoldKeyframe(t, Miura(t * finalThetaDeg).Positions));
        }

        return ReportModel.FromMesh("Larkfield Yard shade trial", Scale, folded, flat, dev) with
        {
            Description = "Miura canopy module for an invented courtyard, <test> & \"quotes\" </script> kept as text.",
            ParetoFront =
            [
                Front(0.0, 0.0210), Front(0.5, 0.0123), Front(1.0, 0.0081), Front(2.0, 0.0052), Front(4.0, 0.0040),
            ],
            ChosenEpsilonDeg = 1.0,
            Convergence = Enumerable.Range(0, 25).Select(i => new ConvergenceStep(i, 3.0 * Math.Pow(0.55, i) + 1e-9, 0.4 * Math.Pow(0.42, i))).ToArray(),
            Keyframes = keyframes.ToArray(),
            Summary =
            [
                new("vertices", folded.VertexCount.ToString()),
                new("faces", folded.FaceCount.ToString()),
                new("scale", "1:50"),
                new("max deviation (full scale)", "+14.0 mm"),
            ],
            Warnings = ["2 vertices deviate more than 10 mm at full scale (synthetic test warning)."],
            Cautions =
            [
                "A folded scale model is for study and presentation, not a structural check.",
                "Never laser-cut PVC or vinyl.",
            ],
            Sheets = [DemoSheet(folded, flat)],
        };
    }

    /// <summary>The flat pattern at model scale on an A4 landscape sheet (297 x 210 mm, ISO 216).</summary>
    public static Sheet DemoSheet(CreaseMesh mesh, double[] flat)
    {
        double k = 1000 / Scale; // metres full scale -> mm model scale
        var lines = new List<SheetLine>();
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
            var cls = mesh.EdgeRoles[e] switch
            {
                CreaseRole.Mountain => LineClass.Mountain,
                CreaseRole.Valley => LineClass.Valley,
                CreaseRole.Boundary => LineClass.CutOutline,
                _ => LineClass.Annotation,
            };
            lines.Add(new SheetLine(cls, [new Vec2(20 + flat[2 * a] * k, 190 - flat[2 * a + 1] * k), new Vec2(20 + flat[2 * b] * k, 190 - flat[2 * b + 1] * k)]));
        }
        lines.Add(new SheetLine(LineClass.Annotation, [new Vec2(5, 5), new Vec2(292, 5), new Vec2(292, 205), new Vec2(5, 205)], Closed: true));
        return new Sheet(1, 297, 210, lines.ToArray());
    }
}
