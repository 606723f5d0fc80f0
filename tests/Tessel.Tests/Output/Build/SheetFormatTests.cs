using System.Text.Json;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Output.Build;
using Tessel.Output.Sheets;
using Tessel.Tests.Sheets;

namespace Tessel.Tests.Output.Build;

/// <summary>The sheet format table (<see cref="SheetFormats.All"/>) is the one place a format is described:
/// builds, job flags, schema, README and the pair notes on the sheets all agree with it.</summary>
public class SheetFormatTests
{
    /// <summary>An invented job: a saddle canopy over 4 x 3 m on A4 card, so the sheets have a back job.
    /// Each registered format's outputs flag is set from <paramref name="on"/>; OBJ, STL and report off.</summary>
    private static Job CanopyJob(Func<SheetFormat, bool> on)
    {
        string flags = string.Join(", ", SheetFormats.All.Select(f => $"\"{f.OutputsFlag}\": {(on(f) ? "true" : "false")}"));
        return JobLoader.Parse($$"""
            { "name": "ferry-shelter", "target": { "kind": "hyperbolic-paraboloid", "c": 4, "rise": 1, "footprint": { "width": 4, "depth": 3 } },
              "fabrication": { "material": "card", "sheet": { "name": "A4" } },
              "outputs": { {{flags}}, "obj": false, "stl": false, "report": false } }
            """, "ferry-shelter.json", Path.GetTempPath());
    }

    private static string[] SheetFiles(BuildOutput output, SheetFormat format) =>
        output.Files.Select(f => f.Path).Where(p => p.StartsWith("sheets/", StringComparison.Ordinal) && p.EndsWith(format.FileExtension, StringComparison.Ordinal)).ToArray();

    [Fact]
    public void EveryFormatIsWrittenByABuildWithItsFlagOnAndNoneWithItOff()
    {
        var on = BuildRunner.Collect(CanopyJob(_ => true), ProgressReporter.Silent);
        Assert.Null(on.Problem);
        foreach (var format in SheetFormats.All)
        {
            var files = SheetFiles(on, format);
            if (format.OneFilePerSheet)
            {
                Assert.Contains($"sheets/sheet-01{format.FileExtension}", files);
                Assert.Equal(format.CarriesCover, files.Contains($"sheets/cover{format.FileExtension}"));
            }
            else Assert.Equal([$"sheets/{SheetFormat.MultiPageBaseName}{format.FileExtension}"], files);
        }
        var off = BuildRunner.Collect(CanopyJob(_ => false), ProgressReporter.Silent);
        Assert.Null(off.Problem);
        Assert.DoesNotContain(off.Files, f => f.Path.StartsWith("sheets/", StringComparison.Ordinal));
        Assert.Contains(off.Files, f => f.Path == "crease-pattern.svg" || f.Path == "fold-angles.csv");
    }

    [Fact]
    public void EachFlagSwitchesItsOwnFormatAndNoOther()
    {
        // The sheet stage once, then the sheet files of a build for each single flag on and each single flag off.
        var all = CanopyJob(_ => true);
        var sheets = SheetStage.Run(all, FlatMiura.Build(3, 3), ProgressReporter.Silent);
        foreach (var format in SheetFormats.All)
        {
            var only = new BuildOutput();
            ModelOutputs.AddSheets(only, CanopyJob(f => f == format), sheets);
            var expected = format.Files(sheets.Cover, sheets.Sheets).Select(f => f.Path).ToArray();
            Assert.Equal(expected, only.Files.Select(f => f.Path).ToArray());
            Assert.Equal(format.CarriesCover ? sheets.Sheets.Count + 1 : sheets.Sheets.Count,
                format.OneFilePerSheet ? expected.Length : format.Files(sheets.Cover, sheets.Sheets).Single().Sheets.Count);

            var allBut = new BuildOutput();
            ModelOutputs.AddSheets(allBut, CanopyJob(f => f != format), sheets);
            Assert.Empty(SheetFiles(allBut, format));
            foreach (var other in SheetFormats.All.Where(f => f != format)) Assert.NotEmpty(SheetFiles(allBut, other));
        }
    }

    [Fact]
    public void DescriptorsAgreeWithTheirWritersAndNamesAreUnique()
    {
        Assert.Equal(SheetFormats.All.Count, SheetFormats.All.Select(f => f.Name).Distinct().Count());
        Assert.Equal(SheetFormats.All.Count, SheetFormats.All.Select(f => f.FileExtension).Distinct().Count());
        foreach (var format in SheetFormats.All)
        {
            var writer = format.CreateWriter(new SheetWriterOptions("ferry-shelter", 30));
            Assert.Equal(format.FileExtension, writer.FileExtension);
            Assert.Equal(format.OneFilePerSheet, writer.OneFilePerSheet);
            Assert.Same(format, SheetFormats.Find(format.Name.ToUpperInvariant()));
        }
    }

    [Fact]
    public void EveryOutputsFlagIsInTheSchemaAndTheLoader()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(TestPaths.Patterns, "tessel-job.schema.json")));
        var outputs = doc.RootElement.GetProperty("properties").GetProperty("outputs").GetProperty("properties");
        var known = JobLoader.KnownFieldPaths();
        foreach (var format in SheetFormats.All)
        {
            Assert.True(outputs.TryGetProperty(format.OutputsFlag, out var field), $"schema lacks outputs.{format.OutputsFlag}");
            Assert.Equal("boolean", field.GetProperty("type").GetString());
            Assert.Contains($"outputs.{format.OutputsFlag}", known);
        }
    }

    [Fact]
    public void TheReadmeFileTableListsEveryFormatsFiles()
    {
        var rows = File.ReadAllLines(Path.Combine(TestPaths.RepoRoot, "README.md")).Where(l => l.StartsWith("| ", StringComparison.Ordinal)).ToArray();
        foreach (var format in SheetFormats.All)
        {
            var row = Assert.Single(rows, r => r.StartsWith($"| {format.Name.ToUpperInvariant()} | `", StringComparison.Ordinal));
            string files = row.Split('|')[2];
            if (format.OneFilePerSheet)
            {
                Assert.Contains($"`sheet-NN{format.FileExtension}`", files);
                Assert.Equal(format.CarriesCover, files.Contains($"`cover{format.FileExtension}`"));
            }
            else Assert.Contains($"`{SheetFormat.MultiPageBaseName}{format.FileExtension}`", files);
        }
    }

    [Fact]
    public void PairNotesNameTheFileTypesOfTheOneFilePerSheetFormatsTheJobWrites()
    {
        // Core names the per-sheet file types in the notes tying front and back jobs (SheetStage.FileTypes);
        // it cannot read this table, so this test keeps the two lists the same.
        foreach (var format in SheetFormats.All)
            foreach (bool alone in new[] { true, false })
            {
                var job = CanopyJob(f => alone ? f == format : f != format);
                var expected = SheetFormats.All.Where(f => f.OneFilePerSheet && f.IsWanted(job.Outputs)).Select(f => f.FileExtension);
                Assert.Equal(expected, SheetStage.FileTypes(job));
            }
    }
}
