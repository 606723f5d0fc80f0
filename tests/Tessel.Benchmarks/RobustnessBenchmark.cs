using System.Diagnostics;
using System.Globalization;
using System.Text;
using Tessel.Core.Checks;
using Tessel.Core.Jobs;
using Tessel.Core.Pipeline;
using Tessel.Output.Build;

namespace Tessel.Benchmarks;

/// <summary>`robust` verb: builds a corpus of invented jobs (every target kind, every family the advice
/// calls suited, several cell counts and seeds, default settings otherwise) through the whole pipeline in
/// memory and tabulates how many are buildable, how many finished, time and shape error, and every
/// refusal with its cause.</summary>
/// <remarks>Usage: robust [cells=6,12,20] [seeds=1,2,3] [targets=name,...] [families=name,...] [scale=50] [fit-only] [-v].
/// The jobs are scenarios of our own, never the bundled examples; none of them tunes a default.</remarks>
public static class RobustnessBenchmark
{
    /// <summary>One target of the corpus: a name and the JSON of its target section (lengths in m).</summary>
    private sealed record TargetCase(string Name, string TargetJson);

    private static readonly string[] Families = ["miura", "reverse-curvature", "yoshimura", "waterbomb", "free-triangulated"];

    private static IEnumerable<TargetCase> Targets(string assets) =>
    [
        new("saddle", """{"kind":"hyperbolic-paraboloid","c":9,"rise":2,"footprint":{"width":5,"depth":4}}"""),
        new("steep-saddle", """{"kind":"hyperbolic-paraboloid","c":5,"footprint":{"width":3.5,"depth":3.5}}"""),
        new("cap", """{"kind":"spherical-cap","radius":9,"rise":1.2,"footprint":{"width":5,"depth":5}}"""),
        new("oval-dome", """{"kind":"elliptic-paraboloid","radiusX":7,"radiusY":11,"footprint":{"width":4,"depth":5}}"""),
        new("oval-saddle", """{"kind":"elliptic-paraboloid","radiusX":8,"radiusY":-12,"footprint":{"width":4.5,"depth":4}}"""),
        new("wave", """{"kind":"sinusoidal-wave","amplitude":0.2,"wavelength":4.5,"footprint":{"width":5,"depth":3}}"""),
        new("vault", """{"kind":"cylinder","radius":3.5,"rise":1.5,"footprint":{"width":6,"depth":4}}"""),
        new("plane", """{"kind":"plane","rise":0.5,"footprint":{"width":3,"depth":2}}"""),
        new("saddle-bump", """{"kind":"formula","formula":"0.04*(x^2 - y^2) + 0.35*exp(-(x^2 + y^2)/1.5)","footprint":{"width":5,"depth":5}}"""),
        new("terrain", $$"""{"kind":"height-map","image":"{{Path.Combine(assets, "terrain.png")}}","imageWidth":6,"imageDepth":4,"minHeight":0,"maxHeight":0.6}"""),
        new("ring-mesh", $$"""{"kind":"mesh","mesh":"{{Path.Combine(assets, "ring-sector.obj")}}"}"""),
        new("hex-saddle", """{"kind":"hyperbolic-paraboloid","c":10,"footprint":{"corners":[[2.4,0],[1.2,2.1],[-1.2,2.1],[-2.4,0],[-1.2,-2.1],[1.2,-2.1]]}}"""),
    ];

    /// <summary>One build's outcome.</summary>
    /// <param name="CellsUsed">The cells the build ran with when the tool changed the job's (e.g. "12 x 12"), else empty.</param>
    /// <param name="BoundsHeld">A buildable result with no crease under the minimum crease and no fold outside the
    /// fold-angle bounds (the whole pipeline's checks); fit-only runs count the fit's own bound rows.</param>
    private sealed record Outcome(string Job, string Target, string Family, int Cells, int Seed, string Status,
        bool Finished, double Seconds, double RmsMm, double MaxResidual, int Steps, string Cause, string CellsUsed = "", bool BoundsHeld = false);

