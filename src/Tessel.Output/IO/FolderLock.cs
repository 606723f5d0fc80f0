using System.Security.Cryptography;
using System.Text;

namespace Tessel.Output.IO;

/// <summary>An exclusive lock on one output folder, held while a build writes it. The lock is a file
/// in the system temporary folder named after the folder's absolute path, opened exclusively: .NET
/// takes an advisory flock(2) on it, which the kernel drops when the holder exits or is killed, so
/// a crashed build never leaves the folder locked.</summary>
/// <remarks>The lock file lives outside the output folder because the folder itself is replaced whole
/// by each build, and outside its parent so that a user's folder gains no stray file. It is never
/// deleted: removing a lock file while another process waits on it lets two holders in.</remarks>
public sealed class FolderLock : IDisposable
{
    private readonly FileStream _stream;

    private FolderLock(FileStream stream) => _stream = stream;

    /// <summary>The lock file for <paramref name="folder"/> (an absolute path).</summary>
    public static string LockPath(string folder)
    {
        string hash = Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(folder)))[..20];
        return Path.Combine(Path.GetTempPath(), $"tessel-out-{hash}.lock");
    }

    /// <summary>Takes the lock, retrying for up to <paramref name="wait"/>; null when another process
    /// still holds it then.</summary>
    public static FolderLock? TryAcquire(string folder, TimeSpan wait, CancellationToken cancel = default)
    {
        string path = LockPath(folder);
        var deadline = DateTime.UtcNow + wait;
        while (true)
        {
            try
            {
                var stream = new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
                return new FolderLock(stream);
            }
            catch (IOException) when (DateTime.UtcNow < deadline)
            {
                cancel.WaitHandle.WaitOne(TimeSpan.FromMilliseconds(200));
                cancel.ThrowIfCancellationRequested();
            }
            catch (IOException) { return null; }
        }
    }

    /// <summary>Releases the lock.</summary>
    public void Dispose() => _stream.Dispose();
}
