using System.Globalization;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>The fit the pipeline runs: the multi-start fit from the drape, and when that ends unbuildable,
/// a continuation that keeps every accepted iterate buildable. It drapes the same pattern on the
/// target's best-fit plane (where a regular pattern is buildable or nearly so), lands it on the
/// constraints there, and then moves the target from that plane toward the real one in stages
/// (<see cref="BlendedSurface"/>), refitting and restoring the constraints at each stage. A stage that
/// does not end buildable is retried with half the step; the last buildable stage is kept, so the result
/// is buildable whenever the plane stage is, even if it could not follow the target all the way.</summary>
/// <remarks>Continuation in the data of a nonlinear problem: Allgower &amp; Georg, Introduction to
/// Numerical Continuation Methods, SIAM 2003, chapter 1 (embedding a hard problem in a family that starts
/// at an easy one) with step-length control by success or failure of the corrector.</remarks>
public static class ContinuationFitter
{
    /// <summary>First step in the blend share s.</summary>
    private const double FirstStep = 0.25;
    /// <summary>A failed stage halves the step; below this the continuation gives up (six halvings).</summary>
    private const double SmallestStep = 1.0 / 256;
    /// <summary>A successful stage lengthens the next step by this factor.</summary>
    private const double StepGrowth = 1.5;
    /// <summary>Iteration cap of one stage as a share of the job's cap: a stage starts buildable and near
    /// its target, so it needs far fewer steps than a fit from the drape.</summary>
    private const double StageShareOfIterations = 0.25;
    /// <summary>Starting augmented-Lagrangian penalty of every stage. A stage starts buildable, so a stiff
    /// penalty only freezes it there: measured on a 12 x 12 Miura saddle, stages at the default 1e6 ended
    /// 16, 51, 106 and 181 mm RMS from their targets at 12, 31, 59 and 100 % (the pattern barely bent),
    /// stages at 1e3 0.2, 2 and 11 mm at 25, 44 and 58 %; the multiplier updates still land each stage.</summary>
    private const double StagePenalty = 1e3;