    public static void Run(string[] args)
    {
        int[] cells = Ints(Option(args, "cells") ?? "6,12,20");
        int[] seeds = Ints(Option(args, "seeds") ?? "1,2,3");
        Scale = Option(args, "scale") ?? "50";
        var onlyTargets = Option(args, "targets")?.Split(',');
        var onlyFamilies = Option(args, "families")?.Split(',');
        bool verbose = args.Contains("-v");
        FitOnly = args.Contains("fit-only");
        Verbose = verbose;
        string assets = Path.Combine(Path.GetTempPath(), "tessel-robustness-assets");
        Directory.CreateDirectory(assets);
        RobustnessAssets.Write(assets);

        var outcomes = new List<Outcome>();
        foreach (var target in Targets(assets))
        {
            if (onlyTargets is not null && !onlyTargets.Contains(target.Name)) continue;
            foreach (var family in Families)
            {
                if (onlyFamilies is not null && !onlyFamilies.Contains(family)) continue;
                if (!Suited(target, family, assets)) continue;
                foreach (int n in cells)
                    foreach (int seed in seeds)
                    {
                        var o = Build(target, family, n, seed, assets);
                        outcomes.Add(o);
                        Console.WriteLine(FormattableString.Invariant(
                            $"{o.Job,-40} {o.Status,-12} {(o.Finished ? "finished" : "        ")} {o.Seconds,7:F1} s  rms {o.RmsMm,8:F2} mm  resid {o.MaxResidual,8:E1}  steps {o.Steps,4}  {(o.BoundsHeld ? "bounds held" : "BOUNDS MISSED"),-13} {(o.CellsUsed.Length > 0 ? "ran " + o.CellsUsed : ""),-14} {o.Cause}"));
                    }
            }
        }
        Summarise(outcomes);
    }

    /// <summary>Whether the advice calls the family suited to the target (the corpus takes only those).</summary>
    private static bool Suited(TargetCase target, string family, string assets)
    {
        try
        {
            var job = Load(target, family, 6, 1, assets);
            var t = TargetStage.Run(job, Tessel.Output.IO.HeightMapImage.Decode, ProgressReporter.Silent);
            return Tessel.Core.Tessellation.FamilyAdvice.For(family, t.Target).Suits;
        }
        catch (JobError e)
        {
            Console.WriteLine($"{target.Name}/{family}: target refused: {e.Message}");
            return true; // a refused target is counted as a refusal, not skipped
        }
    }

    private static Job Load(TargetCase target, string family, int cells, int seed, string assets)
    {
        string json = "{\"name\":\"" + $"{target.Name}-{family}-{cells}-s{seed}" + "\",\"seed\":" + seed
            + ",\"target\":" + target.TargetJson
            + ",\"tessellation\":{\"family\":\"" + family + "\",\"cellsX\":" + cells + ",\"cellsY\":" + cells + "}"
            + ",\"fabrication\":{\"scale\":" + Scale + ",\"sheet\":{\"name\":\"A1\"}}}";
        return JobLoader.Parse(json, "robustness corpus", assets);
    }

    private static bool FitOnly, Verbose;
    /// <summary>n of the corpus's model scale 1:n (scale=N; 50 unless given).</summary>
    private static string Scale = "50";

    /// <summary>Stages up to the fit only (fast turnaround while working on the fit); -v prints its steps.</summary>
    private static Outcome FitOnlyBuild(TargetCase target, string family, int cells, int seed, string assets, string name, Stopwatch clock)
    {
        var job = Load(target, family, cells, seed, assets);
        var t = TargetStage.Run(job, Tessel.Output.IO.HeightMapImage.Decode, ProgressReporter.Silent);
        var tess = TessellationStage.Run(job, t.Target, ProgressReporter.Silent);
        var fit = FitStage.Run(job, tess.Pattern!, t.Target, Verbose ? new ProgressReporter(Console.Out) : ProgressReporter.Silent, tess.DrapeOn, tess.Coarser).Fit;
        if (Verbose)
            foreach (var h in fit.History)
                Console.WriteLine($"  {h.Index,4} {h.Phase,-20} obj {h.Objective:E3} rms {h.ShapeRms:E3} P {h.MaxPlanarity:E2} K {h.MaxKawasaki:E2} D {h.MaxDevelopabilityExcess:E2} B {h.MaxBoundViolation:E2} {(h.Accepted ? "" : "rej")}");
        bool buildable = fit.Residuals.MaxConstraintViolation <= job.Fitting.Tolerance;
        return new Outcome(name, target.Name, family, cells, seed, buildable ? "buildable" : "unbuildable", fit.Converged, clock.Elapsed.TotalSeconds,
            fit.Shape.Rms * 1e3, fit.Residuals.MaxConstraintViolation, fit.History.Count, fit.StopReason + (fit.Adjustments.Count > 0 ? "; " + string.Join("; ", fit.Adjustments) : ""),
            tess.LengthRepair is { CellsX: int ux, CellsY: int uy } ? $"{ux} x {uy}" : "", buildable);
    }

