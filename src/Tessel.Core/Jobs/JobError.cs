namespace Tessel.Core.Jobs;

/// <summary>A problem with a job file or its inputs, reported as one line that names where it is
/// (a field path such as <c>target.radius</c>, or a file) and how to fix it.</summary>
/// <remarks>Everything the user can correct by editing the job or its input files raises this; the
/// command line maps it to the "bad input" exit code.</remarks>
public sealed class JobError : Exception
{
    /// <summary>Field path ("target.radius"), file name or "job"; the text before the colon.</summary>
    public string Where { get; }

    /// <summary>What is wrong and how to fix it, without the location.</summary>
    public string Problem { get; }

    /// <summary>Creates an error located at <paramref name="where"/>.</summary>
    public JobError(string where, string problem, Exception? inner = null)
        : base($"{where}: {problem}", inner)
    {
        Where = where;
        Problem = problem;
    }
}
