using System.Collections.Concurrent;
using System.Globalization;
using System.Runtime.InteropServices;
using System.Text.Json;
using System.Text.RegularExpressions;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Tests.Guard;

/// <summary>What one case produced, and what was wrong with it (empty when nothing).</summary>
internal sealed record CaseOutcome(int ExitCode, string Stdout, string Stderr, bool Hung, double Seconds)
{
    public List<string> Problems { get; } = [];
}

/// <summary>Runs guard cases in-process, each in its own folder and on its own thread with a time budget.</summary>
internal sealed partial class GuardRunner(string root, TimeSpan budget)
{
    // The default stack of a process's main thread on Linux, where the command normally runs.
    private const int StackSize = 8 * 1024 * 1024;

    private readonly ConcurrentDictionary<string, int> _baselines = new();

    [DllImport("libc", EntryPoint = "mkfifo", SetLastError = true)]
    private static extern int MakeFifo(string path, uint mode);

    // A .NET stack frame ("   at ModalChain.Core.X.Y(Double z)"), not a table's "   at [s]" column.
    [GeneratedRegex(@"(?m)^\s+at [\w.`<>\[\],]+\(")]
    private static partial Regex StackFrame();

    [GeneratedRegex(@"(?<![\w-])(NaN|-?Infinity|∞)(?![\w-])")]
    private static partial Regex NotANumber();

    /// <summary>Runs <paramref name="c"/> in <paramref name="dir"/> (a worker's own folder, emptied afterwards).</summary>
    public CaseOutcome Run(GuardCase c, string dir)
    {
        Directory.CreateDirectory(dir);
        try
        {
            var path = Prepare(c, dir);
            var args = new[] { c.Command, path }.Concat(c.Options.Select(o => o.Replace("{dir}", dir, StringComparison.Ordinal))).ToArray();
            var wait = c.Special is SpecialFile.Fifo or SpecialFile.TableFifo && KnownIssues.Limits.FifoWait is { } w ? w : budget;
            var outcome = Execute(args, () => UnblockFifos(c, dir, path), wait);
            Check(c, dir, outcome);
            if (c.File.EncodingOnly && c.Special == SpecialFile.None && !outcome.Hung)
            {
                var expected = Baseline(c);
                if (expected != outcome.ExitCode)
                    outcome.Problems.Add($"only the encoding changed (byte-order mark, line ends, UTF-16), but the exit code is {outcome.ExitCode} where the original file gives {expected}");
            }
            return outcome;
        }
        finally
        {
            Empty(dir);
        }
    }

    private static void Empty(string dir)
    {
        foreach (var entry in Directory.EnumerateFileSystemEntries(dir).ToArray())
        {
            try
            {
                if (Directory.Exists(entry) && !File.GetAttributes(entry).HasFlag(FileAttributes.ReparsePoint)) Directory.Delete(entry, recursive: true);
                else File.Delete(entry);
            }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }
    }

    private static string Prepare(GuardCase c, string dir)
    {
        var path = Path.Combine(dir, c.Model.Name);
        if (c.Model.Table is { } table)
        {
            var tablePath = Path.Combine(dir, table);
            switch (c.Special)
            {
                case SpecialFile.TableDirectory: Directory.CreateDirectory(tablePath); break;
                case SpecialFile.TableMissing: break;
                case SpecialFile.TableFifo: Fifo(tablePath); break;
                default: File.WriteAllBytes(tablePath, c.Table!); break;
            }
        }
        switch (c.Special)
        {
            case SpecialFile.Directory: Directory.CreateDirectory(path); break;
            case SpecialFile.Missing: break;
            case SpecialFile.Empty: File.WriteAllBytes(path, []); break;
            case SpecialFile.DevNull: return "/dev/null";
            case SpecialFile.DevZero: return "/dev/zero";
            case SpecialFile.Fifo: Fifo(path); break;
            case SpecialFile.SymlinkToModel:
                var real = Path.Combine(dir, "real-" + c.Model.Name);
                File.WriteAllBytes(real, c.File.Bytes);
                File.CreateSymbolicLink(path, real);
                break;
            default: File.WriteAllBytes(path, c.File.Bytes); break;
        }
        return path;
    }

    private static void Fifo(string path)
    {
        if (MakeFifo(path, Convert.ToUInt32("644", 8)) != 0)
            throw new InvalidOperationException($"mkfifo {path} failed: errno {Marshal.GetLastPInvokeError()}");
    }

    // A reader blocked on a FIFO returns (with no data) once a writer opens and closes it.
    private static void UnblockFifos(GuardCase c, string dir, string path)
    {
        var fifo = c.Special switch
        {
            SpecialFile.Fifo => path,
            SpecialFile.TableFifo => Path.Combine(dir, c.Model.Table!),
            _ => null,
        };
        if (fifo is null) return;
        var opener = new Thread(() =>
        {
            try { using var w = new FileStream(fifo, FileMode.Open, FileAccess.Write); }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }) { IsBackground = true };
        opener.Start();
        opener.Join(TimeSpan.FromSeconds(2));
    }

