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
        : base($"{OneLine(where)}: {OneLine(problem)}", inner)
    {
        Where = OneLine(where);
        Problem = OneLine(problem);
    }

    /// <summary>Messages quote user text (a kind, a name, a formula); control characters and line
    /// separators in it are written as escapes so that the error stays one line.</summary>
    private static string OneLine(string s)
    {
        if (!s.Any(IsBreaking)) return s;
        var sb = new System.Text.StringBuilder(s.Length + 8);
        foreach (char c in s)
        {
            if (!IsBreaking(c)) sb.Append(c);
            else sb.Append(c switch { '\n' => "\\n", '\r' => "\\r", '\t' => "\\t", _ => $"\\u{(int)c:x4}" });
        }
        return sb.ToString();
    }

    private static bool IsBreaking(char c) => char.IsControl(c) || c is '\u2028' or '\u2029';
}
