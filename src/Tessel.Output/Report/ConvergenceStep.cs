namespace Tessel.Output.Report;

/// <summary>One iteration of the constrained least-squares solver as the report plots it.</summary>
/// <param name="Iteration">Step number over the whole fit, 0 for the starting point, in the order the steps ran.</param>
/// <param name="Objective">Value of the least-squares objective (dimensionless or m^2, as the solver reports it; must be &gt; 0 to plot on a log axis).</param>
/// <param name="MaxResidual">Largest absolute constraint residual (must be &gt; 0 to plot on a log axis).</param>
/// <param name="StartsRun">The first step of a further solver run of the same fit (a continuation stage, a
/// refit or a restart), which starts from where the previous run left the pattern or from a new start.</param>
public readonly record struct ConvergenceStep(int Iteration, double Objective, double MaxResidual, bool StartsRun = false);
