using Tessel.Cli;

namespace Tessel.Tests.Cli;

/// <summary>Runs the command line in this process with captured standard output and error.</summary>
internal static class InProcessCli
{
    public static (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = Program.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }
}
