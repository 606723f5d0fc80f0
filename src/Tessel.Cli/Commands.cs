using System.CommandLine;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Core.Targets;
using Tessel.Output.Build;
using Tessel.Output.IO;

namespace Tessel.Cli;

/// <summary>The verbs and their options. Each action only parses, calls Core/Output, and prints.</summary>
internal static class Commands
{
    public static RootCommand Root(TextWriter stdout, TextWriter stderr, Interruption? interruption = null)
    {
        var root = new RootCommand("Tessel fits a foldable crease tessellation to a curved surface and lays it out as fabrication sheets.");
        root.Add(Build(stdout, stderr, interruption));
        root.Add(Scaffold(stdout));
        root.Add(CatalogVerb(stdout));
        root.Add(Validate(stdout));
        return root;
    }

    /// <summary>An empty path ("") names no file: refused while parsing, as a usage error.</summary>
    private static void NotEmpty(Argument<string?> argument) => argument.Validators.Add(r =>
    {
        if (r.Tokens.Count > 0 && string.IsNullOrWhiteSpace(r.Tokens[0].Value))
            r.AddError($"the {argument.Name} argument is empty; give the path of a job file");
    });

    private static void NotEmpty(Option<string?> option, string what) => option.Validators.Add(r =>
    {
        if (r.Tokens.Count > 0 && string.IsNullOrWhiteSpace(r.Tokens[0].Value))
            r.AddError($"{option.Name} is empty; give the {what}");
    });

    private static Command Build(TextWriter stdout, TextWriter stderr, Interruption? interruption)
    {
        var job = new Argument<string?>("job")
        {
            Description = "Job file (JSON with comments). Leave out to build the bundled demo, a saddle canopy.",
            Arity = ArgumentArity.ZeroOrOne,
        };
        var outDir = new Option<string?>("--out")
        {
            Description = "Folder to write into (created if missing). Default: output/<job name> under the current folder.",
            HelpName = "DIR",
        };
        NotEmpty(job);
        NotEmpty(outDir, "folder to write into");
        var quiet = new Option<bool>("--quiet") { Description = "Print no progress lines, only the result and errors." };
        var seed = new Option<int?>("--seed")
        {
            Description = "Seed for random choices, overriding the job's seed and fitting.seed.",
            HelpName = "N",
            CustomParser = r =>
            {
                string text = r.Tokens.Count > 0 ? r.Tokens[0].Value : "";
                if (int.TryParse(text, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out int n)) return n;
                r.AddError($"--seed must be a whole number >= 0, e.g. --seed 7 (got \"{text}\")");
                return null;
            },
        };
        var accept = new Option<bool>("--accept-unconverged") { Description = "Write outputs even when the fit does not converge." };
        var cmd = new Command("build", "Build a job: target, tessellation, fit, checks, sheets; write every output file.")
        {
            job, outDir, quiet, seed, accept,
        };
        cmd.SetAction(r =>
        {
            string? path = r.GetValue(job);
            var loaded = path is null
                ? JobLoader.Parse(DemoJob.Text(), "saddle-canopy.json (bundled demo)", Directory.GetCurrentDirectory())
                : JobLoader.Load(path);
            if (r.GetValue(seed) is int s)
            {
                if (s < 0) throw new JobError("--seed", $"must be a whole number >= 0 (got {s})");
                loaded = loaded with { Seed = s, Fitting = loaded.Fitting with { Seed = s } };
            }
            if (r.GetValue(accept)) loaded = loaded with { Fitting = loaded.Fitting with { AcceptUnconverged = true } };
            string folder = r.GetValue(outDir) ?? Path.Combine(Directory.GetCurrentDirectory(), "output", loaded.Name);
            OutputFolder.CheckTarget(folder);
            // A status line rewritten in place only where a person watches a terminal; logs get plain lines.
            bool live = ReferenceEquals(stderr, Console.Error) && !Console.IsErrorRedirected
                && Environment.GetEnvironmentVariable("TERM") is not "dumb";
            var progress = r.GetValue(quiet) ? ProgressReporter.Silent : new ProgressReporter(stderr, live);
            BuildOutput output;
            BuildResult result;
            var ticker = new Timer(_ => progress.Tick(), null, 1000, 1000);
            try
            {
                output = BuildRunner.Collect(loaded, progress);
                using (interruption?.Writing())
                    result = BuildRunner.Write(output, loaded, folder, progress, interruption?.Token ?? default);
            }
            finally
            {
                // Wait for a tick in flight, so that no status line follows the result.
                using var stopped = new ManualResetEvent(false);
                if (ticker.Dispose(stopped)) stopped.WaitOne();
                progress.Finish();
            }
            if (interruption?.Token.IsCancellationRequested == true)
            {
                stderr.WriteLine($"tessel: interrupted after the new build was already in place in {result.Folder}");
                return ExitCodes.Interrupted;
            }
            if (output.Terminal is not null && !r.GetValue(quiet)) stdout.WriteLine(output.Terminal.TrimEnd('\n'));
            if (output.Problem is not null)
            {
                stderr.WriteLine($"tessel: {output.Problem}");
                return ExitCodes.NotConverged;
            }
            stdout.WriteLine($"built {loaded.Name}: {result.Files.Count} files in {result.Folder}");
            return ExitCodes.Ok;
        });
        return cmd;
    }

