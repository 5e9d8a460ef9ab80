using System.Collections.Immutable;
using System.Text;

namespace ModalChain.Reports.Writing;

/// <summary>A report could not be written; the output folder is as it was before the run.</summary>
public sealed class ReportWriteException(string message, Exception? inner = null) : Exception(message, inner);

/// <summary>Writes a <see cref="Report"/> into a folder atomically: all files or none.</summary>
/// <remarks>
/// Files are written into a temporary folder next to the target (same file system, so moves are renames) and moved into
/// place only when every file was written. Files of an earlier report that the new one replaces are first moved aside
/// into the temporary folder, so a failure during the moves puts them back. report.html moves last, so a reader never
/// sees a new report whose figures are not there yet.
/// </remarks>
public static class ReportWriter
{
    /// <summary>File name of the HTML report.</summary>
    public const string HtmlFile = "report.html";

    /// <summary>File name of the numbers behind the report.</summary>
    public const string JsonFile = "results.json";

    /// <summary>Writes <paramref name="report"/> into <paramref name="directory"/> (created when missing) and returns the file names written.</summary>
    /// <exception cref="ReportWriteException">The folder could not be written; it is unchanged.</exception>
    public static ImmutableArray<string> Write(Report report, string directory, ReportFormat format)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentException.ThrowIfNullOrWhiteSpace(directory);
        var target = Path.GetFullPath(directory);
        if (File.Exists(target)) throw new ReportWriteException($"{directory} is a file, not a folder; nothing was written.");
        var parent = Path.GetDirectoryName(target.TrimEnd(Path.DirectorySeparatorChar)) ?? target;
        string staging;
        try
        {
            Directory.CreateDirectory(parent);
            staging = Path.Combine(parent, $".{Path.GetFileName(target.TrimEnd(Path.DirectorySeparatorChar))}.partial-{Guid.NewGuid():N}");
            Directory.CreateDirectory(staging);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ReportWriteException($"cannot create a working folder next to {directory}: {e.Message}; nothing was written.", e);
        }

        try
        {
            var files = Stage(report, staging, format);
            Commit(staging, target, files);
            return files;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new ReportWriteException($"cannot write the report into {directory}: {e.Message}; the folder was left as it was.", e);
        }
        finally
        {
            try { Directory.Delete(staging, recursive: true); }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException) { /* leftover temp folder; nothing of the target depends on it */ }
        }
    }

    private static ImmutableArray<string> Stage(Report report, string staging, ReportFormat format)
    {
        var utf8 = new UTF8Encoding(false);
        var files = ImmutableArray.CreateBuilder<string>();
        foreach (var figure in report.Figures)
        {
            File.WriteAllText(Path.Combine(staging, figure.Name + ".svg"), figure.Svg(standalone: true), utf8);
            files.Add(figure.Name + ".svg");
            if (format == ReportFormat.Pdf)
            {
                using (var pdf = File.Create(Path.Combine(staging, figure.Name + ".pdf"))) figure.WritePdf(pdf);
                files.Add(figure.Name + ".pdf");
            }
        }
        File.WriteAllBytes(Path.Combine(staging, JsonFile), [.. report.Json]);
        files.Add(JsonFile);
        if (format != ReportFormat.Svg)
        {
            File.WriteAllText(Path.Combine(staging, HtmlFile), report.Html, utf8);
            files.Add(HtmlFile);
        }
        return files.ToImmutable();
    }

    private static void Commit(string staging, string target, ImmutableArray<string> files)
    {
        if (!Directory.Exists(target))
        {
            // The whole folder appears at once.
            var fresh = Path.Combine(staging, "new");
            Directory.CreateDirectory(fresh);
            foreach (var f in files) File.Move(Path.Combine(staging, f), Path.Combine(fresh, f));
            Directory.Move(fresh, target);
            return;
        }

        var backup = Path.Combine(staging, "previous");
        Directory.CreateDirectory(backup);
        var movedAside = new List<string>();
        var movedIn = new List<string>();
        try
        {
            foreach (var f in files.OrderBy(f => f == HtmlFile ? 1 : 0))
            {
                var destination = Path.Combine(target, f);
                if (File.Exists(destination))
                {
                    File.Move(destination, Path.Combine(backup, f));
                    movedAside.Add(f);
                }
                File.Move(Path.Combine(staging, f), destination);
                movedIn.Add(f);
            }
        }
        catch
        {
            foreach (var f in movedIn) TryMove(Path.Combine(target, f), Path.Combine(staging, f));
            foreach (var f in movedAside) TryMove(Path.Combine(backup, f), Path.Combine(target, f));
            throw;
        }
    }

    private static void TryMove(string from, string to)
    {
        try { File.Move(from, to, overwrite: true); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { /* best effort while rolling back */ }
    }
}
