using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using static Tessel.Core.Jobs.FieldReader;
using Tessel.Core.Model;

namespace Tessel.Core.Jobs;

/// <summary>Reads and validates job files. JSON with comments and trailing commas; unknown fields,
/// wrong types and out-of-range values are errors naming the field path and the fix.</summary>
public static partial class JobLoader
{
    private static readonly JsonDocumentOptions Options = new()
    {
        CommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
        MaxDepth = 32,
    };

    /// <summary>Loads a job file; relative input paths in it resolve against its folder.</summary>
    /// <exception cref="JobError">The file is missing, unreadable, malformed or invalid.</exception>
    public static Job Load(string path)
    {
        if (string.IsNullOrWhiteSpace(path)) throw new JobError("job", "no job file given (the path is empty); name a job file, e.g. tessel build patterns/saddle-canopy.json");
        string text;
        if (!Directory.Exists(path) && InputFile.KindOf(path) is { } kind && kind != "regular file")
            throw new JobError(path, $"is a {kind}, not a job file; give the path of the job file itself");
        try { text = ReadBounded(path); }
        catch (FileNotFoundException) { throw new JobError(path, "job file not found; check the path"); }
        catch (DirectoryNotFoundException) { throw new JobError(path, "job file not found; check the path"); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        { throw new JobError(path, $"cannot read the job file ({e.Message})"); }
        string dir = Path.GetDirectoryName(Path.GetFullPath(path)) ?? Directory.GetCurrentDirectory();
        return Parse(text, Path.GetFileName(path), dir);
    }

    /// <summary>Largest job file read, in bytes. Job files are a few kilobytes of text.</summary>
    public const int MaxJobFileBytes = 4 * 1024 * 1024;

    /// <summary>Reads at most <see cref="MaxJobFileBytes"/> (so a huge file or an endless device such as
    /// /dev/zero is refused rather than exhausting memory), then decodes as UTF-8, honouring a
    /// UTF-8, UTF-16 or UTF-32 byte order mark.</summary>
    private static string ReadBounded(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        var buffer = new byte[MaxJobFileBytes + 1];
        int total = 0, n;
        while (total < buffer.Length && (n = stream.Read(buffer, total, buffer.Length - total)) > 0) total += n;
        if (total > MaxJobFileBytes)
            throw new JobError(path, $"is larger than {MaxJobFileBytes / (1024 * 1024)} MB, which no job file is; check that this is the job file");
        using var reader = new StreamReader(new MemoryStream(buffer, 0, total), Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
        return reader.ReadToEnd();
    }

    /// <summary>Parses job text. <paramref name="sourceName"/> prefixes syntax errors
    /// ("job.json:3:14: ..."); <paramref name="baseDirectory"/> resolves relative input paths.</summary>
    public static Job Parse(string json, string sourceName, string baseDirectory) =>
        Parse(json, sourceName, baseDirectory, null);

    /// <summary>Every field path the loader reads ("target.radius", "fabrication.layers.valley.colour"),
    /// sorted. The JSON Schema must list exactly these.</summary>
    public static IReadOnlyList<string> KnownFieldPaths()
    {
        var known = new SortedSet<string>(StringComparer.Ordinal);
        // The smallest valid job: absent sections read as empty objects, so every field is visited.
        Parse("""{ "target": { "kind": "plane", "footprint": { "width": 1, "depth": 1 } } }""",
            "(minimal)", Directory.GetCurrentDirectory(), known);
        return known.ToArray();
    }

    private static Job Parse(string json, string sourceName, string baseDirectory, ICollection<string>? known)
    {
        if (string.IsNullOrWhiteSpace(json.Trim('\uFEFF')))
            throw new JobError($"{sourceName}:1:1", "malformed JSON: the file is empty; a job file is a JSON object with at least a target, and 'tessel scaffold --target plane --family miura' writes one to start from");
        JsonDocument doc;
        try { doc = JsonDocument.Parse(json, Options); }
        catch (JsonException e)
        {
            long line = (e.LineNumber ?? 0) + 1, col = (e.BytePositionInLine ?? 0) + 1;
            string why = e.Message;
            int cut = why.IndexOf(" LineNumber:", StringComparison.Ordinal);
            if (cut > 0) why = why[..cut].TrimEnd('.', ' ');
            // The reader's own parameter names mean nothing to someone editing a job file.
            int inner = why.IndexOf(", when isFinalBlock", StringComparison.Ordinal);
            if (inner > 0) why = why[..inner];
            throw new JobError($"{sourceName}:{line}:{col}", $"malformed JSON: {why}");
        }
        using (doc)
        {
            var root = new FieldReader(doc.RootElement, "", known);
            root.String("$schema");
            var nameText = root.String("name");
            var description = root.String("description");
            int seed = root.Integer("seed") ?? 1;
            var target = ReadTarget(root.Object("target"));
            var tess = ReadTessellation(root.Object("tessellation"));
            var fitting = ReadFitting(root.Object("fitting"));
            var fab = ReadFabrication(root.Object("fabrication"));
            var outputs = ReadOutputs(root.Object("outputs"));
            var sheet = fab.Sheet;
            string sheetField = sheet.Name is not null ? "fabrication.sheet.name"
                : sheet.WidthMm >= sheet.HeightMm ? "fabrication.sheet.widthMm" : "fabrication.sheet.heightMm";
            SheetLimits.Check(sheetField, sheet.WidthMm, sheet.HeightMm, outputs.Pdf, outputs.Png);
            CheckMemory(target, tess, outputs.Png ? SheetLimits.PngRasterBytes(sheet.WidthMm, sheet.HeightMm) : 0);
            root.RejectUnknown();
            string name = nameText ?? "tessel-model";
            if (!SafeName().IsMatch(name) || Reserved.Contains(name.Split('.')[0].ToUpperInvariant()))
                throw new JobError("name", $"must be a safe file name: letters, digits, '-', '_' or '.', starting with a letter or digit, at most 64 characters (got \"{name}\")");
            if (seed < 0) throw new JobError("seed", $"must be a whole number >= 0 (got {seed})");
            return new Job(name, description, seed, target, tess, fitting, fab, outputs) { BaseDirectory = baseDirectory };
        }
    }

    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$")]
    private static partial Regex SafeName();

    private static readonly HashSet<string> Reserved =
        ["CON", "PRN", "AUX", "NUL", "COM1", "COM2", "COM3", "COM4", "LPT1", "LPT2", "LPT3"];

    private static TargetSpec ReadTarget(FieldReader r)
    {
        string? kind = r.String("kind");
        string units = r.String("units") ?? "m";
        var vocabulary = JobVocabulary.Registered;
        // Every kind's fields are read (and type-checked) whatever the kind, so that the schema's field
        // list and unknown-field suggestions do not depend on the kind.
        var allParameters = vocabulary.TargetKinds.SelectMany(k => k.Parameters).DistinctBy(p => p.Name).ToArray();
        var numbers = new Dictionary<string, double>(StringComparer.Ordinal);
        var texts = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var parameter in allParameters)
        {
            if (parameter.Type == ParameterType.Text) { if (r.String(parameter.Name) is { } text) texts[parameter.Name] = text; }
            else if (r.Number(parameter.Name) is double number) numbers[parameter.Name] = number;
        }
        var fr = r.Object("footprint");
        bool hasFootprint = r.Has("footprint");
        var fw = fr.Number("width");
        var fd = fr.Number("depth");
        var corners = fr.NumberPairs("corners");
        fr.RejectUnknown();
        r.RejectUnknown();

        if (kind is null) throw Missing(r, "kind", Names(Catalog.TargetKinds));
        CheckChoice(r.PathOf("kind"), kind, vocabulary.TargetKinds.Select(k => k.Name));
        CheckChoice(r.PathOf("units"), units, Geometry.Units.Known);
        string len = $"length in {units}";
        var targetKind = vocabulary.Kind(kind)!;
        var own = targetKind.Parameters.Select(p => p.Name).ToArray();
        // A parameter that the kind ignores is almost always a mistake (a kind changed, a field copied
        // from another job), so it is reported rather than silently dropped.
        foreach (var field in allParameters.Select(p => p.Name))
        {
            if (r.Has(field) && !own.Contains(field))
                throw new JobError(r.PathOf(field), $"is not used by kind \"{kind}\"; remove it (that kind takes {(own.Length == 0 ? "no parameters" : string.Join(", ", own))})");
        }

        FootprintSpec? footprint = null;
        if (hasFootprint)
        {
            if (corners is not null)
            {
                if (fw is not null || fd is not null)
                    throw new JobError(fr.PathOf("corners"), "give either width and depth or corners, not both");
                if (corners.Length < 3) throw new JobError(fr.PathOf("corners"), $"a polygon needs at least 3 [x, y] corners (got {corners.Length})");
                double area = 0;
                for (int i = 0; i < corners.Length; i++)
                {
                    var a = corners[i]; var b = corners[(i + 1) % corners.Length];
                    area += a[0] * b[1] - a[1] * b[0];
                }
                if (Math.Abs(area) <= 0) throw new JobError(fr.PathOf("corners"), "the polygon has zero area; list its corners in order");
                if (FirstCrossing(corners) is { } x)
                    throw new JobError(fr.PathOf("corners"), $"the polygon's edges {x.A + 1} and {x.B + 1} cross; list the corners in order around the outline");
            }
            else
            {
                Positive(fr.PathOf("width"), fw, len, required: true);
                Positive(fr.PathOf("depth"), fd, len, required: true);
            }
            footprint = new FootprintSpec(fw, fd, corners);
            // A model is of a building-sized thing: beyond these the geometry stops being meaningful
            // (and squared lengths overflow), so say so instead of failing deep in the solver.
            Geometry.Units.TryMetresPer(units, out double metresPerUnit);
            double spanX = corners is null ? fw!.Value : corners.Max(q => q[0]) - corners.Min(q => q[0]);
            double spanY = corners is null ? fd!.Value : corners.Max(q => q[1]) - corners.Min(q => q[1]);
            double span = Math.Max(spanX, spanY) * metresPerUnit;
            string where = corners is null ? fr.PathOf(spanX >= spanY ? "width" : "depth") : fr.PathOf("corners");
            if (span > MaxFootprintMetres)
                throw new JobError(where, $"the footprint spans {Format(span)} m; Tessel models footprints up to {Format(MaxFootprintMetres)} m across: check the units (target.units)");
            if (span < MinFootprintMetres)
                throw new JobError(where, $"the footprint spans {Format(span)} m; Tessel needs at least {Format(MinFootprintMetres)} m across: check the units (target.units)");
        }
        else if (!targetKind.FootprintOptional)
        {
            throw new JobError(r.PathOf("footprint"), "missing; add \"footprint\": { \"width\": ..., \"depth\": ... } or { \"corners\": [[x, y], ...] }");
        }

        foreach (var parameter in targetKind.Parameters)
        {
            if (parameter.Default is double d) numbers.TryAdd(parameter.Name, d);
        }
        var parameters = new ParameterBag(
            numbers.Where(p => own.Contains(p.Key)).ToDictionary(StringComparer.Ordinal),
            texts.Where(p => own.Contains(p.Key)).ToDictionary(StringComparer.Ordinal));
        targetKind.Validate(parameters, new ParameterCheck("target", units));
        return new TargetSpec(kind, units, parameters, footprint);
    }

    /// <summary>The first pair of non-adjacent polygon edges (edge i runs from corner i to i+1) that
    /// touch or cross; null for a simple polygon.</summary>
    private static (int A, int B)? FirstCrossing(double[][] c)
    {
        int n = c.Length;
        static double Orient(double[] p, double[] q, double[] r) => (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]);
        for (int i = 0; i < n; i++)
            for (int j = i + 2; j < n; j++)
            {
                if (i == 0 && j == n - 1) continue; // these two share corner 0
                double[] a = c[i], b = c[(i + 1) % n], p = c[j], q = c[(j + 1) % n];
                double d1 = Orient(a, b, p), d2 = Orient(a, b, q), d3 = Orient(p, q, a), d4 = Orient(p, q, b);
                if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return (i, j);
            }
        return null;
    }

