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

    /// <summary>Entries next to the target that a run made (staging folders, moved-aside reports, temporary files).</summary>
    private static string[] Leftovers(string parent) =>
        [.. Directory.EnumerateFileSystemEntries(parent).Select(Path.GetFileName).Where(n => n!.StartsWith('.'))!];

    [Fact]
    public void NewFolder_ReceivesEveryFile()
    {
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        var files = ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);
        Assert.Equal(files.Append(ReportWriter.MarkerFile).Order(StringComparer.Ordinal), Directory.EnumerateFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
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
        Assert.Contains(ReportWriter.PdfFile, files);
        foreach (var svg in files.Where(f => f.EndsWith(".svg", StringComparison.Ordinal)).Append(ReportWriter.PdfFile))
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
    public void ExistingReport_IsReplacedWhole_NoFileOfTheEarlierReportRemains()
    {
        // A four-mass report has mode-01..04; the two-mass report written over it must leave exactly its own files.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(4, 1, 100), Options), dir, ReportFormat.Pdf);
        Assert.True(File.Exists(Path.Combine(dir, "mode-04.svg")));
        Assert.True(File.Exists(Path.Combine(dir, ReportWriter.PdfFile)));
        ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);
        Assert.False(File.Exists(Path.Combine(dir, ReportWriter.PdfFile)));

        var fresh = Path.Combine(Repository.TempDirectory(), "fresh");
        ReportWriter.Write(SmallReport(), fresh, ReportFormat.Html);
        Assert.Equal(Snapshot(fresh), Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void FolderWithOtherFiles_IsRefusedAndLeftUnchanged()
    {
        // A folder that is not a report (no marker) may hold the user's own work: a report never replaces it.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "report.html"), "someone's own page");
        File.WriteAllText(Path.Combine(dir, "notes.txt"), "mine");
        var before = Snapshot(dir);

        var e = Assert.Throws<ReportWriteException>(() => ReportWriter.Write(SmallReport(), dir, ReportFormat.Html));

        Assert.Contains("not a ModalChain report folder", e.Message, StringComparison.Ordinal);
        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void ReportFolderOfAnEarlierVersion_WithoutMarker_IsReplaced()
    {
        // Versions before the marker wrote report.html, results.json and figures only: such a folder holds nothing of
        // the user's, so an upgrade must not make the README's own command fail on it.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), dir, ReportFormat.Pdf);
        File.Delete(Path.Combine(dir, ReportWriter.MarkerFile));

        ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);

        var fresh = Path.Combine(Repository.TempDirectory(), "fresh");
        ReportWriter.Write(SmallReport(), fresh, ReportFormat.Html);
        Assert.Equal(Snapshot(fresh), Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void EmptyExistingFolder_ReceivesTheReport()
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        Directory.CreateDirectory(dir);
        var files = ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);
        Assert.Equal(files.Append(ReportWriter.MarkerFile).Order(StringComparer.Ordinal), Directory.EnumerateFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void SymbolicLinkToAReportFolder_TheFolderItNamesIsReplacedAndTheLinkKept()
    {
        var parent = Repository.TempDirectory();
        var real = Path.Combine(parent, "real");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), real, ReportFormat.Html);
        var link = Path.Combine(parent, "link");
        Directory.CreateSymbolicLink(link, real);

        ReportWriter.Write(SmallReport(), link, ReportFormat.Html);

        Assert.NotNull(new DirectoryInfo(link).LinkTarget);
        Assert.False(File.Exists(Path.Combine(real, "mode-03.svg")));
        Assert.True(File.Exists(Path.Combine(real, "mode-02.svg")));
    }

    [Theory]
    [InlineData("create staging folder")]
    [InlineData("write results.json")]
    [InlineData("write " + ReportWriter.MarkerFile)]
    [InlineData("exchange")]
    public void IoErrorBeforeTheSwap_LeavesTheFolderUnchangedAndNoLeftovers(string failingStep)
    {
        // A disk error (not a kill) at a step before the swap: the run cleans up after itself.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), dir, ReportFormat.Html);
        var before = Snapshot(dir);
        var control = new CommitControl(step => { if (step == failingStep) throw new IOException("disk full (injected)"); });

        Assert.Throws<ReportWriteException>(() => ReportWriter.Write(SmallReport(), dir, ReportFormat.Html, control));

        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(parent));
    }

    [Fact]
    public void LeftoversOfARunningProcess_AreNotTouched()
    {
        // A concurrent run into the same folder owns its staging folder; only leftovers of ended processes are removed.
        // Process 1 (init) runs for as long as the machine does; no process has the id int.MaxValue.
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        var live = Path.Combine(parent, ".out.partial-1-0123456789ab");
        Directory.CreateDirectory(live);
        var dead = Path.Combine(parent, $".out.partial-{int.MaxValue}-0123456789ab");
        Directory.CreateDirectory(dead);
        var earlierVersion = Path.Combine(parent, $".out.partial-{Guid.NewGuid():N}"); // named without a process id
        Directory.CreateDirectory(earlierVersion);

        ReportWriter.Write(SmallReport(), dir, ReportFormat.Html);

        Assert.True(Directory.Exists(live));
        Assert.False(Directory.Exists(dead));
        Assert.False(Directory.Exists(earlierVersion));
    }

    [Fact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void UnwritableParentFolder_FailsAndLeavesTheReportUnchanged()
    {
        // The staging folder is made next to the target, so a parent without write permission stops the run before it starts.
        var box = Path.Combine(Repository.TempDirectory(), "box");
        var dir = Path.Combine(box, "out");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), dir, ReportFormat.Html);
        var before = Snapshot(dir);
        File.SetUnixFileMode(box, UnixFileMode.UserRead | UnixFileMode.UserExecute);
        try
        {
            var probe = Path.Combine(box, ".probe");
            var ownerBypassesPermissions = TryCreate(probe); // root ignores directory permissions
            if (ownerBypassesPermissions)
            {
                File.Delete(probe);
                // Make the target unusable for root too: the path is a file, not a folder.
                var asFile = Path.Combine(Repository.TempDirectory(), "out-file");
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
            File.SetUnixFileMode(box, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        }
        Assert.Equal(before, Snapshot(dir));
        Assert.Empty(Leftovers(box));
    }

    [Fact]
    public void AnalysisError_NothingWrittenAndFolderUnchanged()
    {
        var parent = Repository.TempDirectory();
        var dir = Path.Combine(parent, "out");
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), dir, ReportFormat.Html);
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
        ReportWriter.Write(ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options), dir, ReportFormat.Html);
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