    private static Outcome Build(TargetCase target, string family, int cells, int seed, string assets)
    {
        string name = $"{target.Name}/{family}/{cells}/s{seed}";
        var clock = Stopwatch.StartNew();
        try
        {
            if (FitOnly) return FitOnlyBuild(target, family, cells, seed, assets, name, clock);
            var job = Load(target, family, cells, seed, assets);
            var result = BuildPipeline.Run(job, Tessel.Output.IO.HeightMapImage.Decode, ProgressReporter.Silent);
            // Mapped to files too, so that a writer's internal error counts as one.
            BuildRunner.Map(result, ProgressReporter.Silent);
            var fit = result.Fit.Fit;
            string status = result.Problem is null ? "buildable" : "unbuildable";
            var used = result.Job.Tessellation;
            bool held = result.Problem is null && result.Checks is { ShortCreaseCount: 0, FoldBounds.Violations: 0 };
            return new Outcome(name, target.Name, family, cells, seed, status, fit.Converged, clock.Elapsed.TotalSeconds,
                fit.Shape.Rms * 1e3, MaxResidual(result), fit.History.Count, result.Problem ?? "",
                used.CellsX != cells || used.CellsY != cells ? $"{used.CellsX} x {used.CellsY}" : "", held);
        }
        catch (JobError e) { return new Outcome(name, target.Name, family, cells, seed, "refused", false, clock.Elapsed.TotalSeconds, double.NaN, double.NaN, 0, e.Message); }
        catch (FitBreakdownError e) { return new Outcome(name, target.Name, family, cells, seed, "breakdown", false, clock.Elapsed.TotalSeconds, double.NaN, double.NaN, 0, e.Message); }
        catch (Exception e) { return new Outcome(name, target.Name, family, cells, seed, "INTERNAL", false, clock.Elapsed.TotalSeconds, double.NaN, double.NaN, 0, $"{e.GetType().Name}: {e.Message} {e.StackTrace?.Split('\n').FirstOrDefault()?.Trim()}"); }
    }

    /// <summary>The largest residual the summary reports for the fit: developability excess, Kawasaki,
    /// planarity, and bound violations including folds of the fitted geometry outside the fold-angle bounds.</summary>
    private static double MaxResidual(PipelineResult result)
    {
        var (fit, bounds) = (result.Fit.Fit, result.Job.Fitting.Bounds);
        var folds = FoldRoles.Bounds(fit.Mesh, Math.Max(bounds.MinFoldAngleDeg, 0), bounds.MaxFoldAngleDeg, result.Job.Fitting.Tolerance);
        double m = 0;
        foreach (double d in new[] { fit.Residuals.MaxDevelopabilityExcess, fit.Residuals.MaxKawasaki, fit.Residuals.MaxPlanarity,
                     Math.Max(fit.Residuals.MaxBoundViolation, folds.MaxViolationRad) })
            m = Math.Max(m, d);
        return m;
    }

    private static void Summarise(List<Outcome> all)
    {
        if (all.Count == 0) return;
        Console.WriteLine();
        Console.WriteLine("| group | jobs | buildable | bounds held | finished | fewer cells | median time (s) | p95 time (s) | median RMS (mm) | internal errors |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|");
        void Row(string label, IReadOnlyList<Outcome> os)
        {
            if (os.Count == 0) return;
            var times = os.Select(o => o.Seconds).Order().ToArray();
            var rms = os.Where(o => o.Status == "buildable").Select(o => o.RmsMm).Order().ToArray();
            Console.WriteLine(FormattableString.Invariant(
                $"| {label} | {os.Count} | {os.Count(o => o.Status == "buildable")} ({100.0 * os.Count(o => o.Status == "buildable") / os.Count:F0} %) | {os.Count(o => o.BoundsHeld)} | {os.Count(o => o.Finished)} ({100.0 * os.Count(o => o.Finished) / os.Count:F0} %) | {os.Count(o => o.CellsUsed.Length > 0)} | {Quantile(times, 0.5):F1} | {Quantile(times, 0.95):F1} | {(rms.Length > 0 ? Quantile(rms, 0.5).ToString("F2", CultureInfo.InvariantCulture) : "-")} | {os.Count(o => o.Status == "INTERNAL")} |"));
        }
        Row("all", all);
        foreach (var g in all.GroupBy(o => o.Family)) Row(g.Key, g.ToList());
        foreach (var g in all.GroupBy(o => o.Target)) Row(g.Key, g.ToList());
        foreach (var g in all.GroupBy(o => o.Cells)) Row($"{g.Key} x {g.Key} cells", g.ToList());
        Console.WriteLine();
        foreach (var o in all.Where(o => o.Status != "buildable"))
            Console.WriteLine($"- {o.Job}: {o.Status}: {o.Cause}");
    }

    private static double Quantile(double[] sorted, double q) => sorted.Length == 0 ? double.NaN : sorted[Math.Min(sorted.Length - 1, (int)Math.Ceiling(q * sorted.Length) - 1 < 0 ? 0 : (int)Math.Ceiling(q * sorted.Length) - 1)];
    private static int[] Ints(string s) => s.Split(',').Select(x => int.Parse(x, CultureInfo.InvariantCulture)).ToArray();
    private static string? Option(string[] args, string name) =>
        args.FirstOrDefault(a => a.StartsWith(name + "=", StringComparison.Ordinal)) is string s ? s[(name.Length + 1)..] : null;
}