    private static TessellationSpec ReadTessellation(FieldReader r)
    {
        string family = r.String("family") ?? "miura";
        var cx = r.Integer("cellsX");
        var cy = r.Integer("cellsY");
        var size = r.Number("cellSize");
        double sector = r.Number("sectorAngleDeg") ?? 60;
        var depth = r.Number("foldDepth");
        double orient = r.Number("orientationDeg") ?? 0;
        double share = r.Number("flatDiagonalShare") ?? 0;
        r.RejectUnknown();
        CheckChoice(r.PathOf("family"), family, Catalog.Families.Select(f => f.Name), family.Contains("egg", StringComparison.OrdinalIgnoreCase)
            ? "the egg-box pattern is not developable and cannot be folded from one sheet; " : "");
        // Absurd counts are refused by their memory first: that message says what would fit.
        if (cx > 500 && cy is > 0 && MemoryEstimate.Problem(family, cx.Value, cy.Value) is { } tooBigX)
            throw new JobError(r.PathOf("cellsX"), tooBigX + "; use fewer cells (tessellation.cellsX and tessellation.cellsY)");
        if (cy > 500 && cx is > 0 && MemoryEstimate.Problem(family, cx.Value, cy.Value) is { } tooBigY)
            throw new JobError(r.PathOf("cellsY"), tooBigY + "; use fewer cells (tessellation.cellsX and tessellation.cellsY)");
        if (cx is not null && (cx < 1 || cx > 500)) throw new JobError(r.PathOf("cellsX"), $"must be a whole number from 1 to 500 (got {cx})");
        if (cy is not null && (cy < 1 || cy > 500)) throw new JobError(r.PathOf("cellsY"), $"must be a whole number from 1 to 500 (got {cy})");
        Positive(r.PathOf("cellSize"), size, "length in the target's units", required: false);
        if (size is null && (cx is null || cy is null)) { cx ??= 8; cy ??= 8; }
        if (!(sector > 0 && sector < 90)) throw new JobError(r.PathOf("sectorAngleDeg"), $"must be an angle between 0 and 90 degrees, exclusive (got {Format(sector)})");
        Positive(r.PathOf("foldDepth"), depth, "length in the target's units", required: false);
        if (!(share >= 0 && share <= 1)) throw new JobError(r.PathOf("flatDiagonalShare"), $"must be a share from 0 to 1 (got {Format(share)})");
        return new TessellationSpec(family, cx, cy, size, sector, depth, orient, share);
    }

