using System.Runtime.InteropServices;

namespace ModalChain.Io.Files;

/// <summary>The few POSIX calls .NET does not offer: an atomic exchange of two paths and flushing a folder's entries to disk.</summary>
/// <remarks>
/// Each call is best effort and reports whether it worked; callers keep a documented fallback. Outside Linux (and on a
/// libc or file system without the call) the exchange reports "unsupported" and nothing is touched.
/// </remarks>
public static partial class NativeFileSystem
{
    private const int AtFdCwd = -100;
    private const uint RenameExchange = 2; // linux/fs.h: RENAME_EXCHANGE
    private const int ORdOnly = 0;
    private const int OCloExec = 0x80000; // the same value on x86-64 and arm64

    /// <summary>Swaps <paramref name="first"/> and <paramref name="second"/> (both must exist) in one atomic step: Linux renameat2(RENAME_EXCHANGE).</summary>
    /// <returns>True when swapped; false when the platform, libc or file system does not offer the exchange (nothing changed).</returns>
    /// <exception cref="IOException">The exchange is offered but failed for another reason (nothing changed).</exception>
    public static bool TryExchange(string first, string second)
    {
        if (!OperatingSystem.IsLinux()) return false;
        int result, errno;
        try
        {
            result = renameat2(AtFdCwd, first, AtFdCwd, second, RenameExchange);
            errno = result == 0 ? 0 : Marshal.GetLastPInvokeError();
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
        if (result == 0) return true;
        // ENOSYS: kernel before 3.15; EINVAL: the file system does not support the flag; ENOTSUP/EOPNOTSUPP likewise.
        if (errno is 38 or 22 or 95) return false;
        throw new IOException($"cannot exchange {first} and {second}: {Marshal.GetPInvokeErrorMessage(errno)}");
    }

    /// <summary>Flushes the entries of folder <paramref name="directory"/> (creations, renames) to disk, so a rename survives a power cut.</summary>
    /// <remarks>Best effort: does nothing where the calls are missing; a file's own bytes are flushed by its writer.</remarks>
    public static void SyncDirectory(string directory)
    {
        if (!OperatingSystem.IsLinux()) return;
        try
        {
            var fd = open(directory, ORdOnly | OCloExec);
            if (fd < 0) return;
            _ = fsync(fd);
            _ = close(fd);
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            // no libc to call: the rename is still atomic, only its durability across a power cut is not forced
        }
    }

    [LibraryImport("libc", StringMarshalling = StringMarshalling.Utf8, SetLastError = true)]
    private static partial int renameat2(int olddirfd, string oldpath, int newdirfd, string newpath, uint flags);

    [LibraryImport("libc", StringMarshalling = StringMarshalling.Utf8, SetLastError = true)]
    private static partial int open(string pathname, int flags);

    [LibraryImport("libc", SetLastError = true)]
    private static partial int fsync(int fd);

    [LibraryImport("libc", SetLastError = true)]
    private static partial int close(int fd);
}