    private static CaseOutcome Execute(string[] args, Action unblock, TimeSpan budget)
    {
        var result = (Code: -1, Out: "", Err: "");
        var thread = new Thread(() =>
        {
            using var stdout = new StringWriter(CultureInfo.InvariantCulture);
            using var stderr = new StringWriter(CultureInfo.InvariantCulture);
            var code = CliApp.Run(args, stdout, stderr);
            result = (code, stdout.ToString(), stderr.ToString());
        }, StackSize) { IsBackground = true };
        var clock = System.Diagnostics.Stopwatch.StartNew();
        thread.Start();
        var hung = !thread.Join(budget);
        if (hung)
        {
            unblock();
            if (!thread.Join(TimeSpan.FromSeconds(10)))
                return new CaseOutcome(-1, "", "", Hung: true, clock.Elapsed.TotalSeconds);
        }
        return new CaseOutcome(result.Code, result.Out, result.Err, hung, clock.Elapsed.TotalSeconds);
    }

    private static void Check(GuardCase c, string dir, CaseOutcome o)
    {
        if (o.Hung)
        {
            o.Problems.Add($"hang: still running after the case's time budget ({o.Seconds:F1} s)");
            return;
        }
        if (o.ExitCode is < 0 or > 3) o.Problems.Add($"exit code {o.ExitCode} (only 0, 1, 2 or 3 are allowed)");
        foreach (var (name, text) in new[] { ("stdout", o.Stdout), ("stderr", o.Stderr) })
        {
            if (StackFrame().IsMatch(text)) o.Problems.Add($"a stack trace frame ('   at Type.Method(') on {name}");
            if (text.Contains("Exception", StringComparison.Ordinal)) o.Problems.Add($"the word 'Exception' on {name}");
        }
        var source = System.Text.Encoding.UTF8.GetString(c.File.Bytes);
        if (o.ExitCode is 0 or 1 && NotANumber().Match(o.Stdout) is { Success: true } nan && !source.Contains(nan.Value, StringComparison.Ordinal))
            o.Problems.Add($"'{nan.Value}' printed as a result on stdout");

        var report = Path.Combine(dir, "report");
        if (Directory.Exists(report)) CheckReport(report, c, o);
        foreach (var leftover in Directory.EnumerateFileSystemEntries(dir, "*", SearchOption.AllDirectories))
        {
            var name = Path.GetFileName(leftover);
            // The marker a complete report folder carries (written last) is part of the report, not a leftover.
            if (name == Reports.Writing.ReportWriter.MarkerFile && Path.GetFileName(Path.GetDirectoryName(leftover)) == "report") continue;
            if (name.StartsWith('.') || name.Contains("partial", StringComparison.OrdinalIgnoreCase) || name.EndsWith(".tmp", StringComparison.OrdinalIgnoreCase))
                o.Problems.Add($"a temporary file left behind: {Path.GetRelativePath(dir, leftover)}");
        }
        var tuned = Path.Combine(dir, "tuned.yaml");
        if (File.Exists(tuned))
        {
            var read = ModelReader.ReadFile(tuned);
            if (read.Model is null)
                o.Problems.Add("tune --write left a file that does not read back: " + string.Join("; ", read.Diagnostics.Take(3)));
        }
    }

    // A report folder is either absent or complete: results.json parses and lists figures that all exist, report.html is whole.
    private static void CheckReport(string report, GuardCase c, CaseOutcome o)
    {
        if (o.ExitCode != 0) o.Problems.Add($"exit {o.ExitCode}, but a report folder was written");
        if (!File.Exists(Path.Combine(report, Reports.Writing.ReportWriter.MarkerFile)))
            o.Problems.Add($"report folder without its completion marker {Reports.Writing.ReportWriter.MarkerFile}");
        var json = Path.Combine(report, "results.json");
        if (!File.Exists(json))
        {
            o.Problems.Add("report folder without results.json");
            return;
        }
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllBytes(json));
            if (doc.RootElement.TryGetProperty("report", out var r) && r.TryGetProperty("figures", out var figures) && figures.ValueKind == JsonValueKind.Array)
                foreach (var f in figures.EnumerateArray())
                    if (f.ValueKind == JsonValueKind.String && !Directory.EnumerateFiles(report, f.GetString()! + ".*").Any())
                        o.Problems.Add($"results.json lists the figure '{f.GetString()}', which is missing");
        }
        catch (JsonException e)
        {
            o.Problems.Add("results.json does not parse: " + e.Message);
        }
        var svgOnly = c.Options.Contains("svg");
        var html = Path.Combine(report, "report.html");
        if (!svgOnly && (!File.Exists(html) || !File.ReadAllText(html).TrimEnd().EndsWith("</html>", StringComparison.OrdinalIgnoreCase)))
            o.Problems.Add("report.html missing or cut short");
    }

    private int Baseline(GuardCase c) => _baselines.GetOrAdd(c.Model.Name + "|" + c.CommandLine, _ =>
    {
        var dir = Path.Combine(root, "baseline-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            var path = Path.Combine(dir, c.Model.Name);
            File.WriteAllBytes(path, c.Model.Bytes);
            if (c.Model.Table is { } t) File.WriteAllBytes(Path.Combine(dir, t), c.Model.TableBytes!);
            var args = new[] { c.Command, path }.Concat(c.Options.Select(o => o.Replace("{dir}", dir, StringComparison.Ordinal))).ToArray();
            return Execute(args, () => { }, budget).ExitCode;
        }
        finally
        {
            try { Directory.Delete(dir, recursive: true); } catch (IOException) { }
        }
    });
}