    /// <summary>Refuses patterns whose cell counts (given, or derived from cellSize and the footprint)
    /// would need more memory than this machine allows a build (<see cref="MemoryEstimate"/>), before
    /// anything is built.</summary>
    private static void CheckMemory(TargetSpec target, TessellationSpec tess, double rasterBytes)
    {
        double? extentX = null, extentY = null;
        if (target.Footprint is { } f)
        {
            if (f.Corners is { } c)
            {
                extentX = c.Max(p => p[0]) - c.Min(p => p[0]);
                extentY = c.Max(p => p[1]) - c.Min(p => p[1]);
            }
            else { extentX = f.Width; extentY = f.Depth; }
        }
        else if (JobVocabulary.Registered.Kind(target.Kind)?.ExtentWithoutFootprint(target.Parameters) is { } extent) { extentX = extent.X; extentY = extent.Y; }
        static double? Derived(double? extent, double? size) =>
            extent is double e && size is double s ? Math.Max(1, Math.Round(e / s)) : null;
        double? cx = tess.CellsX ?? Derived(extentX, tess.CellSize);
        double? cy = tess.CellsY ?? Derived(extentY, tess.CellSize);
        if (cx is not double nx || cy is not double ny) return; // a mesh without a footprint: checked once the pattern exists
        bool derived = tess.CellsX is null || tess.CellsY is null;
        if (MemoryEstimate.Problem(tess.Family, nx, ny, rasterBytes, countsNote: derived ? $" (footprint / cellSize {Format(tess.CellSize ?? 0)})" : "") is not { } problem) return;
        string where = derived ? "tessellation.cellSize" : "tessellation.cellsX";
        throw new JobError(where, problem
            + $"; use fewer cells (tessellation.cellsX and tessellation.cellsY){(derived ? " or a larger tessellation.cellSize" : "")}");
    }

