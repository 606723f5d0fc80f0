namespace Tessel.Core.Tessellation;

/// <summary>What a family changed (or could not) so that its generated creases fold at least the job's
/// minimum fold angle (<see cref="TessellationFamily.DeepenShallowFolds"/>).</summary>
/// <param name="Parameters">The parameters to generate with instead, or null when no change within the
/// family's limits reaches the minimum (the fit will then not be buildable, and <paramref name="Message"/>
/// says what to change by hand).</param>
/// <param name="Message">One line for the progress, the summary and the report: the shallowest fold, the
/// bound, and the change made or to make, naming the job fields.</param>
public sealed record ShallowFoldRepair(FamilyParameters? Parameters, string Message);