    /// <param name="drapeOn">Drapes the job's pattern (same family and parameters) on another surface;
    /// null disables the continuation.</param>
    /// <param name="report">Receives one plain line per stage; may be null.</param>
    /// <param name="coarser">The same sheet with fewer cells, for a coarse start on large sheets
    /// (<see cref="CoarseStart"/>); null: every fit starts from the drape.</param>
    public static FitResult Fit(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        Func<ITargetSurface, GeneratedPattern>? drapeOn, Func<ISpdSolver>? solverFactory = null, Action<string>? report = null,
        CoarserSheets? coarser = null)
    {
        // The shortest-crease bound is held back until a buildable pattern exists: measured on 12 x 12
        // Miura saddles at 1:50, holding it from the drape left the fit 2e-4 rad short of the constraints,
        // while the same fit without it landed and the bound then took one short refit.
        var loose = settings with { MinEdgeLengthM = 0 };
        // A drape that is buildable as it is (a closed-form family on its own surface) is fitted from where
        // it lies: perturbing it can only lose that. Measured on a Yoshimura vault with 1.1 deg ring folds:
        // from a start perturbed by 2 % of an edge the fit ended 1.1e-3 rad short after 300 steps, from the
        // drape itself it finished buildable.
        if (loose.StartPerturbation > 0 && EpsilonConstraintFitter.Measure(pattern, target, loose.For(pattern), pattern.Mesh.Positions).Buildable)
            loose = loose with { StartPerturbation = 0, Starts = 1 };
        var coarseStart = CoarseStart.For(pattern, target, loose.For(pattern), coarser, solverFactory ?? EpsilonConstraintFitter.DefaultSolver, report);
        var fit = MultiStartFitter.Fit(pattern, target, CoarseStart.SettingsFrom(loose, coarseStart), solverFactory, coarseStart?.Positions);
        var solvers = solverFactory ?? EpsilonConstraintFitter.DefaultSolver;
        if (!fit.Buildable && drapeOn is not null)
        {
            report?.Invoke($"the fit from the drape is not buildable (largest residual {fit.Residuals.MaxConstraintViolation.ToString("0.##E+0", CultureInfo.InvariantCulture)}); trying a continuation from the best-fit plane");
            var continued = Continue(pattern, target, loose.For(pattern), drapeOn, solvers, report);
            if (continued is { Buildable: true })
                fit = continued with { History = [.. fit.History, .. continued.History], Spread = fit.Spread };
        }
        // No continuation (the family has no buildable state on a plane) or it failed: the unperturbed
        // drape with a doubled step budget, the restart that needs no other geometry.
        bool restartLeft = loose.StartPerturbation > 0;
        if (!fit.Buildable && restartLeft)
        {
            restartLeft = false;
            fit = Restart(pattern, target, loose, fit, solvers, report) ?? fit;
        }
        if (!fit.Buildable) return fit;
        var held = new BandedPattern(pattern, settings, 0);
        if (!pattern.Constraints.HasFlag(FamilyConstraints.FoldSigns))
        {
            var (banded, bands) = HoldFoldBands(pattern, target, settings, fit, solvers, report);
            // A continuation that stopped near its plane leaves many creases just over the drawn-flat
            // tolerance, and no refit may hold them. Measured on a free net of a ring-sector mesh at 20 x 20:
            // the continuation went 3.1 % of the way (109 mm RMS) with 36 folds between 0.5 and 1 deg and every
            // band refit stalled (5e-3 to 6e-4 rad), while the unperturbed drape landed at 29 mm and held them.
            if (bands is null && restartLeft && Restart(pattern, target, loose, banded, solvers, report) is { } restart)
            {
                var (restartBanded, restartBands) = HoldFoldBands(pattern, target, settings, restart, solvers, report);
                if (restartBands is not null) (banded, bands) = (restartBanded, restartBands);
            }
            // Last, a continuation that keeps only stages whose folds are all within the bounds: it stops short
            // of the target, but every state it keeps meets them. Measured on a free net of 6 x 6 cells on an
            // oval saddle (seed 2): the continuation's result had 16 folds between 0.5 and 1 deg, no band refit
            // and no restart held them, and the build was refused.
            if (bands is null && drapeOn is not null
                && Continue(pattern, target, loose.For(pattern), drapeOn, solvers, report, stage => !FoldBands.Candidates(pattern, stage.Mesh, settings).Any()) is { Buildable: true } within)
            {
                report?.Invoke("kept the continuation's last stage whose folds are all within the fold-angle bounds");
                (banded, bands) = (within with
                {
                    History = [.. banded.History, .. within.History],
                    Spread = fit.Spread,
                    Adjustments = [.. within.Adjustments, "no refit held the folds of the fit within the fold-angle bounds; the continuation was run again keeping only stages whose folds are within them"],
                }, new BandedPattern(pattern, settings, 0));
            }
            fit = banded;
            held = bands ?? held;
        }
        return settings.MinEdgeLengthM > 0
            ? HoldShortestCrease(held.Pattern, target, held.Settings.For(pattern), fit, solvers, report)
            : fit;
    }

    /// <summary>The unperturbed drape with twice the steps, after <paramref name="before"/>; null when not buildable.</summary>
    private static FitResult? Restart(GeneratedPattern pattern, ITargetSurface target, FitSettings loose, FitResult before,
        Func<ISpdSolver> solvers, Action<string>? report)
    {
        report?.Invoke("restarting from the unperturbed drape with twice the steps");
        var restart = EpsilonConstraintFitter.Fit(pattern, target, loose.For(pattern) with { StartPerturbation = 0, MaxIterations = 2 * loose.MaxIterations, Starts = 1 }, solvers());
        return restart.Buildable
            ? restart with
            {
                History = [.. before.History, .. restart.History],
                Spread = before.Spread,
                Adjustments = [before.Buildable ? "the fit kept folds outside the fold-angle bounds; it was restarted from the unperturbed drape with twice the steps"
                    : "the fit from the perturbed start was not buildable; it was restarted from the unperturbed drape with twice the steps"],
            }
            : null;
    }

    /// <summary>Refits a buildable result of a family without fold signs whose folds leave the fold-angle
    /// bounds, with each crease held flat or folded within them (<see cref="FoldBands"/>, its assignments in
    /// order), and keeps the first buildable refit. Returns the result and the bands later refits hold: no
    /// bands when none were needed (the result unchanged), null when none could be held (the result with a note).</summary>
    private static (FitResult Fit, BandedPattern? Bands) HoldFoldBands(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        FitResult fit, Func<ISpdSolver> solverFactory, Action<string>? report)
    {
        var history = new List<FitIteration>(fit.History);
        int outside = 0;
        foreach (var banded in FoldBands.Candidates(pattern, fit.Mesh, settings))
        {
            outside = banded.Outside;
            var loose = banded.Settings.For(pattern) with { MinEdgeLengthM = 0, Starts = 1 };
            var refit = EpsilonConstraintFitter.Fit(banded.Pattern, target, loose, solverFactory(), fit.Mesh.Positions);
            history.AddRange(refit.History);
            if (refit.Buildable)
            {
                report?.Invoke($"{outside} fold(s) were outside the fold-angle bounds; refitted with each crease held flat or folded within them");
                return (refit with
                {
                    History = history,
                    Spread = fit.Spread,
                    Adjustments = [.. fit.Adjustments, $"{outside} fold(s) outside fitting.bounds fold angles were set flat or brought within them by a refit"],
                }, banded);
            }
            report?.Invoke($"holding {outside} fold(s) within the fold-angle bounds: a refit was not buildable (largest residual {refit.Residuals.MaxConstraintViolation.ToString("0.##E+0", CultureInfo.InvariantCulture)}, {refit.StopReason})");
        }
        if (outside == 0) return (fit, new BandedPattern(pattern, settings, 0));
        return (fit with { History = history, Adjustments = [.. fit.Adjustments, $"{outside} fold(s) stay outside fitting.bounds fold angles: the pattern could not be kept buildable with them held"] }, null);
    }

    /// <summary>Refits a buildable result whose creases fall below <see cref="FitSettings.MinEdgeLengthM"/>
    /// with that bound held, from the result itself; keeps the first refit that is buildable, else the result
    /// with a note of how many creases stay short.</summary>
    /// <remarks>Three refits, in order. A whole fit with the job's steps (most land here). The constraints
    /// alone, no shape phase: on reverse-curvature sheets the shape phase drifts off at every budget (a 6 x 6
    /// cap at 1:50, 3 short creases: 6.8e-5 rad after 300 steps, 2.6e-5 after 600, 3.1e-5 after 900) while
    /// restoring the constraints alone lands in a few steps, 58.9 mm RMS against 61.7 with the creases short.
    /// A whole fit with twice the steps: on a free net the bound moves the result far off the constraints
    /// and the shape phase needs longer to come back (20 x 20 cells on a ring-sector mesh at 1:50, 26 short
    /// creases: 2.6e-2 after 300 steps, constraints alone 0.26, buildable within 600). The whole fit comes
    /// first because twice its steps are not the same fit: on a 12 x 12 reverse-curvature ring sector the
    /// longer budget ended elsewhere, with facets overlapping in the flat layout.</remarks>
    private static FitResult HoldShortestCrease(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        FitResult fit, Func<ISpdSolver> solverFactory, Action<string>? report)
    {
        int shortBefore = ShortEdges(fit.Mesh, pattern.Mesh, settings.MinEdgeLengthM);
        if (shortBefore == 0) return fit;
        var history = new List<FitIteration>(fit.History);
        FitSettings[] attempts =
        [
            settings with { Starts = 1 },
            settings with { Starts = 1, ConstraintsOnly = true },
            settings with { Starts = 1, MaxIterations = 2 * settings.MaxIterations },
        ];
        foreach (var attempt in attempts)
        {
            var held = EpsilonConstraintFitter.Fit(pattern, target, attempt, solverFactory(), fit.Mesh.Positions);
            history.AddRange(held.History);
            if (held.Buildable)
            {
                report?.Invoke($"{shortBefore} crease(s) were shorter than the minimum crease; refitted with the minimum held{(attempt.ConstraintsOnly ? " (constraints only)" : "")}");
                return held with
                {
                    History = history,
                    Spread = fit.Spread,
                    Adjustments = [.. fit.Adjustments, $"{shortBefore} crease(s) were lengthened to the minimum crease (fitting.bounds.minEdgeLengthMm) by a refit"],
                };
            }
            report?.Invoke($"{shortBefore} crease(s) stay shorter than the minimum crease: a refit holding it was not buildable (largest residual {held.Residuals.MaxConstraintViolation.ToString("0.##E+0", CultureInfo.InvariantCulture)}, {held.StopReason})");
        }
        return fit with { History = history, Adjustments = [.. fit.Adjustments, $"{shortBefore} crease(s) stay shorter than fitting.bounds.minEdgeLengthMm: the pattern could not be kept buildable with them lengthened; use fewer cells or a larger model scale"] };
    }

    /// <summary>Creases (interior edges) of the fitted mesh shorter than the minimum, among those whose draped length reaches it
    /// (a crease already shorter in the drape is held only at its draped length, as in the fit's bound).</summary>
    private static int ShortEdges(CreaseMesh fitted, CreaseMesh draped, double minimum)
    {
        int count = 0;
        for (int e = 0; e < fitted.EdgeCount; e++)
        {
            if (!fitted.IsInterior(e)) continue;
            int a = fitted.EdgeVertices[2 * e], b = fitted.EdgeVertices[2 * e + 1];
            double drapedLength = (draped.Vertex(b) - draped.Vertex(a)).Length;
            double bound = Math.Min(minimum, drapedLength) * (1 - 1e-9);
            if ((fitted.Vertex(b) - fitted.Vertex(a)).Length < bound) count++;
        }
        return count;
    }

    /// <summary>The continuation alone; null when the pattern cannot be draped on the plane with the
    /// same topology, or the plane stage itself is not buildable.</summary>
    /// <param name="accept">A further condition on every kept stage besides buildable (null: none).</param>
    public static FitResult? Continue(GeneratedPattern pattern, ITargetSurface target, FitSettings settings,
        Func<ITargetSurface, GeneratedPattern> drapeOn, Func<ISpdSolver> solverFactory, Action<string>? report = null,
        Func<FitResult, bool>? accept = null)
    {
        var plane = BlendedSurface.BestFitPlane(target);
        GeneratedPattern flat;
        try { flat = drapeOn(new BlendedSurface(target, plane, 0)); }
        catch (ArgumentException) { report?.Invoke("the family has no pattern on a plane to continue from"); return null; }
        if (!SameTopology(flat.Mesh, pattern.Mesh)) { report?.Invoke("the pattern on the plane differs from the drape; no continuation"); return null; }

        var adjustments = new List<string>();
        double penalty = Math.Min(settings.InitialPenalty, StagePenalty);
        var stageSettings = settings with { Starts = 1, InitialPenalty = penalty, MaxIterations = Math.Max(30, (int)(settings.MaxIterations * StageShareOfIterations)) };
        var finalSettings = settings with { Starts = 1, InitialPenalty = penalty };
        var solver = solverFactory();
        var history = new List<FitIteration>();
        // A start that is buildable as draped is kept as it is: fitting it to the plane would pull it
        // toward the flat sheet, where the developability residual has no gradient.
        var landed = EpsilonConstraintFitter.Measure(flat, new BlendedSurface(target, plane, 0), settings, flat.Mesh.Positions);
        if (!landed.Buildable)
        {
            landed = EpsilonConstraintFitter.Fit(flat, new BlendedSurface(target, plane, 0), stageSettings, solver);
            history.AddRange(landed.History);
        }
        if (!landed.Buildable) { report?.Invoke("the pattern could not be made buildable even on the best-fit plane"); return null; }
        if (accept is not null && !accept(landed)) { report?.Invoke("the pattern on the best-fit plane does not meet the condition of this continuation"); return null; }

        double share = 0, step = FirstStep;
        var last = landed;
        while (share < 1 && step >= SmallestStep)
        {
            double next = Math.Min(1, share + step);
            bool final = next == 1;
            var stage = EpsilonConstraintFitter.Fit(flat, final ? target : new BlendedSurface(target, plane, next),
                final ? finalSettings : stageSettings, solver, last.Mesh.Positions);
            history.AddRange(stage.History);
            if (stage.Buildable && (accept is null || accept(stage)))
            {
                share = next; last = stage;
                step = Math.Min(step * StepGrowth, 1 - share);
                report?.Invoke(FormattableString.Invariant($"continuation: {share * 100:0.#} % of the way to the target, buildable, shape RMS {stage.Shape.Rms * 1000:0.##} mm"));
            }
            else
            {
                step /= 2;
                report?.Invoke(FormattableString.Invariant($"continuation: the stage at {next * 100:0.#} % did not stay buildable; halving the step"));
            }
        }
        if (share < 1)
        {
            // Buildable but short of the target: the shape error is measured against the real target.
            adjustments.Add(FormattableString.Invariant($"the pattern follows the target only {share * 100:0.#} % of the way from its best-fit plane (the fit could not stay buildable beyond that)"));
            last = EpsilonConstraintFitter.Measure(flat, target, settings, last.Mesh.Positions) with { StopReason = last.StopReason, Solver = last.Solver };
        }
        adjustments.Insert(0, FormattableString.Invariant($"the fit from the drape was not buildable; it was refitted by continuation from the target's best-fit plane in {history.Count} steps"));
        return last with { History = history, Adjustments = adjustments, Converged = last.Converged && share == 1 };
    }

    private static bool SameTopology(CreaseMesh a, CreaseMesh b)
    {
        if (a.VertexCount != b.VertexCount || a.FaceCount != b.FaceCount || a.EdgeCount != b.EdgeCount) return false;
        for (int f = 0; f < a.FaceCount; f++)
            if (!a.Faces[f].AsSpan().SequenceEqual(b.Faces[f])) return false;
        return true;
    }
}