    private static FittingSpec ReadFitting(FieldReader r)
    {
        double eps = r.Number("epsilonDeg") ?? 0;
        double[] sweep = r.Numbers("epsilonSweepDeg") ?? [];
        var seed = r.Integer("seed");
        int starts = r.Integer("starts") ?? 1;
        int maxIt = r.Integer("maxIterations") ?? 300;
        double tol = r.Number("tolerance") ?? 1e-9;
        bool accept = r.Bool("acceptUnconverged") ?? false;
        string anchors = r.String("anchors") ?? "none";
        var b = r.Object("bounds");
        double minSector = b.Number("minSectorAngleDeg") ?? 5;
        double maxSector = b.Number("maxSectorAngleDeg") ?? 175;
        double minFold = b.Number("minFoldAngleDeg") ?? 1;
        double maxFold = b.Number("maxFoldAngleDeg") ?? 175;
        double minEdge = b.Number("minEdgeLengthMm") ?? 3;
        b.RejectUnknown();
        r.RejectUnknown();
        if (!(eps >= 0 && eps < 45)) throw new JobError(r.PathOf("epsilonDeg"), $"must be an angle from 0 to 45 degrees (got {Format(eps)})");
        for (int i = 0; i < sweep.Length; i++)
            if (!(sweep[i] >= 0 && sweep[i] < 45)) throw new JobError($"{r.PathOf("epsilonSweepDeg")}[{i}]", $"must be an angle from 0 to 45 degrees (got {Format(sweep[i])})");
        if (seed < 0) throw new JobError(r.PathOf("seed"), $"must be a whole number >= 0 (got {seed})");
        if (starts < 1 || starts > 1000) throw new JobError(r.PathOf("starts"), $"must be a whole number from 1 to 1000 (got {starts})");
        if (maxIt < 1) throw new JobError(r.PathOf("maxIterations"), $"must be a whole number >= 1 (got {maxIt})");
        if (!(tol > 0 && tol < 1)) throw new JobError(r.PathOf("tolerance"), $"must be a positive number below 1 (got {Format(tol)})");
        CheckChoice(r.PathOf("anchors"), anchors, Catalog.Anchors);
        Angle(b.PathOf("minSectorAngleDeg"), minSector);
        Angle(b.PathOf("maxSectorAngleDeg"), maxSector);
        Angle(b.PathOf("minFoldAngleDeg"), minFold);
        Angle(b.PathOf("maxFoldAngleDeg"), maxFold);
        if (!(minSector < maxSector)) throw new JobError(b.PathOf("maxSectorAngleDeg"), $"must be greater than minSectorAngleDeg ({Format(minSector)}) (got {Format(maxSector)})");
        if (!(minFold < maxFold)) throw new JobError(b.PathOf("maxFoldAngleDeg"), $"must be greater than minFoldAngleDeg ({Format(minFold)}) (got {Format(maxFold)})");
        NonNegative(b.PathOf("minEdgeLengthMm"), minEdge, "length in mm", required: true);
        return new FittingSpec(eps, sweep, seed, starts, maxIt, tol, accept, anchors,
            new FittingBounds(minSector, maxSector, minFold, maxFold, minEdge));
    }

