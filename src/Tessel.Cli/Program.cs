using Tessel.Core.Pipeline;
using System.CommandLine;
using Tessel.Core.Jobs;
using Tessel.Output.Build;

namespace Tessel.Cli;

/// <summary>Entry point: parses the command line, runs one verb, maps failures to exit codes.</summary>
public static class Program
{
    /// <summary>Process entry point.</summary>
    public static int Main(string[] args)
    {
        using var interruption = Interruption.Install(Console.Error);
        return Run(args, Console.Out, Console.Error, interruption);
    }

    /// <summary>Runs the command line with the given streams; returns the exit code (<see cref="ExitCodes"/>).</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr) => Run(args, stdout, stderr, null);

    private static int Run(string[] args, TextWriter stdout, TextWriter stderr, Interruption? interruption)
    {
        var root = Commands.Root(stdout, stderr, interruption);
        if (UnknownVerb(root, args) is { } unknown)
        {
            stderr.WriteLine($"tessel: {unknown} (see 'tessel --help')");
            return ExitCodes.BadInput;
        }
        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            stderr.WriteLine($"tessel: {parsed.Errors[0].Message} (see 'tessel --help')");
            return ExitCodes.BadInput;
        }
        return Guard(stderr, () => parsed.Invoke(new InvocationConfiguration
        {
            Output = stdout,
            Error = stderr,
            EnableDefaultExceptionHandler = false,
        }));
    }

    /// <summary>A message naming the first argument when it is neither a verb nor an option, or null.</summary>
    internal static string? UnknownVerb(RootCommand root, string[] args)
    {
        if (args.Length == 0 || args[0].StartsWith('-')) return null;
        var verbs = root.Subcommands.Select(c => c.Name).ToList();
        if (verbs.Contains(args[0], StringComparer.Ordinal)) return null;
        string? near = EditDistance.Nearest(args[0], verbs);
        string hint = near is null ? "" : $"did you mean '{near}'? ";
        return $"unknown command '{args[0]}'; {hint}the commands are {string.Join(", ", verbs)}";
    }

    /// <summary>Runs <paramref name="action"/>, turning known failures into one-line messages and exit codes.</summary>
    internal static int Guard(TextWriter stderr, Func<int> action)
    {
        try
        {
            return action();
        }
        catch (JobError e)
        {
            stderr.WriteLine($"tessel: {e.Message}");
            return ExitCodes.BadInput;
        }
        catch (StageBreakdownError e)
        {
            stderr.WriteLine($"tessel: {e.Message}");
            return ExitCodes.NotConverged;
        }
        catch (OutputNotWritableError e)
        {
            stderr.WriteLine($"tessel: {e.Message}");
            return ExitCodes.OutputNotWritable;
        }
        catch (OutputFolderError e)
        {
            stderr.WriteLine($"tessel: {e.Message}");
            return ExitCodes.OutputNotWritable;
        }
        catch (OperationCanceledException)
        {
            stderr.WriteLine("tessel: interrupted; the output folder was left as it was");
            return ExitCodes.Interrupted;
        }
        catch (Exception e)
        {
            stderr.WriteLine($"tessel: internal error: {e.GetType().Name}: {e.Message.ReplaceLineEndings(" ")} (please report this with your job file)");
            return ExitCodes.InternalError;
        }
    }
}
