using System.Diagnostics;
using System.Text;

namespace ModalChain.Io.Files;

/// <summary>Writes files so that a reader (or a crash) sees either the previous file or the whole new one, never a part.</summary>
/// <remarks>
/// The bytes go to a temporary file in the same folder (<c>.NAME.tmp-PID-RANDOM</c>), are flushed to disk (fsync), and the
/// temporary file is then renamed over the target, which POSIX makes atomic within one file system; the folder's entry is
/// flushed too. A failed write deletes its temporary file; one left by a killed process is deleted by the next write of the
/// same file. Every file ModalChain writes goes through this class.
/// </remarks>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8 = new(encoderShouldEmitUTF8Identifier: false);

    /// <summary>Writes <paramref name="text"/> as UTF-8 without a byte-order mark.</summary>
    /// <param name="path">The file to write.</param>
    /// <param name="text">Its new content.</param>
    /// <param name="overwrite">False to fail (with <see cref="IOException"/>, nothing written) when <paramref name="path"/> exists.</param>
    public static void WriteAllText(string path, string text, bool overwrite = true)
    {
        ArgumentNullException.ThrowIfNull(text);
        Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, Utf8, bufferSize: 65536, leaveOpen: true);
            writer.Write(text);
        }, overwrite);
    }

    /// <summary>Writes <paramref name="bytes"/>.</summary>
    /// <param name="path">The file to write.</param>
    /// <param name="bytes">Its new content.</param>
    /// <param name="overwrite">False to fail (with <see cref="IOException"/>, nothing written) when <paramref name="path"/> exists.</param>
    public static void WriteAllBytes(string path, ReadOnlyMemory<byte> bytes, bool overwrite = true) =>
        Write(path, stream => stream.Write(bytes.Span), overwrite);

    /// <summary>Writes the file with <paramref name="write"/>, which receives the stream of the temporary file.</summary>
    /// <param name="path">The file to write.</param>
    /// <param name="write">Writes the content; an exception leaves the target as it was.</param>
    /// <param name="overwrite">False to fail (with <see cref="IOException"/>, nothing written) when <paramref name="path"/> exists.</param>
    /// <exception cref="IOException">The file could not be written; the target is as it was.</exception>
    public static void Write(string path, Action<Stream> write, bool overwrite = true)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentNullException.ThrowIfNull(write);
        var target = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(target) ?? throw new IOException($"{path} names no file");
        var name = Path.GetFileName(target);
        if (name.Length == 0) throw new IOException($"{path} names a folder, not a file");
        RemoveLeftovers(folder, name);
        if (!overwrite && Path.Exists(target)) throw new IOException($"{path} exists");

        var temporary = Path.Combine(folder, Leftovers.Name(name, Leftovers.TemporaryFile));
        try
        {
            using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write, FileShare.None, 65536))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }
            // Without overwrite, File.Move refuses an existing target itself, so a file created meanwhile is not replaced.
            File.Move(temporary, target, overwrite);
        }
        catch
        {
            TryDelete(temporary);
            throw;
        }
        NativeFileSystem.SyncDirectory(folder);
    }

    /// <summary>Writes a new file inside a staging folder that no reader sees yet (one swapped in whole later): created exclusively and flushed to disk, without a rename of its own.</summary>
    /// <param name="path">The file to create; it must not exist.</param>
    /// <param name="write">Writes the content.</param>
    /// <exception cref="IOException">The file exists or could not be written.</exception>
    public static void WriteStaged(string path, Action<Stream> write)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentNullException.ThrowIfNull(write);
        using var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.None, 65536);
        write(stream);
        stream.Flush(flushToDisk: true);
    }

    /// <summary>Deletes temporary files that a killed write of <paramref name="name"/> left in <paramref name="folder"/>.</summary>
    public static void RemoveLeftovers(string folder, string name)
    {
        if (!Directory.Exists(folder)) return;
        foreach (var leftover in Leftovers.Find(folder, name, Leftovers.TemporaryFile))
            if (File.Exists(leftover)) TryDelete(leftover);
    }

    private static void TryDelete(string file)
    {
        try { File.Delete(file); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { /* removed by the next write of the same file */ }
    }
}

/// <summary>Names of the temporary entries an atomic write makes next to its target, and finding the ones a killed process left.</summary>
/// <remarks>
/// A name is <c>.TARGET.KIND-PID-RANDOM</c>: hidden, next to its target, and naming the process that made it, so a run
/// removes only leftovers of processes that are no longer running (or its own) and never the work of a concurrent run.
/// A name <c>.TARGET.KIND-GUID</c> (32 hex digits, no process id) was made by an earlier version and is always a leftover.
/// </remarks>
public static class Leftovers
{
    /// <summary>Kind of a temporary file of <see cref="AtomicFile"/>.</summary>
    public const string TemporaryFile = "tmp";

    // Long names are shortened in the prefix so the temporary name stays within the usual 255-byte limit.
    private const int MaxStem = 100;

    /// <summary>A new leftover name of <paramref name="kind"/> for target <paramref name="name"/>, owned by this process.</summary>
    public static string Name(string name, string kind) =>
        $"{Prefix(name, kind)}{Environment.ProcessId}-{Guid.NewGuid().ToString("N")[..12]}";

    /// <summary>Leftovers of <paramref name="kind"/> for target <paramref name="name"/> in <paramref name="folder"/> whose process is gone (or is this one).</summary>
    public static IEnumerable<string> Find(string folder, string name, string kind)
    {
        var prefix = Prefix(name, kind);
        // Filtered by hand rather than by a search pattern: the target's name may itself hold '*' or '?'.
        foreach (var entry in Directory.EnumerateFileSystemEntries(folder))
            if (IsStale(Path.GetFileName(entry), prefix)) yield return entry;
    }

    private static bool IsStale(string file, string prefix)
    {
        if (!file.StartsWith(prefix, StringComparison.Ordinal)) return false;
        var rest = file.AsSpan(prefix.Length);
        var dash = rest.IndexOf('-');
        // Before names carried the process id, a staging folder was .TARGET.partial-GUID: always a leftover now.
        if (dash < 0) return rest.Length == 32 && !rest.ContainsAnyExcept("0123456789abcdefABCDEF");
        if (dash == 0 || !int.TryParse(rest[..dash], System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var pid)) return false;
        return pid == Environment.ProcessId || !IsRunning(pid);
    }

    private static string Prefix(string name, string kind) => $".{(name.Length > MaxStem ? name[..MaxStem] : name)}.{kind}-";

    private static bool IsRunning(int pid)
    {
        try
        {
            using var process = Process.GetProcessById(pid);
            return !process.HasExited;
        }
        catch (Exception e) when (e is ArgumentException or InvalidOperationException or System.ComponentModel.Win32Exception)
        {
            return false;
        }
    }
}
