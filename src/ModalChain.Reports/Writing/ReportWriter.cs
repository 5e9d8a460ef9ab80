using System.Collections.Immutable;
using ModalChain.Io.Files;

namespace ModalChain.Reports.Writing;

/// <summary>A report could not be written; the output folder is as it was before the run.</summary>
public sealed class ReportWriteException(string message, Exception? inner = null) : Exception(message, inner);

/// <summary>Writes a <see cref="Report"/> into a folder atomically: the folder holds the previous complete report or the new one, never a mix.</summary>
/// <remarks>
/// <para>The new report is written into a staging folder next to the target (<c>.DIR.partial-PID-RANDOM</c>, same file
/// system), every file flushed to disk, the marker file <see cref="MarkerFile"/> last. The staging folder then takes the
/// target's place in one step: on Linux, renameat2(RENAME_EXCHANGE) swaps the two folders atomically, and the previous
/// report, now under the staging name, is deleted. Where the exchange is not offered (another system, an old kernel, a file
/// system without it), the fallback renames the previous folder aside (<c>.DIR.previous-PID-RANDOM</c>) and the new one in:
/// two renames, so a crash between them leaves DIR missing for a moment, and the next run puts the previous report back
/// before it starts.</para>
/// <para>The new folder holds only the new report: files of an earlier report never mix with it. A folder that exists and
/// holds anything but a ModalChain report (no marker file, not empty) is refused, never replaced. Every run first removes
/// what a killed run left next to the target.</para>
/// </remarks>
public static class ReportWriter
{
    /// <summary>File name of the HTML report.</summary>
    public const string HtmlFile = "report.html";

    /// <summary>File name of the whole report as one PDF (with <see cref="ReportFormat.Pdf"/>).</summary>
    public const string PdfFile = Pdf.PdfReport.FileName;

    /// <summary>File name of the numbers behind the report.</summary>
    public const string JsonFile = "results.json";

    /// <summary>The file that marks a folder as a ModalChain report, which the next report may replace whole.</summary>
    public const string MarkerFile = ".modalchain-report";

    /// <summary>Kind of the staging folder of a run (see <see cref="Leftovers"/>).</summary>
    internal const string Staging = "partial";

    /// <summary>Kind of the folder a previous report is moved to by the fallback commit.</summary>
    internal const string Previous = "previous";

    private const string MarkerText =
        "This folder is a report written by ModalChain (modalchain report). The next report written here replaces the whole folder,\n" +
        "so keep nothing else in it. Delete this file to make ModalChain refuse to overwrite the folder.\n";

    /// <summary>Writes <paramref name="report"/> into <paramref name="directory"/> (created when missing) and returns the file names written.</summary>
    /// <exception cref="ReportWriteException">The folder could not be written, or holds something that is not a report; it is unchanged.</exception>
    public static ImmutableArray<string> Write(Report report, string directory, ReportFormat format) =>
        Write(report, directory, format, CommitControl.Default);

    /// <summary>As <see cref="Write(Report, string, ReportFormat)"/>, with a hook before every step of the commit (for fault-injection tests).</summary>
    internal static ImmutableArray<string> Write(Report report, string directory, ReportFormat format, CommitControl control)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(control);
        var target = Target(directory);
        var parent = Path.GetDirectoryName(target)!;
        var name = Path.GetFileName(target);

        control.Step("recover");
        try
        {
            Directory.CreateDirectory(parent);
            Recover(parent, name, target);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ReportWriteException($"cannot prepare {directory}: {e.Message}; nothing was written.", e);
        }
        var replacing = Directory.Exists(target);
        if (replacing) RefuseForeignContent(directory, target);

        var staging = Path.Combine(parent, Leftovers.Name(name, Staging));
        ImmutableArray<string> files;
        try
        {
            control.Step("create staging folder");
            Directory.CreateDirectory(staging);
            files = Stage(report, staging, format, control);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            TryDeleteTree(staging);
            throw new ReportWriteException($"cannot write the report into {directory}: {e.Message}; the folder was left as it was.", e);
        }

