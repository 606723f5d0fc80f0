using Tessel.Core.Fitting;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Core.Tessellation;

namespace Tessel.Output.Report;

/// <summary>Everything the report, the previews and the summaries show about one build, as plain data
/// so that the report does not depend on how the pipeline stages are put together.</summary>
/// <remarks>
/// All lengths are in metres at full scale (the pipeline's unit) except sheet lines, which are in
/// millimetres at model scale. Vertex indices are shared by <see cref="FoldedPositions"/>,
/// <see cref="VertexDeviationM"/>, <see cref="FlatPositions"/> and every keyframe.
/// </remarks>
public sealed record ReportModel
{
    /// <summary>Short name of the job (used as a title and in file names).</summary>
    public required string JobName { get; init; }
    /// <summary>One-paragraph description of the job, free text from the job file.</summary>
    public string Description { get; init; } = "";
    /// <summary>Scale denominator n of the model (1:n); model length = full-scale length / n.</summary>
    public required double ScaleDenominator { get; init; }
    /// <summary>#V*3 folded vertex positions x0 y0 z0 x1 ... in metres at full scale, z up.</summary>
    public required double[] FoldedPositions { get; init; }
    /// <summary>#F faces as vertex index lists, counter-clockwise seen from the top side.</summary>
    public required int[][] Faces { get; init; }
    /// <summary>#E*2 edge end points.</summary>
    public required int[] EdgeVertices { get; init; }
    /// <summary>#E role of each edge.</summary>
    public required CreaseRole[] EdgeRoles { get; init; }
    /// <summary>#V signed distance of each vertex from the surface it should lie on, in metres at full
    /// scale; positive on the side the target's normal points to.</summary>
    public required double[] VertexDeviationM { get; init; }
    /// <summary>#V*2 flat crease pattern positions x0 y0 x1 ... in metres at full scale, y up.</summary>
    public required double[] FlatPositions { get; init; }
    /// <summary>Fits on the accuracy/buildability trade-off curve (may be empty).</summary>
    public ParetoPoint[] ParetoFront { get; init; } = [];
    /// <summary>Epsilon of the fit the build went on with, ringed in the plot; null when there is no front.</summary>
    public double? ChosenEpsilonDeg { get; init; }
    /// <summary>Says how the trade-off points relate to the fit used for the sheets (empty without a sweep).</summary>
    public string ParetoNote { get; init; } = "";
    /// <summary>Every file of the build, relative to the report, in the order written (may be empty).</summary>
    public string[] Files { get; init; } = [];
    /// <summary>Solver history of the chosen fit (may be empty).</summary>
    public ConvergenceStep[] Convergence { get; init; } = [];
    /// <summary>States along the rigid folding path in increasing progress (may be empty: the viewer then
    /// shows the folded model only).</summary>
    public FoldKeyframe[] Keyframes { get; init; } = [];
    /// <summary>Rows of the summary table, in the order shown.</summary>
    public SummaryRow[] Summary { get; init; } = [];
    /// <summary>Findings of the checks a designer must read before building.</summary>
    public string[] Warnings { get; init; } = [];
    /// <summary>Safety and use cautions printed with every report.</summary>
    public string[] Cautions { get; init; } = [];
    /// <summary>Fabrication sheets, drawn as thumbnails (may be empty).</summary>
    public Sheet[] Sheets { get; init; } = [];

    /// <summary>Number of vertices.</summary>
    public int VertexCount => FoldedPositions.Length / 3;

    /// <summary>Builds the mesh part of a report model from a folded crease mesh and its flat pattern
    /// positions; the caller adds the rest with a <c>with</c> expression.</summary>
    public static ReportModel FromMesh(string jobName, double scaleDenominator, CreaseMesh folded,
        double[] flatPositions, double[] vertexDeviationM) => new()
    {
        JobName = jobName,
        ScaleDenominator = scaleDenominator,
        FoldedPositions = folded.Positions,
        Faces = folded.Faces,
        EdgeVertices = folded.EdgeVertices,
        EdgeRoles = folded.EdgeRoles,
        VertexDeviationM = vertexDeviationM,
        FlatPositions = flatPositions,
    };

    /// <summary>Throws <see cref="ArgumentException"/> naming the first array whose size does not match.</summary>
    public void Validate()
    {
        int n = VertexCount;
        if (FoldedPositions.Length % 3 != 0) throw new ArgumentException("folded positions must hold 3 numbers per vertex");
        if (!(ScaleDenominator > 0) || !double.IsFinite(ScaleDenominator)) throw new ArgumentException("scale denominator must be a positive number");
        if (VertexDeviationM.Length != n) throw new ArgumentException($"deviation has {VertexDeviationM.Length} values for {n} vertices");
        if (FlatPositions.Length != 2 * n) throw new ArgumentException($"flat pattern has {FlatPositions.Length / 2} vertices, folded model {n}");
        if (EdgeVertices.Length != 2 * EdgeRoles.Length) throw new ArgumentException("edge list and edge roles differ in length");
        foreach (var face in Faces)
            foreach (int v in face)
                if (v < 0 || v >= n) throw new ArgumentException($"face refers to vertex {v} of {n}");
        foreach (int v in EdgeVertices)
            if (v < 0 || v >= n) throw new ArgumentException($"edge refers to vertex {v} of {n}");
        foreach (var k in Keyframes)
            if (k.Positions.Length != FoldedPositions.Length) throw new ArgumentException($"keyframe at {k.Progress} has another vertex count");
    }
}
