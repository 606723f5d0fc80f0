namespace Tessel.Core.Pipeline;

/// <summary>Tells the user what the build is doing, one line per step, on the error stream so that
/// standard output stays clean for results. <see cref="Silent"/> says nothing (--quiet).</summary>
public sealed class ProgressReporter
{
    private readonly TextWriter? _sink;
    private string _stage = "";

    /// <param name="sink">Where lines go (normally standard error); null to stay silent.</param>
    public ProgressReporter(TextWriter? sink) => _sink = sink;

    /// <summary>A reporter that writes nothing.</summary>
    public static ProgressReporter Silent { get; } = new(null);

    /// <summary>True when lines are written somewhere.</summary>
    public bool IsVerbose => _sink is not null;

    /// <summary>Starts a pipeline stage ("target", "fitting", ...); later lines are prefixed with it.</summary>
    public void Stage(string stage, string what)
    {
        _stage = stage;
        _sink?.WriteLine($"[{stage}] {what}");
    }

    /// <summary>A step inside the current stage.</summary>
    public void Step(string message) => _sink?.WriteLine(_stage.Length == 0 ? message : $"[{_stage}]   {message}");

    /// <summary>Progress through a loop; prints at most about ten lines per loop.</summary>
    public void Fraction(string what, int done, int total)
    {
        if (total <= 0) return;
        int every = Math.Max(1, total / 10);
        if (done == total || done % every == 0) Step($"{what} {done}/{total}");
    }
}