        Commit(staging, target, directory, parent, name, replacing, control);
        return files;
    }

    /// <summary>The full path of the target folder, with a symbolic link to a folder followed (the folder it points to is replaced, the link kept).</summary>
    private static string Target(string directory)
    {
        if (string.IsNullOrWhiteSpace(directory) || directory.Contains('\0'))
            throw new ReportWriteException("the output folder name is empty or holds a NUL character; nothing was written.");
        string target;
        try
        {
            target = Path.TrimEndingDirectorySeparator(Path.GetFullPath(directory));
            if (new DirectoryInfo(target).LinkTarget is not null && Directory.Exists(target)) target = FilePaths.Canonical(target);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new ReportWriteException($"{directory} is not a usable folder name: {e.Message}; nothing was written.", e);
        }
        if (Path.GetDirectoryName(target) is null || Path.GetFileName(target).Length == 0)
            throw new ReportWriteException($"{directory} is the root of a file system; write the report into a folder of its own.");
        if (File.Exists(target)) throw new ReportWriteException($"{directory} is a file, not a folder; nothing was written.");
        return target;
    }

    private static void RefuseForeignContent(string directory, string target)
    {
        try
        {
            if (File.Exists(Path.Combine(target, MarkerFile)) || !Directory.EnumerateFileSystemEntries(target).Any()) return;
            if (IsEarlierReport(target)) return;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ReportWriteException($"cannot read {directory}: {e.Message}; nothing was written.", e);
        }
        throw new ReportWriteException(
            $"{directory} exists and is not a ModalChain report folder (it has files but no {MarkerFile} marker); a report replaces its " +
            "whole folder, so nothing was written. Choose a new or empty folder.");
    }

    /// <summary>True for a folder written by a version before the marker: report.html beside only report files, no subfolders.</summary>
    /// <remarks>Such folders would otherwise be refused after an upgrade although they hold nothing of the user's.</remarks>
    private static bool IsEarlierReport(string target)
    {
        if (!File.Exists(Path.Combine(target, "report.html")) || Directory.EnumerateDirectories(target).Any()) return false;
        return Directory.EnumerateFiles(target).Select(Path.GetFileName).All(name =>
            name is "report.html" or "results.json" or "report.pdf" ||
            name!.EndsWith(".svg", StringComparison.Ordinal) || name.EndsWith(".pdf", StringComparison.Ordinal));
    }

    private static ImmutableArray<string> Stage(Report report, string staging, ReportFormat format, CommitControl control)
    {
        var files = ImmutableArray.CreateBuilder<string>();
        void Add(string file, Action<Stream> write)
        {
            control.Step("write " + file);
            AtomicFile.WriteStaged(Path.Combine(staging, file), write);
            files.Add(file);
        }

        foreach (var figure in report.Figures)
        {
            var svg = figure.Svg(standalone: true);
            Add(figure.Name + ".svg", s => Utf8(s, svg));
            if (format == ReportFormat.Pdf) Add(figure.Name + ".pdf", figure.WritePdf);
        }
        Add(JsonFile, s => s.Write(report.Json.AsSpan()));
        if (format != ReportFormat.Svg) Add(HtmlFile, s => Utf8(s, report.Html));
        if (format == ReportFormat.Pdf && report.Document is { } document) Add(PdfFile, s => Pdf.PdfReport.Write(document, s));
        // The marker goes last: a staging folder with the marker holds a complete report.
        control.Step("write " + MarkerFile);
        AtomicFile.WriteStaged(Path.Combine(staging, MarkerFile), s => Utf8(s, MarkerText));
        NativeFileSystem.SyncDirectory(staging);
        return files.ToImmutable();
    }

    private static void Utf8(Stream stream, string text)
    {
        using var writer = new StreamWriter(stream, new System.Text.UTF8Encoding(false), 65536, leaveOpen: true);
        writer.Write(text);
    }

    private static void Commit(string staging, string target, string directory, string parent, string name, bool replacing, CommitControl control)
    {
        if (!replacing)
        {
            control.Step("move new report in");
            try { Directory.Move(staging, target); }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                TryDeleteTree(staging);
                throw new ReportWriteException($"cannot move the new report into {directory}: {e.Message}; nothing was written.", e);
            }
            NativeFileSystem.SyncDirectory(parent);
            return;
        }

        bool exchanged;
        try
        {
            control.Step("exchange");
            exchanged = control.UseExchange && NativeFileSystem.TryExchange(staging, target);
        }
        catch (IOException e)
        {
            TryDeleteTree(staging);
            throw new ReportWriteException($"cannot swap the new report into {directory}: {e.Message}; the folder was left as it was.", e);
        }
        if (exchanged)
        {
            // The previous report now sits under the staging name.
            NativeFileSystem.SyncDirectory(parent);
            DeleteTree(staging, control);
            return;
        }

        // Fallback: rename the previous report aside, then the new one in; the next run restores the previous one if a crash
        // came between the two renames.
        var previous = Path.Combine(parent, Leftovers.Name(name, Previous));
        try
        {
            control.Step("move previous report aside");
            Directory.Move(target, previous);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            TryDeleteTree(staging);
            throw new ReportWriteException($"cannot move the previous report in {directory} aside: {e.Message}; the folder was left as it was.", e);
        }
        try
        {
            control.Step("move new report in");
            Directory.Move(staging, target);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            try { Directory.Move(previous, target); }
            catch (Exception again) when (again is IOException or UnauthorizedAccessException) { /* the next run restores it */ }
            TryDeleteTree(staging);
            throw new ReportWriteException($"cannot move the new report into {directory}: {e.Message}; the previous report was kept.", e);
        }
        NativeFileSystem.SyncDirectory(parent);
        DeleteTree(previous, control);
    }

    /// <summary>Cleans up after a killed run: puts back a previous report the fallback had moved aside (when the target is missing) and deletes staging folders.</summary>
    internal static void Recover(string parent, string name, string target)
    {
        var previous = Leftovers.Find(parent, name, Previous).Where(Directory.Exists).ToList();
        if (!Directory.Exists(target))
        {
            var restore = previous.Where(p => File.Exists(Path.Combine(p, MarkerFile)))
                .OrderByDescending(p => Directory.GetLastWriteTimeUtc(p)).FirstOrDefault();
            if (restore is not null)
            {
                Directory.Move(restore, target);
                previous.Remove(restore);
            }
        }
        foreach (var leftover in previous.Concat(Leftovers.Find(parent, name, Staging).Where(Directory.Exists)))
            TryDeleteTree(leftover);
        AtomicFile.RemoveLeftovers(parent, name);
    }

    private static void DeleteTree(string folder, CommitControl control)
    {
        try
        {
            foreach (var file in Directory.EnumerateFiles(folder).Order(StringComparer.Ordinal).ToList())
            {
                control.Step("delete " + Path.GetFileName(file));
                File.Delete(file);
            }
            control.Step("delete folder");
            Directory.Delete(folder, recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // The new report is in place; what is left of the old one is removed by the next run.
        }
    }

    private static void TryDeleteTree(string folder)
    {
        try
        {
            if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { /* removed by the next run */ }
    }
}

/// <summary>Test access to the commit: a hook called before each step (which may throw to stop the run there, as a kill would) and the choice of the fallback.</summary>
/// <param name="BeforeStep">Called with the step's name before it runs; null for none.</param>
/// <param name="UseExchange">False to use the two-rename fallback even where the atomic exchange is offered.</param>
internal sealed record CommitControl(Action<string>? BeforeStep = null, bool UseExchange = true)
{
    public static CommitControl Default { get; } = new();

    public void Step(string name) => BeforeStep?.Invoke(name);
}
