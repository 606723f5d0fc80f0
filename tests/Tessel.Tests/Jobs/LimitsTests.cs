using Tessel.Core.Jobs;

namespace Tessel.Tests.Jobs;

/// <summary>Limits checked when a job loads: memory, sheet sizes per format, input files.</summary>
public class LimitsTests
{
    private static Job Parse(string json) => JobLoader.Parse(json, "limits.json", Path.GetTempPath());

    private static JobError Fails(string json) => Assert.Throws<JobError>(() => Parse(json));

    [Theory]
    // Peak resident memory of Release builds without sheets measured on this project's machine
    // (MemoryEstimate's remarks): the estimate must not fall below any of them.
    // (maximum resident set size in KiB times 1024).
    [InlineData("miura", 20, 133_612 * 1024.0)]
    [InlineData("miura", 40, 457_024 * 1024.0)]
    [InlineData("miura", 70, 2_237_504 * 1024.0)]
    [InlineData("reverse-curvature", 20, 113_784 * 1024.0)]
    [InlineData("reverse-curvature", 40, 446_776 * 1024.0)]
    [InlineData("yoshimura", 20, 93_988 * 1024.0)]
    [InlineData("waterbomb", 20, 130_900 * 1024.0)]
    public void TheEstimateCoversTheMeasuredPeaks(string family, int cells, double measured)
    {
        double estimate = MemoryEstimate.Bytes(family, MemoryEstimate.Vertices(family, cells, cells));
        Assert.InRange(estimate, measured, 1.5 * measured);
    }