    private static Command Scaffold(TextWriter stdout)
    {
        var target = new Option<string>("--target")
        {
            Description = "Target kind: " + string.Join(", ", Catalog.TargetKinds.Select(k => k.Name)) + ".",
            Required = true,
            HelpName = "KIND",
        };
        var family = new Option<string>("--family")
        {
            Description = "Tessellation family: " + string.Join(", ", Catalog.Families.Select(k => k.Name)) + ".",
            Required = true,
            HelpName = "FAMILY",
        };
        var outFile = new Option<string?>("--out")
        {
            Description = "File to write. Default: <kind>-<family>.json in the current folder. Never overwrites.",
            HelpName = "FILE",
        };
        NotEmpty(outFile, "job file to write");
        var cmd = new Command("scaffold", "Write a commented, valid starting job file for a target kind and family.")
        {
            target, family, outFile,
        };
        cmd.SetAction(r =>
        {
            string kind = r.GetRequiredValue(target), fam = r.GetRequiredValue(family);
            string text = JobScaffold.Text(kind, fam);
            RefuseUnsuited(text, kind, fam);
            string path = Path.GetFullPath(r.GetValue(outFile) ?? $"{kind}-{fam}.json");
            if (File.Exists(path) || Directory.Exists(path))
                throw new JobError(path, "already exists; scaffold never overwrites, so choose another --out or move the file");
            string? dir = Path.GetDirectoryName(path);
            try
            {
                if (dir is not null) Directory.CreateDirectory(dir);
                AtomicFile.Write(path, System.Text.Encoding.UTF8.GetBytes(text));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw new OutputNotWritableError(dir ?? path, e.Message, e);
            }
            stdout.WriteLine($"wrote {path}");
            // Height-map and mesh jobs name an input file: write an invented example beside the job
            // (never over an existing file) so that the scaffold builds as written.
            if (ScaffoldInputs.For(kind) is var (name, bytes))
            {
                string input = Path.Combine(dir ?? ".", name);
                if (File.Exists(input)) stdout.WriteLine($"kept {input} (the job names it)");
                else
                {
                    try { AtomicFile.Write(input, bytes); }
                    catch (Exception e) when (e is IOException or UnauthorizedAccessException)
                    {
                        throw new OutputNotWritableError(dir ?? input, e.Message, e);
                    }
                    stdout.WriteLine($"wrote {input} (an invented example input; replace it with your own)");
                }
            }
            return ExitCodes.Ok;
        });
        return cmd;
    }

    private static Command CatalogVerb(TextWriter stdout)
    {
        var what = new Argument<string>("list") { Description = "targets, families, materials or sheets." };
        string[] lists = ["targets", "families", "materials", "sheets"];
        what.Validators.Add(r =>
        {
            string given = r.Tokens.Count > 0 ? r.Tokens[0].Value : "";
            if (lists.Contains(given, StringComparer.Ordinal)) return;
            string? near = EditDistance.Nearest(given, lists);
            r.AddError($"catalog has no list '{given}'; {(near is null ? "" : $"did you mean '{near}'? ")}choose targets, families, materials or sheets");
        });
        var cmd = new Command("catalog", "List what a job can name: target kinds, tessellation families, materials or sheet sizes.") { what };
        cmd.SetAction(r =>
        {
            IEnumerable<CatalogEntry> entries = r.GetRequiredValue(what) switch
            {
                "targets" => Catalog.TargetKinds,
                "families" => Catalog.Families,
                "materials" => Catalog.Materials,
                _ => Tessel.Core.Sheets.SheetSizes.All.Select(s => new CatalogEntry(s.Name,
                    $"{Mm(s.WidthMm)} x {Mm(s.HeightMm)} mm{SizeSource(s.Name)}")),
            };
            var list = entries.ToList();
            int w = list.Max(e => e.Name.Length);
            foreach (var e in list) stdout.WriteLine($"{e.Name.PadRight(w)}  {e.Summary}");
            return ExitCodes.Ok;
        });
        return cmd;
    }

