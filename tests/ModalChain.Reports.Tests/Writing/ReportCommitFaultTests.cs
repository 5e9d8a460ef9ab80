using ModalChain.Io.Files;
using ModalChain.Reports.Writing;

namespace ModalChain.Reports.Tests.Writing;

/// <summary>
/// Fault injection: the report run is stopped before each step of its commit in turn, as a kill would stop it (no cleanup
/// code runs), and the folder must then hold the previous complete report or the new one and nothing else; the next run
/// must leave the new report and no leftovers.
/// </summary>
public sealed class ReportCommitFaultTests
{
    private static readonly ReportOptions Options = new("test", DateTimeOffset.UnixEpoch);

    // Built once: the three-mass report is the "previous" one, the two-mass report the "new" one (fewer files, so a stale
    // mode-03.svg would show a mix).
    private static readonly Report Old = ReportBuilder.Build(Repository.UniformChain(3, 1, 100), Options);
    private static readonly Report New = ReportBuilder.Build(Repository.UniformChain(2, 1, 100), Options);

    /// <summary>Stands for a kill: not an I/O error, so no handler of the writer catches it and nothing is cleaned up.</summary>
    private sealed class Killed(string step) : Exception($"killed before '{step}'");

    private static SortedDictionary<string, string> Snapshot(string dir) => new(
        Directory.EnumerateFileSystemEntries(dir, "*", SearchOption.AllDirectories).ToDictionary(
            p => Path.GetRelativePath(dir, p),
            p => File.Exists(p) ? Convert.ToHexString(File.ReadAllBytes(p)) : "<dir>"),
        StringComparer.Ordinal);

    private static readonly string OldFolder = WriteOnce(Old);

    private static string WriteOnce(Report report)
    {
        var dir = Path.Combine(Repository.TempDirectory(), "written");
        ReportWriter.Write(report, dir, ReportFormat.Html);
        return dir;
    }

    /// <summary>A copy of the previous report at <paramref name="dir"/> (copied, not rewritten, to keep the many runs quick).</summary>
    private static void PlaceOld(string dir)
    {
        Directory.CreateDirectory(dir);
        foreach (var file in Directory.GetFiles(OldFolder)) File.Copy(file, Path.Combine(dir, Path.GetFileName(file)));
    }

    private static (SortedDictionary<string, string> Old, SortedDictionary<string, string> New) References() =>
        (Snapshot(OldFolder), Snapshot(WriteOnce(New)));

    /// <summary>The names of the steps of one undisturbed run.</summary>
    private static List<string> Steps(bool replacing, bool exchange)
    {
        var dir = Path.Combine(Repository.TempDirectory(), "out");
        if (replacing) PlaceOld(dir);
        var steps = new List<string>();
        ReportWriter.Write(New, dir, ReportFormat.Html, new CommitControl(steps.Add, exchange));
        return steps;
    }

    [Theory]
    [InlineData(true, true)]
    [InlineData(true, false)]
    [InlineData(false, true)]
    public void KilledBeforeAnyStep_FolderHoldsTheOldOrTheNewReport_AndTheNextRunCleansUp(bool replacing, bool exchange)
    {
        var (old, fresh) = References();
        var steps = Steps(replacing, exchange);
        Assert.Contains(replacing ? (exchange ? "exchange" : "move previous report aside") : "move new report in", steps);
        Assert.True(steps.Count >= 8, $"only {steps.Count} steps: {string.Join(", ", steps)}");
        var sawNew = false;
        for (var k = 0; k < steps.Count; k++)
        {
            var parent = Repository.TempDirectory();
            var dir = Path.Combine(parent, "out");
            if (replacing) PlaceOld(dir);
            var step = steps[k];
            var control = new CommitControl(s => { if (s == step) throw new Killed(s); }, exchange);

            Assert.Throws<Killed>(() => ReportWriter.Write(New, dir, ReportFormat.Html, control));

            // Right after the kill. With the exchange the folder is never missing; the fallback may leave it missing
            // between its two renames, which the next run repairs before anything else.
            if (Directory.Exists(dir))
            {
                var now = Snapshot(dir);
                var isOld = replacing && Equal(old, now);
                var isNew = Equal(fresh, now);
                Assert.True(isOld || isNew, $"killed before '{step}': the folder holds neither the old nor the new report:\n  {string.Join("\n  ", now.Keys)}");
                sawNew |= isNew;
            }
            else Assert.True(!replacing || !exchange, $"killed before '{step}': the folder is missing although the exchange was used");

            if (replacing)
            {
                // What a reader finds once the next run has recovered (before it writes): the old report or the new one.
                ReportWriter.Recover(parent, "out", dir);
                var recovered = Snapshot(dir);
                Assert.True(Equal(old, recovered) || Equal(fresh, recovered), $"killed before '{step}': after recovery the folder holds a mix");
            }

            // The next run: the new report, and nothing else next to it.
            ReportWriter.Write(New, dir, ReportFormat.Html);
            Assert.True(Equal(fresh, Snapshot(dir)), $"killed before '{step}': the next run did not leave the new report");
            Assert.Equal(["out"], Directory.EnumerateFileSystemEntries(parent).Select(Path.GetFileName));
        }
        if (replacing) Assert.True(sawNew, "no interruption left the new report: the steps after the swap were not exercised");
    }

    [Fact]
    [System.Runtime.Versioning.SupportedOSPlatform("linux")]
    public void OnLinux_TheAtomicExchangeIsUsed()
    {
        // renameat2(RENAME_EXCHANGE) is in Linux since 3.15 and supported by ext4, xfs, btrfs and tmpfs (man 2 rename);
        // where this test runs it must be taken, or the writer silently fell back to two renames.
        if (!OperatingSystem.IsLinux()) return;
        var root = Repository.TempDirectory();
        var a = Directory.CreateDirectory(Path.Combine(root, "a")).FullName;
        var b = Directory.CreateDirectory(Path.Combine(root, "b")).FullName;
        File.WriteAllText(Path.Combine(a, "which"), "a");
        File.WriteAllText(Path.Combine(b, "which"), "b");

        Assert.True(NativeFileSystem.TryExchange(a, b));

        Assert.Equal("b", File.ReadAllText(Path.Combine(a, "which")));
        Assert.Equal("a", File.ReadAllText(Path.Combine(b, "which")));
    }

    private static bool Equal(SortedDictionary<string, string> expected, SortedDictionary<string, string> actual) =>
        expected.Count == actual.Count && expected.All(p => actual.TryGetValue(p.Key, out var v) && v == p.Value);
}