    [Fact]
    public void AJobTooLargeForTheMachineIsRefusedWithWhatItNeedsAndWhatFits()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": 40, "depth": 40 } }, "tessellation": { "cellsX": 500, "cellsY": 500 } }""");
        Assert.Equal("tessellation.cellsX", e.Where);
        // 1001 x 1001 vertices: 60 MB + 18.5 kB V + 670 B V^1.5 = 0.06 + 18.5 + 672.0 GB; 138 x 138 cells
        // (277 x 277 vertices) need 15.7 GB of the 16 GB the tests allow.
        Assert.Contains("500 x 500 miura cells would have about 1,002,001 vertices and need about 691 GB of memory", e.Message);
        Assert.Contains("a build may use 16 GB here (75 % of the memory this machine offers), which fits about 138 x 138 cells at most", e.Message);
        var (fx, fy) = MemoryEstimate.LargestThatFits("miura", 500, 500);
        Assert.True(MemoryEstimate.Bytes("miura", MemoryEstimate.Vertices("miura", fx, fy)) <= MemoryEstimate.BudgetBytes);
        Assert.True(MemoryEstimate.Bytes("miura", MemoryEstimate.Vertices("miura", fx + 1, fy + 1)) > MemoryEstimate.BudgetBytes);
        Assert.Equal((138, 138), (fx, fy));
    }

    [Fact]
    public void CellsDerivedFromCellSizeAreCheckedToo()
    {
        var e = Fails("""{ "target": { "kind": "plane", "footprint": { "width": 40, "depth": 20 } }, "tessellation": { "cellSize": 0.1 } }""");
        Assert.Equal("tessellation.cellSize", e.Where);
        Assert.StartsWith("400 x 200 miura cells (footprint / cellSize 0.1) would have about 321,201 vertices", e.Problem);
        Assert.EndsWith("or a larger tessellation.cellSize", e.Problem);
    }

    [Theory]
    // 300 dpi = 11.81 px/mm. A0 portrait 841 x 1189 mm: 9933 x 14043 px, 0.56 GB: stays at 300.
    [InlineData(841, 1189, 300)]
    // 2500 x 2500 mm: 29528 px a side at 300 dpi (3.5 GB), 19685 at 200 (1.55 GB), 14764 at 150 (0.87 GB).
    [InlineData(2500, 2500, 150)]
    // 3000 x 2000 mm: 35433 px wide at 300 dpi (over 30,000), 1.49 GB at 200, 0.84 GB at 150.
    [InlineData(3000, 2000, 150)]
    // A 60 m strip: 59055 px long at 25 dpi (over 30,000), 23622 x 39 px at 10 dpi.
    [InlineData(60_000, 100, 10)]
    public void PngResolutionIsLoweredOnlyAsFarAsTheSheetNeeds(double w, double h, int dpi)
    {
        Assert.Equal(dpi, SheetLimits.PngDpi(w, h));
        if (dpi < 300) Assert.StartsWith($"PNG sheets are written at {dpi} dpi, not 300", SheetLimits.PngNote(w, h));
        else Assert.Null(SheetLimits.PngNote(w, h));
    }

    [Fact]
    public void ASheetNoFormatAskedForCanHoldIsRefusedWhenTheJobLoads()
    {
        const string target = """ "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } } """;
        // ISO 32000-1 Annex C: a PDF page is at most 14,400 units of 1/72 in = 5080 mm.
        Assert.Equal(5080, SheetLimits.MaxPdfPageMm, 9);
        var e = Fails($$"""{ {{target}}, "fabrication": { "sheet": { "widthMm": 1e9, "heightMm": 2000 } } }""");
        Assert.Equal("fabrication.sheet.widthMm", e.Where);
        Assert.Contains("larger than a PDF page can be (5080 mm", e.Problem);
        // Without PDF, PNG cannot hold it either, even at 10 dpi.
        e = Fails($$"""{ {{target}}, "fabrication": { "sheet": { "widthMm": 2000, "heightMm": 1e9 } }, "outputs": { "pdf": false } }""");
        Assert.Equal("fabrication.sheet.heightMm", e.Where);
        Assert.Contains("too large for a PNG even at 10 dpi", e.Problem);
        // SVG and DXF alone hold any size.
        var job = Parse($$"""{ {{target}}, "fabrication": { "sheet": { "widthMm": 2000, "heightMm": 1e9 } }, "outputs": { "pdf": false, "png": false } }""");
        Assert.Equal(1e9, job.Fabrication.Sheet.HeightMm);
        // A large sheet within PDF's page: accepted, and its PNG is written at a lower resolution.
        job = Parse($$"""{ {{target}}, "fabrication": { "sheet": { "widthMm": 3000, "heightMm": 2000 } } }""");
        Assert.Equal(3000, job.Fabrication.Sheet.WidthMm);
    }

    [Fact]
    public void InputPathsMustBeRegularFiles()
    {
        string dir = TestPaths.NewTempFolder();
        string fifo = Path.Combine(dir, "mesh.obj");
        using (var mk = System.Diagnostics.Process.Start("mkfifo", fifo)) mk.WaitForExit();
        string link = Path.Combine(dir, "zeros.stl");
        File.CreateSymbolicLink(link, "/dev/zero");

        Assert.Equal("named pipe (FIFO)", InputFile.KindOf(fifo));
        Assert.Equal("character device", InputFile.KindOf(link));
        Assert.Equal("regular file", InputFile.KindOf(Path.Combine(TestPaths.Patterns, "saddle-canopy.json")));

        var e = Assert.Throws<JobError>(() => InputFile.ReadBounded(fifo, "target.mesh", "mesh file", InputFile.MaxMeshBytes));
        Assert.Equal($"target.mesh: {fifo} is a named pipe (FIFO), not a regular file; give the path of the mesh file itself", e.Message);
        e = Assert.Throws<JobError>(() => InputFile.ReadBounded("/dev/zero", "target.mesh", "mesh file", InputFile.MaxMeshBytes));
        Assert.Contains("is a character device", e.Message);
        e = Assert.Throws<JobError>(() => InputFile.ReadBounded(link, "target.mesh", "mesh file", InputFile.MaxMeshBytes));
        Assert.Contains("is a character device", e.Message);
        e = Assert.Throws<JobError>(() => InputFile.ReadBounded(dir, "target.mesh", "mesh file", InputFile.MaxMeshBytes));
        Assert.Contains("is a folder", e.Message);

        // The size cap, on a small cap for the test.
        string big = Path.Combine(dir, "big.obj");
        File.WriteAllBytes(big, new byte[2048]);
        e = Assert.Throws<JobError>(() => InputFile.ReadBounded(big, "target.mesh", "mesh file", 1024));
        Assert.StartsWith("target.mesh: ", e.Message);
        Assert.Equal(2048, InputFile.ReadBounded(big, "target.mesh", "mesh file", 4096).Length);

        // A job file that is a device or a pipe: refused by name, never read.
        e = Assert.Throws<JobError>(() => JobLoader.Load("/dev/zero"));
        Assert.Equal("/dev/zero: is a character device, not a job file; give the path of the job file itself", e.Message);
        Assert.Contains("named pipe", Assert.Throws<JobError>(() => JobLoader.Load(fifo)).Message);
        Assert.Equal("job", Assert.Throws<JobError>(() => JobLoader.Load("")).Where);
    }
}