    private static FabricationSpec ReadFabrication(FieldReader r)
    {
        double scale = r.NumberOrWord("scale", "auto", out bool autoScale) ?? (autoScale ? double.NaN : 100);
        int maxSheets = r.Integer("maxSheets") ?? 1;
        string material = r.String("material") ?? "card";
        var fm = r.Object("foldMethod");
        string mountain = fm.String("mountain") ?? "material";
        string valley = fm.String("valley") ?? "material";
        fm.RejectUnknown();
        var s = r.Object("sheet");
        var sheetName = s.String("name");
        var sw = s.Number("widthMm");
        var sh = s.Number("heightMm");
        s.RejectUnknown();
        string orientation = r.String("orientation") ?? "auto";
        double margin = r.Number("marginMm") ?? 8;
        double spacing = r.Number("spacingMm") ?? 3;
        double kerf = r.Number("kerfMm") ?? 0.15;
        var t = r.Object("tab");
        double tabWidth = t.Number("widthMm") ?? 6;
        double taper = t.Number("taperDeg") ?? 40;
        t.RejectUnknown();
        double hairline = r.Number("hairlineMm") ?? 0.05;
        var boards = ReadBoardOnFabric(r);
        var lr = r.Object("layers");
        var layers = new SortedDictionary<string, LayerStyle>(StringComparer.Ordinal);
        foreach (var cls in Catalog.LineClasses)
        {
            var l = lr.Object(cls);
            // A line class added to the sheet model later gets a plain black layer until it is given a
            // default here (and in the schema: a test checks that).
            var d = DefaultLayers.TryGetValue(cls, out var known) ? known : new LayerStyle("#000000", 8 + layers.Count, "draw-only");
            string colour = l.String("colour") ?? d.Colour;
            int pen = l.Integer("pen") ?? d.Pen;
            string operation = l.String("operation") ?? d.Operation;
            l.RejectUnknown();
            if (!HexColour().IsMatch(colour)) throw new JobError(l.PathOf("colour"), $"must be a colour written #rrggbb (got \"{colour}\")");
            if (pen < 1 || pen > 255) throw new JobError(l.PathOf("pen"), $"must be a pen number from 1 to 255 (got {pen})");
            CheckChoice(l.PathOf("operation"), operation, Operations);
            layers[cls] = new LayerStyle(colour.ToLowerInvariant(), pen, operation);
        }
        lr.RejectUnknown();
        r.RejectUnknown();

        if (!autoScale) Positive(r.PathOf("scale"), scale, "number n of the scale 1:n, or \"auto\"", required: true);
        // Beyond these a model is either larger than any sheet or smaller than any cutter's spot (common
        // practice, no source): the sheet arithmetic would run out of range before saying so.
        if (!autoScale && !(scale >= 1e-3 && scale <= 1e6))
            throw new JobError(r.PathOf("scale"), $"must be a number n of the scale 1:n from 0.001 to 1000000, or \"auto\" (got {Format(scale)})");
        if (maxSheets < 1 || maxSheets > 1000) throw new JobError(r.PathOf("maxSheets"), $"must be a whole number from 1 to 1000 (got {maxSheets})");
        if (string.IsNullOrWhiteSpace(material)) throw new JobError(r.PathOf("material"), "must name a material; see 'tessel catalog materials'");
        CheckChoice(r.PathOf("material"), material, Catalog.Materials.Select(m => m.Name));
        CheckChoice(fm.PathOf("mountain"), mountain, Catalog.FoldMethods.Select(f => f.Name));
        CheckChoice(fm.PathOf("valley"), valley, Catalog.FoldMethods.Select(f => f.Name));
        SheetSpec sheet;
        if (sheetName is not null)
        {
            if (sw is not null || sh is not null) throw new JobError(s.PathOf("name"), "give either a sheet name or widthMm and heightMm, not both");
            if (JobVocabulary.Registered.FindSheet(sheetName) is not { } named)
                throw new JobError(s.PathOf("name"), $"unknown sheet size \"{sheetName}\"{Suggest(sheetName, JobVocabulary.Registered.SheetSizes.Select(x => x.Name))}; see 'tessel catalog sheets' or give widthMm and heightMm");
            sheet = new SheetSpec(named.Name, named.WidthMm, named.HeightMm);
        }
        else if (sw is null && sh is null) sheet = new SheetSpec("A3", 297, 420);
        else
        {
            Positive(s.PathOf("widthMm"), sw, "length in mm", required: true);
            Positive(s.PathOf("heightMm"), sh, "length in mm", required: true);
            sheet = new SheetSpec(null, sw!.Value, sh!.Value);
        }
        CheckChoice(r.PathOf("orientation"), orientation, Catalog.Orientations);
        NonNegative(r.PathOf("marginMm"), margin, "length in mm", required: true);
        NonNegative(r.PathOf("spacingMm"), spacing, "length in mm", required: true);
        NonNegative(r.PathOf("kerfMm"), kerf, "length in mm", required: true);
        if (2 * margin >= Math.Min(sheet.WidthMm, sheet.HeightMm))
            throw new JobError(r.PathOf("marginMm"), $"leaves no room on a {Format(sheet.WidthMm)} x {Format(sheet.HeightMm)} mm sheet; use a smaller margin (got {Format(margin)})");
        Positive(t.PathOf("widthMm"), tabWidth, "length in mm", required: true);
        if (!(taper > 0 && taper < 90)) throw new JobError(t.PathOf("taperDeg"), $"must be an angle between 0 and 90 degrees, exclusive (got {Format(taper)})");
        Positive(r.PathOf("hairlineMm"), hairline, "length in mm", required: true);
        // Settings that cannot produce a cuttable sheet, whatever the model.
        double usable = Math.Min(sheet.WidthMm, sheet.HeightMm) - 2 * margin;
        if (kerf > spacing)
            throw new JobError(r.PathOf("kerfMm"), $"the cut ({Format(kerf)} mm wide) is wider than the gap between parts (spacingMm {Format(spacing)}), so neighbouring parts would be cut into each other; make spacingMm at least kerfMm");
        if (spacing >= usable)
            throw new JobError(r.PathOf("spacingMm"), $"the gap between parts ({Format(spacing)} mm) is as wide as the usable sheet ({Format(usable)} mm inside the margins); use a much smaller spacing");
        if (tabWidth >= usable / 2)
            throw new JobError(t.PathOf("widthMm"), $"a {Format(tabWidth)} mm glue tab takes half or more of the usable sheet ({Format(usable)} mm inside the margins); glue tabs are a few millimetres wide, e.g. 6");
        if (hairline >= usable)
            throw new JobError(r.PathOf("hairlineMm"), $"a {Format(hairline)} mm line is as wide as the usable sheet ({Format(usable)} mm); cut and fold lines are hairlines, e.g. 0.05");
        return new FabricationSpec(scale, material, new FoldMethodSpec(mountain, valley), sheet, orientation,
            margin, spacing, kerf, new TabSpec(tabWidth, taper), hairline, layers) { AutoScale = autoScale, MaxSheets = maxSheets, BoardOnFabric = boards };
    }

