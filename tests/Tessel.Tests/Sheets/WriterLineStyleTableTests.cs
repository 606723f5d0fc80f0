using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class WriterLineStyleTableTests
{
    private static readonly LineStyleTable Table = LineStyleTable.Default;

    [Fact]
    public void Every_line_class_has_a_valid_style_and_its_own_layer()
    {
        var classes = Enum.GetValues<LineClass>();
        foreach (LineClass c in classes) Table[c].Validate();
        Assert.Equal(classes.Length, classes.Select(c => Table[c].LayerName).Distinct().Count());
        Assert.Equal(classes.Length, classes.Select(c => Table[c].ColourHex).Distinct().Count());
        Assert.Equal(classes.OrderBy(c => c), LineStyleTable.FabricationOrder.OrderBy(c => c));
        Assert.Equal(LineClass.CutOutline, LineStyleTable.FabricationOrder[^1]); // outlines last: the part stays put
    }

    [Fact]
    public void Dash_proportions_follow_iso_128_20_and_scale_with_the_dash_unit()
    {
        // ISO 128-20: dashed 12d/3d; long-dash dotted 24d/3d/0.5d/3d; long-dash double-dotted.
        Assert.Equal(new[] { 12.0, 3.0 }, Table[LineClass.Valley].DashPattern);
        Assert.Equal(new[] { 24.0, 3.0, 0.5, 3.0 }, Table[LineClass.Mountain].DashPattern);
        Assert.Equal(new[] { 24.0, 3.0, 0.5, 3.0, 0.5, 3.0 }, Table[LineClass.TabFold].DashPattern);
        Assert.Equal(new[] { 3.0, 0.75 }, Table.DashLengthsMm(LineClass.Valley));
        Assert.Equal(new[] { 6.0, 0.75, 0.125, 0.75 }, Table.DashLengthsMm(LineClass.Mountain));
        Assert.Equal(new[] { 6.0, 1.5 }, Table.WithDashUnit(0.5).DashLengthsMm(LineClass.Valley));
        Assert.Empty(Table.DashLengthsMm(LineClass.CutOutline));
        Assert.True(Table[LineClass.CutInner].IsContinuous);
    }

    [Fact]
    public void Defaults_stay_apart_in_grey()
    {
        // Continuous classes can only be told apart by grey level: at least 40 of 255 apart
        // (Rec. 601 luma). Dashed classes share no pattern with any other class.
        var classes = Enum.GetValues<LineClass>();
        var continuous = classes.Where(c => Table[c].IsContinuous).Select(c => Table[c].GreyLevel).OrderBy(g => g).ToArray();
        Assert.Equal(4, continuous.Length);
        for (int i = 1; i < continuous.Length; i++)
            Assert.True(continuous[i] - continuous[i - 1] >= 40, $"grey levels {continuous[i - 1]:F0} and {continuous[i]:F0} too close");
        var dashed = classes.Where(c => !Table[c].IsContinuous).Select(c => string.Join("/", Table[c].DashPattern)).ToArray();
        Assert.Equal(dashed.Length, dashed.Distinct().Count());
        // Nothing so light it vanishes on white paper.
        Assert.All(classes, c => Assert.True(Table[c].GreyLevel < 160, $"{c} is too light"));
        Assert.Equal(20.0, Table[LineClass.CutOutline].GreyLevel, 1);
    }

    [Fact]
    public void Cut_and_score_meaning_is_editable_and_defaults_are_sensible()
    {
        Assert.Equal([LineClass.CutInner, LineClass.CutOutline], Table.ClassesFor(LineOperation.Cut));
        Assert.Equal([LineClass.TabFold, LineClass.Valley, LineClass.Mountain], Table.ClassesFor(LineOperation.Score));
        Assert.Equal([LineClass.Annotation, LineClass.FlatCrease], Table.ClassesFor(LineOperation.DrawOnly));
        LineStyleTable edited = Table.WithOperation(LineClass.Valley, LineOperation.Cut);
        Assert.Equal(LineOperation.Cut, edited[LineClass.Valley].Operation);
        Assert.Equal(LineOperation.Score, Table[LineClass.Valley].Operation); // the default is untouched
    }

    [Fact]
    public void Stroke_width_defaults_to_a_hairline_and_is_configurable()
    {
        Assert.Equal(0.05, Table.StrokeWidthMm);
        Assert.Equal(0.1, Table.WithStrokeWidth(0.1).StrokeWidthMm);
        Assert.Throws<ArgumentOutOfRangeException>(() => Table.WithStrokeWidth(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => Table.WithStrokeWidth(double.NaN));
    }

    [Theory]
    [InlineData("bad layer", "#112233", 12, 3)]
    [InlineData("OK", "112233", 12, 3)]
    [InlineData("OK", "#11223", 12, 3)]
    [InlineData("OK", "#112233", 12, 0)]
    public void Invalid_styles_are_refused(string layer, string colour, double dash, double gap)
    {
        var style = new LineStyle("X", layer, colour, 1, [dash, gap], LineOperation.Score);
        Assert.Throws<ArgumentException>(() => Table.With(LineClass.Valley, style));
    }

    [Fact]
    public void Two_classes_cannot_share_a_layer()
    {
        var clash = Table[LineClass.Valley] with { LayerName = Table[LineClass.Mountain].LayerName };
        Assert.Throws<ArgumentException>(() => Table.With(LineClass.Valley, clash));
    }
}
