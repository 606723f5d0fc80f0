namespace Tessel.Cli;

/// <summary>The process exit codes, in one place (README section "Errors and exit codes" lists them).</summary>
public static class ExitCodes
{
    /// <summary>Everything worked.</summary>
    public const int Ok = 0;
    /// <summary>Bad input or usage: job file, input files or command-line options; one line on stderr says which and how to fix it.</summary>
    public const int BadInput = 1;
    /// <summary>The model could not be finished: the fit did not converge and --accept-unconverged was not given,
    /// a stage broke down numerically (the line names it), or the flat layout overlaps itself and no sheets were written.</summary>
    public const int NotConverged = 2;
    /// <summary>The output folder could not be created or written.</summary>
    public const int OutputNotWritable = 3;
    /// <summary>A bug in Tessel: please report it with the job file.</summary>
    public const int InternalError = 4;
    /// <summary>Stopped by Ctrl-C (SIGINT) or SIGTERM; the output folder is as it was (128 + SIGINT's number 2, the shells' convention).</summary>
    public const int Interrupted = 130;
}