    /// <summary>fabrication.boardOnFabric, or null when the job has none. Defaults: 2 mm board, a usual
    /// greyboard for study models (common practice, no source); 0.4 mm gap, the middle of the 0.3-0.5 mm that
    /// suffices with the fabric inside a fold (docs/reference/fabrication.md [M]); fabric under the boards,
    /// so the boards are what the model shows.</summary>
    private static BoardOnFabricSpec? ReadBoardOnFabric(FieldReader fabrication)
    {
        bool wanted = fabrication.Has("boardOnFabric");
        var b = fabrication.Object("boardOnFabric");
        double thickness = b.Number("boardThicknessMm") ?? 2;
        double gap = b.Number("hingeGapMm") ?? 0.4;
        string side = b.String("fabricSide") ?? "bottom";
        b.RejectUnknown();
        if (!wanted) return null;
        // Thicker than 25 mm is a building panel, not a model board (common practice, no source).
        if (!(thickness > 0 && thickness <= 25))
            throw new JobError(b.PathOf("boardThicknessMm"), $"must be a board thickness in mm above 0 and at most 25, e.g. 2 (got {Format(thickness)})");
        if (!(gap >= 0 && gap <= 10))
            throw new JobError(b.PathOf("hingeGapMm"), $"must be a gap in mm from 0 to 10, e.g. 0.4 (got {Format(gap)})");
        CheckChoice(b.PathOf("fabricSide"), side, ["top", "bottom"]);
        return new BoardOnFabricSpec(thickness, gap, side);
    }

