namespace Tessel.Core.Pipeline;

/// <summary>The fit could not go on: its linear systems lost positive definiteness or produced
/// non-finite numbers. Reported like a fit that did not converge, never as a crash.</summary>
public sealed class FitBreakdownError(string message, Exception inner) : Exception(message, inner);
