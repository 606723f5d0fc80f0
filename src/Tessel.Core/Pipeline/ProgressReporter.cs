using System.Diagnostics;
using System.Globalization;
using Tessel.Core.Fitting;

namespace Tessel.Core.Pipeline;

/// <summary>Tells the user what the build is doing, on the error stream so that standard output stays
/// clean for results. <see cref="Silent"/> says nothing (--quiet).</summary>
/// <remarks>
/// Stage and step lines are always printed. Between them, fit steps and a once-a-second tick keep the
/// user informed: on a terminal (<c>live</c>) as one status line rewritten in place (carriage return and
/// erase-line), otherwise as plain lines, at most one a second, so a log file stays short. A stage that
/// runs long without steps (a large factorisation, the checks, the sheets) still shows its elapsed time.
/// Thread-safe: parallel fit starts report from their own threads.
/// </remarks>
public sealed class ProgressReporter
{
    private readonly TextWriter? _sink;
    private readonly bool _live;
    private readonly Func<TimeSpan> _clock;
    private readonly object _gate = new();
    private string _stage = "";
    private TimeSpan _stageStart, _lastLine = TimeSpan.MinValue;
    private bool _statusShown;
    private FitIteration? _pending;
    private int _maxSteps;
    private readonly List<(int Step, double Residual)> _recent = [];

    /// <param name="sink">Where lines go (normally standard error); null to stay silent.</param>
    /// <param name="live">The sink is a terminal: keep a status line and rewrite it in place.</param>
    /// <param name="clock">Time since some fixed start; a stopwatch unless a test passes a fake.</param>
    public ProgressReporter(TextWriter? sink, bool live = false, Func<TimeSpan>? clock = null)
    {
        _sink = sink;
        _live = live;
        if (clock is null)
        {
            var watch = Stopwatch.StartNew();
            clock = () => watch.Elapsed;
        }
        _clock = clock;
    }

    /// <summary>A reporter that writes nothing.</summary>
    public static ProgressReporter Silent { get; } = new(null);

    /// <summary>True when lines are written somewhere.</summary>
    public bool IsVerbose => _sink is not null;

    /// <summary>Plain (not live) progress lines come at most this often.</summary>
    public static readonly TimeSpan PlainInterval = TimeSpan.FromSeconds(1);

    /// <summary>A stage with nothing new prints a plain "still working" line this often.</summary>
    public static readonly TimeSpan QuietStageInterval = TimeSpan.FromSeconds(10);

    /// <summary>Starts a pipeline stage ("target", "fitting", ...); later lines are prefixed with it.</summary>
    public void Stage(string stage, string what)
    {
        if (_sink is null) return;
        lock (_gate)
        {
            _stage = stage;
            _stageStart = _clock();
            _pending = null;
            _recent.Clear();
            Line($"[{stage}] {what}");
        }
    }

    /// <summary>A step inside the current stage.</summary>
    public void Step(string message)
    {
        if (_sink is null) return;
        lock (_gate) Line(_stage.Length == 0 ? message : $"[{_stage}]   {message}");
    }

    /// <summary>Progress through a loop; prints at most about ten lines per loop.</summary>
    public void Fraction(string what, int done, int total)
    {
        if (total <= 0) return;
        int every = Math.Max(1, total / 10);
        if (done == total || done % every == 0) Step($"{what} {done}/{total}");
    }

    /// <summary>Settings whose fit reports each step here (see <see cref="FitSettings.OnStep"/>).</summary>
    public FitSettings Observe(FitSettings settings)
    {
        if (_sink is null) return settings;
        lock (_gate) _maxSteps = settings.MaxIterations;
        return settings with { OnStep = FitStep };
    }

    /// <summary>One fit step: shown now on a terminal, or kept for the next plain line.</summary>
    public void FitStep(FitIteration step)
    {
        if (_sink is null) return;
        lock (_gate)
        {
            _pending = step;
            double residual = Math.Max(Math.Max(step.MaxPlanarity, step.MaxKawasaki), Math.Max(step.MaxDevelopabilityExcess, step.MaxBoundViolation));
            _recent.Add((step.Index, residual));
            if (_recent.Count > 6) _recent.RemoveAt(0);
            Emit(force: false);
        }
    }