    /// <summary>Cutter operations a layer can be mapped to (the sheet stage's line operations).</summary>
    public static readonly IReadOnlyList<string> Operations = ["cut", "score", "mark", "draw-only"];

    /// <summary>Layer styles used when the job does not override them: the sheet stage's default table.</summary>
    public static IReadOnlyDictionary<string, LayerStyle> DefaultLayers => JobVocabulary.Registered.DefaultLayers;

    [GeneratedRegex("^#[0-9A-Fa-f]{6}$")]
    private static partial Regex HexColour();

    private static OutputsSpec ReadOutputs(FieldReader r)
    {
        var o = new OutputsSpec(
            r.Bool("obj") ?? true, r.Bool("png") ?? true, r.Bool("svg") ?? true, r.Bool("dxf") ?? true,
            r.Bool("pdf") ?? true, r.Bool("stl") ?? false, r.Bool("report") ?? true);
        r.RejectUnknown();
        return o;
    }

    private static JobError Missing(FieldReader r, string name, string choices) =>
        new(r.PathOf(name), $"missing; choose one of {choices}");

    private static string Names(IEnumerable<CatalogEntry> entries) => string.Join(", ", entries.Select(e => e.Name));

    private static string Suggest(string value, IEnumerable<string> choices)
    {
        string? near = EditDistance.Nearest(value, choices);
        return near is null ? "" : $" (did you mean \"{near}\"?)";
    }

