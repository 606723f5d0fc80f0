namespace Tessel.Core.Pipeline;

/// <summary>A stage's numbers broke down: a linear system lost positive definiteness, became singular or
/// produced non-finite values, or the model it was given is degenerate. Reported as a one-line error
/// that names the stage and the cause, never as a crash.</summary>
/// <param name="stage">The pipeline stage ("fit", "unfold", "checks").</param>
public class StageBreakdownError(string stage, string message, Exception inner) : Exception(message, inner)
{
    public string Stage { get; } = stage;
}

/// <summary>The fit could not go on: its linear systems lost positive definiteness or produced
/// non-finite numbers. Reported like a fit that did not converge, never as a crash.</summary>
public sealed class FitBreakdownError(string message, Exception inner) : StageBreakdownError("fit", message, inner);