    /// <summary>Called about once a second (by a timer): refreshes the elapsed time on a terminal, prints
    /// a pending fit step, or after <see cref="QuietStageInterval"/> of silence says the stage goes on.</summary>
    public void Tick()
    {
        if (_sink is null) return;
        lock (_gate) Emit(force: true);
    }

    /// <summary>Ends the status line (on a terminal) so that what follows starts on a fresh line.</summary>
    public void Finish()
    {
        if (_sink is null) return;
        lock (_gate) ClearStatus();
    }

    /// <summary>Estimated steps left: the recent steps' rate of decrease of the largest constraint residual
    /// (in decades per step) extrapolated to 1e-10, capped by the steps the settings still allow; null
    /// when the residual is not falling.</summary>
    public static int? EstimateStepsLeft(IReadOnlyList<(int Step, double Residual)> recent, int maxSteps, double tolerance = 1e-10)
    {
        if (recent.Count < 2) return null;
        var (s0, r0) = recent[0];
        var (s1, r1) = recent[^1];
        int cap = Math.Max(0, maxSteps - s1 - 1);
        if (!(r0 > 0 && r1 > 0) || s1 <= s0) return null;
        if (r1 <= tolerance) return Math.Min(cap, 1);
        double decadesPerStep = (Math.Log10(r0) - Math.Log10(r1)) / (s1 - s0);
        if (!(decadesPerStep > 1e-6)) return null;
        double left = Math.Ceiling((Math.Log10(r1) - Math.Log10(tolerance)) / decadesPerStep);
        return (int)Math.Min(cap, left);
    }

    private void Emit(bool force)
    {
        var now = _clock();
        if (_live)
        {
            // Rewriting the status line more than a few times a second only costs terminal time.
            if (!force && _statusShown && now - _lastLine < TimeSpan.FromMilliseconds(200)) return;
            _sink!.Write("\r\u001b[2K" + Status(now));
            _sink.Flush();
            _statusShown = true;
            _lastLine = now;
            return;
        }
        if (now - _lastLine < PlainInterval) return;
        if (_pending is not null)
        {
            _sink!.WriteLine(Status(now));
            _pending = null;
            _lastLine = now;
        }
        else if (force && now - _lastLine >= QuietStageInterval && _stage.Length > 0)
        {
            _sink!.WriteLine(Status(now));
            _lastLine = now;
        }
    }

    private string Status(TimeSpan now)
    {
        string elapsed = Seconds(now - _stageStart);
        string prefix = _stage.Length == 0 ? "" : $"[{_stage}]   ";
        if (_pending is not { } s || _stage != "fit")
            return $"{prefix}working, {elapsed}";
        double residual = _recent.Count > 0 ? _recent[^1].Residual : double.NaN;
        int? left = EstimateStepsLeft(_recent, _maxSteps);
        string rest = left is int n ? $"about {n} step{(n == 1 ? "" : "s")} left" : $"at most {Math.Max(0, _maxSteps - s.Index - 1)} steps left";
        return string.Create(CultureInfo.InvariantCulture,
            $"{prefix}step {s.Index + 1}: largest constraint residual {residual:0.##E+0}, shape RMS {s.ShapeRms * 1000:0.###} mm, {elapsed}, {rest}");
    }

    private static string Seconds(TimeSpan t) => t.TotalSeconds < 100
        ? t.TotalSeconds.ToString("0", CultureInfo.InvariantCulture) + " s"
        : $"{(int)t.TotalMinutes} min {t.Seconds:00} s";

    private void Line(string text)
    {
        ClearStatus();
        _sink!.WriteLine(text);
        _lastLine = _clock();
    }

    private void ClearStatus()
    {
        if (!_statusShown) return;
        _sink!.Write("\r\u001b[2K");
        _statusShown = false;
    }
}