    private static string Mm(double v) => v.ToString("0.#", System.Globalization.CultureInfo.InvariantCulture);

    private static Command Validate(TextWriter stdout)
    {
        var job = new Argument<string?>("job") { Description = "Job file to check." };
        NotEmpty(job);
        var cmd = new Command("validate", "Check a job file: fields, target inputs, and that the target is defined over the whole footprint. Writes nothing.")
        {
            job,
        };
        cmd.SetAction(r =>
        {
            var loaded = JobLoader.Load(r.GetValue(job)!);
            var target = TargetFactory.Build(loaded.Target, loaded.BaseDirectory, HeightMapImage.Decode);
            var tessellation = CheckFamilyServes(loaded, target);
            var f = target.Footprint;
            stdout.WriteLine($"OK {loaded.Name}: {target.Description}; footprint {f.Width:0.###} x {f.Depth:0.###} m; family {loaded.Tessellation.Family}");
            // Changes the build will make to the job's cells, said before any fit.
            if (tessellation.LengthRepair is { } lengthened) stdout.WriteLine($"note: {lengthened.Message}");
            if (tessellation.FoldRepair is { } deepened) stdout.WriteLine($"note: {deepened.Message}");
            var sheet = loaded.Fabrication.Sheet;
            if (loaded.Outputs.Png && SheetLimits.PngNote(sheet.WidthMm, sheet.HeightMm) is { } note) stdout.WriteLine($"note: {note}");
            return ExitCodes.Ok;
        });
        return cmd;
    }

    /// <summary>Generates the job's pattern on its target (no fit): a family that cannot make a pattern
    /// there is refused as bad input, naming a family that suits the target.</summary>
    internal static TessellationStageResult CheckFamilyServes(Job job, ITargetSurface target)
    {
        try { return TessellationStage.Run(job, target, ProgressReporter.Silent); }
        catch (JobError e)
        {
            var curvature = Tessel.Core.Tessellation.CurvatureFigures.Sample(target);
            var advice = Tessel.Core.Tessellation.FamilyAdvice.For(job.Tessellation.Family, target, curvature);
            // The family's own advice may call the pairing fine in general; then name the first other
            // family that suits this target's curvature.
            string? better = advice.Better ?? Catalog.Families.Select(f => f.Name)
                .Where(f => f != job.Tessellation.Family)
                .FirstOrDefault(f => Tessel.Core.Tessellation.FamilyAdvice.For(f, target, curvature).Suits);
            throw new JobError(e.Where, e.Problem + (better is null ? "" : $"; the {better} family suits this target (tessellation.family or --family)"));
        }
    }

    /// <summary>Scaffolds only pairs that make a good start: the family must suit the target as the
    /// scaffold describes it (<see cref="Tessel.Core.Tessellation.FamilyAdvice"/>) and make a pattern on it.</summary>
    private static void RefuseUnsuited(string text, string kind, string family)
    {
        string dir = Path.Combine(Path.GetTempPath(), "tessel-scaffold-" + Guid.NewGuid().ToString("N"));
        try
        {
            Directory.CreateDirectory(dir);
            if (ScaffoldInputs.For(kind) is var (name, bytes)) File.WriteAllBytes(Path.Combine(dir, name), bytes);
            var job = JobLoader.Parse(text, $"{kind}-{family}.json", dir);
            var target = TargetFactory.Build(job.Target, dir, HeightMapImage.Decode);
            var advice = Tessel.Core.Tessellation.FamilyAdvice.For(family, target);
            if (!advice.Suits)
                throw new JobError("--family", $"{family} does not suit the {kind} target this scaffold starts from: {advice.Message} Use --family {advice.Better ?? "free-triangulated"} instead");
            CheckFamilyServes(job, target);
        }
        finally { try { Directory.Delete(dir, true); } catch (IOException) { } }
    }

    private static string SizeSource(string name) =>
        name.Length == 2 && name[0] is 'A' or 'B' && char.IsDigit(name[1]) ? " (ISO 216)"
        : name is "Letter" or "Tabloid" ? " (ANSI/ASME Y14.1)"
        : " (laser bed, a typical size: check your machine)";
}
