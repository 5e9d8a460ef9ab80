using System.Runtime.InteropServices;

namespace ModalChain.Io.Files;

/// <summary>Reads the files a model names (the model itself, time tables): regular files only, up to a size limit.</summary>
/// <remarks>
/// A named pipe (FIFO) would block the reader until some other program writes to it, and a device such as
/// /dev/zero never ends; both are refused before the file is opened. On Linux the kind of file is asked of the system
/// (<c>statx</c>, whose layout is the same on every architecture); elsewhere, and where the call is missing, the file
/// is opened directly. Whatever the kind, no more than the limit plus one byte is ever read, so an oversize or endless
/// file costs at most the limit in memory.
/// </remarks>
public static partial class InputFile
{
    /// <summary>The largest model file read, in bytes (64 MiB; a 100,000-mass model written out in full is about 13 MiB).</summary>
    public const long MaximumModelBytes = 64L * 1024 * 1024;

    /// <summary>The largest time table read, in bytes (64 MiB, over a million rows).</summary>
    public const long MaximumTableBytes = 64L * 1024 * 1024;

    /// <summary>Reads the whole file, or returns null with a sentence saying why it was not read.</summary>
    /// <param name="path">The file as the user named it.</param>
    /// <param name="limit">The largest size accepted, in bytes.</param>
    /// <param name="what">What the file is for, as the message names it ("model file", "time table").</param>
    /// <param name="error">Why the file was not read: missing, not a regular file, too large, unreadable.</param>
    public static byte[]? ReadAllBytes(string path, long limit, string what, out string? error)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentOutOfRangeException.ThrowIfNegative(limit);
        error = null;
        if (path.Length == 0)
        {
            error = "no file named (the name is empty)";
            return null;
        }
        if (Directory.Exists(path))
        {
            error = $"'{path}' is a directory; name the {what} itself";
            return null;
        }
        switch (Kind(path, out var size))
        {
            case FileKind.Missing:
                error = "file not found";
                return null;
            case FileKind.Other kind:
                error = $"'{path}' is {kind.Description}, not a regular file; a {what} must be a regular file";
                return null;
        }
        if (size > limit)
        {
            error = TooLarge(size, limit, what);
            return null;
        }
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite, bufferSize: 1, FileOptions.SequentialScan);
            return ReadAtMost(stream, limit, what, out error);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            error = e is FileNotFoundException or DirectoryNotFoundException ? "file not found" : "cannot read the file: " + e.Message;
            return null;
        }
    }

    /// <summary>Reads to the end of <paramref name="stream"/> unless it holds more than <paramref name="limit"/> bytes.</summary>
    internal static byte[]? ReadAtMost(Stream stream, long limit, string what, out string? error)
    {
        error = null;
        var expected = stream.CanSeek ? stream.Length : 0;
        var buffer = new byte[(int)Math.Min(Math.Max(expected + 1, 4096), limit + 1)];
        var filled = 0;
        while (true)
        {
            if (filled == buffer.Length)
            {
                if (buffer.Length > limit)
                {
                    error = TooLarge(null, limit, what);
                    return null;
                }
                Array.Resize(ref buffer, (int)Math.Min(2L * buffer.Length, limit + 1));
            }
            var read = stream.Read(buffer, filled, buffer.Length - filled);
            if (read == 0) break;
            filled += read;
        }
        if (filled > limit)
        {
            error = TooLarge(null, limit, what);
            return null;
        }
        if (filled != buffer.Length) Array.Resize(ref buffer, filled);
        return buffer;
    }

    private static string TooLarge(long? size, long limit, string what) =>
        (size is { } s ? $"the file is {Bytes(s)}" : $"the file holds more than {Bytes(limit)}") +
        $"; a {what} may be at most {Bytes(limit)} (see docs/model-format.md)";

    private static string Bytes(long bytes) => bytes > 0 && bytes % (1024 * 1024) == 0
        ? string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{bytes / (1024 * 1024)} MiB")
        : string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{bytes:N0} bytes");

    private abstract record FileKind
    {
        public sealed record Regular : FileKind;
        public sealed record Missing : FileKind;
        public sealed record Unknown : FileKind;
        public sealed record Other(string Description) : FileKind;
    }

    // statx(2): struct statx has stx_mode (u16) at byte 28 and stx_size (u64) at byte 40 on every architecture.
    private const int AtFdCwd = -100;
    private const uint StatxType = 0x1;
    private const uint StatxSize = 0x200;
    private const int ENOENT = 2;
    private const int ENOTDIR = 20;

    [LibraryImport("libc", EntryPoint = "statx", SetLastError = true, StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Statx(int directory, string path, int flags, uint mask, [Out] byte[] buffer);

    /// <summary>The kind of file at <paramref name="path"/> (following links) and its size when the system says.</summary>
    private static FileKind Kind(string path, out long size)
    {
        size = 0;
        if (!OperatingSystem.IsLinux()) return new FileKind.Unknown();
        var buffer = new byte[256];
        try
        {
            if (Statx(AtFdCwd, path, 0, StatxType | StatxSize, buffer) != 0)
                return Marshal.GetLastPInvokeError() is ENOENT or ENOTDIR ? new FileKind.Missing() : new FileKind.Unknown();
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return new FileKind.Unknown();
        }
        size = BitConverter.ToInt64(buffer, 40);
        return (BitConverter.ToUInt16(buffer, 28) & 0xF000) switch
        {
            0x8000 => new FileKind.Regular(),
            0x1000 => new FileKind.Other("a named pipe (FIFO)"),
            0x2000 => new FileKind.Other("a character device"),
            0x6000 => new FileKind.Other("a block device"),
            0xC000 => new FileKind.Other("a socket"),
            0x4000 => new FileKind.Other("a directory"),
            _ => new FileKind.Other("a special file"),
        };
    }
}
