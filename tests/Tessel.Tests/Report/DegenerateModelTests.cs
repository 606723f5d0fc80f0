using Tessel.Core.Model;
using Tessel.Core.Tessellation;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class DegenerateModelTests
{
    internal static ReportModel OneFlatTriangle() => new()
    {
        JobName = "single panel",
        ScaleDenominator = 10,
        FoldedPositions = [0, 0, 0, 1, 0, 0, 0, 1, 0],
        Faces = [[0, 1, 2]],
        EdgeVertices = [0, 1, 0, 2, 1, 2],
        EdgeRoles = [CreaseRole.Boundary, CreaseRole.Boundary, CreaseRole.Boundary],
        VertexDeviationM = [0, 0, 0],
        FlatPositions = [0, 0, 1, 0, 0, 1],
    };

    [Fact]
    public void AFlatPanelOnTargetRendersWithAZeroBar()
    {
        var m = OneFlatTriangle();
        var preview = FoldedModelPreview.Render(m);
        Assert.Equal(0, preview.Bar.MinM);
        Assert.Equal(0, preview.Bar.MaxM);
        // Seen from 35 degrees above, the flat 1 m triangle still covers a visible area.
        Assert.True(PreviewPixels.NonBackground(preview.Image.Png) > 20000);
        Assert.True(PreviewPixels.NonBackground(CreasePatternPreview.Render(m).Png) > 2000);
        string html = HtmlReportWriter.Render(m);
        Assert.Contains("\"keyframes\":[]", html);
        string md = MarkdownSummaryWriter.Render(m);
        Assert.Contains("| distance to target, full scale | 0 to 0 mm |", md);
        Assert.Contains("## Warnings\n\nNone.\n", md);
        Assert.DoesNotContain("Accuracy against buildability", md);
    }

    [Fact]
    public void KeyframesWithAnotherVertexCountAreRejected()
    {
        var m = OneFlatTriangle() with { Keyframes = [new FoldKeyframe(0, [0, 0, 0])] };
        var ex = Assert.Throws<ArgumentException>(() => m.Validate());
        Assert.Contains("keyframe", ex.Message);
    }
}
