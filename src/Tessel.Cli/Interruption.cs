using System.Runtime.InteropServices;

namespace Tessel.Cli;

/// <summary>Ctrl-C (SIGINT) and SIGTERM. Before the write phase nothing is on disk, so the process
/// says so in one line and exits at once; during the write phase the signal only cancels the
/// build's token, and the writer removes its staging folder before the command exits.</summary>
internal sealed class Interruption : IDisposable
{
    private readonly CancellationTokenSource _cancel = new();
    private readonly Lock _gate = new();
    private readonly TextWriter _stderr;
    private readonly List<PosixSignalRegistration> _registrations = new();
    private bool _writing;

    private Interruption(TextWriter stderr) => _stderr = stderr;

    /// <summary>Cancelled by the first signal.</summary>
    public CancellationToken Token => _cancel.Token;

    /// <summary>Handles SIGINT and SIGTERM for the life of the returned object.</summary>
    public static Interruption Install(TextWriter stderr)
    {
        var i = new Interruption(stderr);
        foreach (var signal in new[] { PosixSignal.SIGINT, PosixSignal.SIGTERM })
            i._registrations.Add(PosixSignalRegistration.Create(signal, i.OnSignal));
        return i;
    }

    /// <summary>Marks the write phase: a signal inside it is left to the writer.</summary>
    public IDisposable Writing()
    {
        lock (_gate) _writing = true;
        return new Scope(this);
    }

    private void OnSignal(PosixSignalContext context)
    {
        context.Cancel = true;
        lock (_gate)
        {
            if (_cancel.IsCancellationRequested) return;
            _cancel.Cancel();
            if (_writing) return;
            _stderr.WriteLine("tessel: interrupted; nothing was written");
            _stderr.Flush();
            Environment.Exit(ExitCodes.Interrupted);
        }
    }

    public void Dispose()
    {
        foreach (var r in _registrations) r.Dispose();
        _cancel.Dispose();
    }

    private sealed class Scope(Interruption owner) : IDisposable
    {
        public void Dispose()
        {
            lock (owner._gate) owner._writing = false;
        }
    }
}
