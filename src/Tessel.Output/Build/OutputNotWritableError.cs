namespace Tessel.Output.Build;

/// <summary>The output folder cannot be created or written; the command line maps this to its own
/// exit code. The message is one line naming the folder.</summary>
public sealed class OutputNotWritableError(string folder, string reason, Exception? inner = null)
    : Exception($"{folder}: output folder is not writable ({reason}); choose another with --out", inner)
{
    /// <summary>The folder that could not be written.</summary>
    public string Folder { get; } = folder;
}