    private static void CheckChoice(string path, string value, IEnumerable<string> choices, string prefix = "")
    {
        var list = choices.ToList();
        if (list.Contains(value, StringComparer.Ordinal)) return;
        string? near = EditDistance.Nearest(value, list);
        string hint = near is null ? "" : $"did you mean \"{near}\"? ";
        throw new JobError(path, $"{prefix}{hint}must be one of {string.Join(", ", list)} (got \"{value}\")");
    }

    /// <summary>Largest footprint span accepted, metres (a city district, not a continent).</summary>
    public const double MaxFootprintMetres = 100_000;

    /// <summary>Smallest footprint span accepted, metres.</summary>
    public const double MinFootprintMetres = 0.001;

    private static void Positive(string path, double? v, string what, bool required)
    {
        if (v is null)
        {
            if (required) throw new JobError(path, $"missing; must be a positive {what}");
            return;
        }
        if (!(v > 0)) throw new JobError(path, $"must be a positive {what} (got {Format(v.Value)})");
    }

    private static void NonNegative(string path, double? v, string what, bool required)
    {
        if (v is null)
        {
            if (required) throw new JobError(path, $"missing; must be a {what} >= 0");
            return;
        }
        if (!(v >= 0)) throw new JobError(path, $"must be a {what} >= 0 (got {Format(v.Value)})");
    }

    private static void Angle(string path, double v)
    {
        if (!(v >= 0 && v <= 180)) throw new JobError(path, $"must be an angle from 0 to 180 degrees (got {Format(v)})");
    }
}
