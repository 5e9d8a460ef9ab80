using ModalChain.Core;
using ModalChain.Reports.Sections;
using ModalChain.Reports.Writing;

namespace ModalChain.Reports.Tests.Writing;

/// <summary>Atomic writing: a report appears whole or not at all, and a failed run leaves the folder as it was.</summary>
public sealed class ReportWriterTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    private static Report SmallReport() => ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options);

    /// <summary>Every file below <paramref name="dir"/> with its bytes, to compare a folder before and after.</summary>
    private static SortedDictionary<string, string> Snapshot(string dir) => new(
        Directory.EnumerateFileSystemEntries(dir, "*", SearchOption.AllDirectories).ToDictionary(
            p => Path.GetRelativePath(dir, p),
            p => File.Exists(p) ? Convert.ToHexString(File.ReadAllBytes(p)) : "<dir>"),
        StringComparer.Ordinal);

    private static string[] Leftovers(string parent) =>
        [.. Directory.EnumerateDirectories(parent).Select(Path.GetFileName).Where(n => n!.Contains(".partial-", StringComparison.Ordinal))!];

    [Fact]
    public void NewFolder_ReceivesEveryFile()
    {
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        var files = ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);
        Assert.Equal(files.Order(StringComparer.Ordinal), Directory.EnumerateFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.Contains("report.html", files);
        Assert.Contains("results.json", files);
        Assert.Contains("network.svg", files);
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void PdfFormat_WritesAPdfBesideEverySvg()
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        var files = ReportWriter.Write(SmallReport(), dir, ReportFormat.Pdf);
        foreach (var svg in files.Where(f => f.EndsWith(".svg", StringComparison.Ordinal)))
        {
            var pdf = File.ReadAllBytes(Path.Combine(dir, Path.ChangeExtension(svg, ".pdf")));
            Assert.True(pdf.Length > 100 && System.Text.Encoding.ASCII.GetString(pdf, 0, 5) == "%PDF-", $"{svg}: PDF missing or not a PDF");
        }
    }

    [Fact]
    public void SvgFormat_WritesFiguresAndNumbersButNoHtml()
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        var files = ReportWriter.Write(SmallReport(), dir, ReportFormat.Svg);
        Assert.DoesNotContain("report.html", files);
        Assert.Contains("results.json", files);
        Assert.False(File.Exists(Path.Combine(dir, "report.html")));
    }

    [Fact]
    public void ExistingFolder_OldReportReplacedAndOtherFilesKept()
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "report.html"), "old");
        File.WriteAllText(Path.Combine(dir, "notes.txt"), "mine");
        ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);
        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(Path.Combine(dir, "report.html")), StringComparison.Ordinal);
        Assert.Equal("mine", File.ReadAllText(Path.Combine(dir, "notes.txt")));
    }

    [Fact]
    public void FailureWhileMovingIn_RollsBackAndLeavesFolderUnchanged()
    {
        // The folder holds an earlier report plus a folder named like one of the new files, so moving that file in fails
        // after others have already been moved: the writer must put everything back. (Works as root too, unlike chmod.)
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "network.svg"), "earlier network");
        File.WriteAllText(Path.Combine(dir, "report.html"), "earlier report");
        Directory.CreateDirectory(Path.Combine(dir, "results.json"));
        File.WriteAllText(Path.Combine(dir, "results.json", "keep.txt"), "blocker");
        var before = Snapshot(dir);

        Assert.Throws<ReportWriteException>(() => ReportWriter.Write(SmallReport(), dir, ReportFormat.Html));

        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void UnwritableFolder_FailsAndLeavesFolderUnchanged()
    {
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "report.html"), "earlier report");
        var before = Snapshot(dir);
        File.SetUnixFileMode(dir, UnixFileMode.UserRead | UnixFileMode.UserExecute);
        try
        {
            var probe = Path.Combine(dir, ".probe");
            var ownerBypassesPermissions = TryCreate(probe); // root ignores directory permissions
            if (ownerBypassesPermissions)
            {
                File.Delete(probe);
                // Make the folder unwritable for root too: the target path is a file, not a folder.
                var asFile = Path.Combine(parent, "out-file");
                File.WriteAllText(asFile, "a file where the folder should be");
                Assert.Throws<ReportWriteException>(() => ReportWriter.Write(SmallReport(), asFile, ReportFormat.Html));
                Assert.Equal("a file where the folder should be", File.ReadAllText(asFile));
            }
            else
            {
                Assert.Throws<ReportWriteException>(() => ReportWriter.Write(SmallReport(), dir, ReportFormat.Html));
            }
        }
        finally
        {
            File.SetUnixFileMode(dir, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        }
        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void AnalysisError_NothingWrittenAndFolderUnchanged()
    {
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "report.html"), "earlier report");
        var before = Snapshot(dir);
        ReportSectionFactory failing = _ => throw new NumericalFailureException("injected: the eigen solver did not converge (test)");
        var document = Repository.UniformChain(2, 1, 100);

        // The report is assembled fully in memory before anything touches the disk, so an analysis error stops the run first.
        Assert.Throws<NumericalFailureException>(() =>
            ReportWriter.Write(ReportBuilder.Build(document, Options, [.. ReportSections.Default, failing]), dir, ReportFormat.Html));

        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void FigureRenderingError_FolderUnchanged()
    {
        // A failure while staging files (here: a figure whose PDF export throws) must not reach the target folder either.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "report.html"), "earlier report");
        var before = Snapshot(dir);
        var report = SmallReport();
        var broken = report with { Figures = [.. report.Figures, new BrokenFigure()] };

        Assert.Throws<ReportWriteException>(() => ReportWriter.Write(broken, dir, ReportFormat.Pdf));

        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    private static bool TryCreate(string path)
    {
        try
        {
            File.WriteAllText(path, "");
            return true;
        }
        catch (UnauthorizedAccessException)
        {
            return false;
        }
    }

    private sealed class BrokenFigure() : Figures.ReportFigure("broken", "a figure that fails to render", "chart")
    {
        public override string Svg(bool standalone) => "<svg xmlns=\"http://www.w3.org/2000/svg\" viewBox=\"0 0 1 1\"/>";

        public override void WritePdf(Stream stream) => throw new IOException("disk full (injected)");
    }
}
