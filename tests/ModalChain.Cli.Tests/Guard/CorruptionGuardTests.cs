using System.Collections.Concurrent;
using System.Globalization;
using System.Text;
using Xunit.Abstractions;

namespace ModalChain.Cli.Tests.Guard;

/// <summary>
/// The standing guard: seeded corruptions of every model in models/ run through every command, in-process. Each
/// case must exit 0, 1, 2 or 3, print no stack trace, finish within its time budget and leave no half-written file.
/// </summary>
/// <remarks>
/// Environment (see DEVELOPERS.md, "The corruption guard"): MODALCHAIN_GUARD_SEED (default 20261202),
/// MODALCHAIN_GUARD_CASES (default 10000), MODALCHAIN_GUARD_CASE (replay one case and print it),
/// MODALCHAIN_GUARD_BUDGET (seconds per case, default 30), MODALCHAIN_GUARD_COMMAND (run only this command).
/// </remarks>
public sealed class CorruptionGuardTests(ITestOutputHelper output)
{
    private const int DefaultSeed = 20261202;
    private const int DefaultCases = 10_000;

    [Fact]
    public void CorruptedModels_OnEveryCommand_ExitCleanlyWithinBudget()
    {
        var seed = Env("MODALCHAIN_GUARD_SEED") ?? DefaultSeed;
        var only = Env("MODALCHAIN_GUARD_CASE");
        var onlyCommand = Environment.GetEnvironmentVariable("MODALCHAIN_GUARD_COMMAND") is { Length: > 0 } oc ? oc : null;
        var count = Env("MODALCHAIN_GUARD_CASES") ?? DefaultCases;
        var budget = TimeSpan.FromSeconds(Env("MODALCHAIN_GUARD_BUDGET") ?? 30);
        var models = BaseModel.LoadAll();
        // Memory-backed /dev/shm where there is one: creating and deleting ten thousand folders on a disk costs more than the cases.
        var tempBase = Environment.GetEnvironmentVariable("MODALCHAIN_GUARD_DIR") is { Length: > 0 } d ? d
            : Directory.Exists("/dev/shm") ? "/dev/shm" : Path.GetTempPath();
        var root = Path.Combine(tempBase, "modalchain-guard-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(root);
        var runner = new GuardRunner(root, budget);
        var indices = only is { } one ? [one] : Enumerable.Range(0, count).ToArray();

        var failures = new ConcurrentBag<(GuardCase Case, CaseOutcome Outcome)>();
        var tolerated = new ConcurrentDictionary<string, int>();
        var perCommand = new ConcurrentDictionary<string, int[]>();
        var perKind = new ConcurrentDictionary<string, int>();
        var seconds = new ConcurrentDictionary<string, double>();
        var hangs = 0;
        var next = -1;
        var clock = System.Diagnostics.Stopwatch.StartNew();

        var workerNumber = 0;
        void Work()
        {
            var dir = Path.Combine(root, "worker-" + Interlocked.Increment(ref workerNumber).ToString(CultureInfo.InvariantCulture));
            for (var i = Interlocked.Increment(ref next); i < indices.Length; i = Interlocked.Increment(ref next))
            {
                var c = GuardCase.Draw(seed, indices[i], models, KnownIssues.Limits, onlyCommand);
                var o = runner.Run(c, dir);
                var codes = perCommand.GetOrAdd(c.Command, _ => new int[6]);
                Interlocked.Increment(ref codes[o.Hung ? 5 : Math.Clamp(o.ExitCode, 0, 4)]);
                foreach (var kind in c.File.Applied.Select(a => a.Kind).Distinct()) perKind.AddOrUpdate(kind, 1, (_, n) => n + 1);
                if (c.Special != SpecialFile.None) perKind.AddOrUpdate("special file: " + c.Special, 1, (_, n) => n + 1);
                seconds.AddOrUpdate(c.Command, o.Seconds, (_, t) => t + o.Seconds);
                if (o.Hung) Interlocked.Increment(ref hangs);
                if (o.Problems.Count == 0) continue;
                if (KnownIssues.Tolerating(c, o) is { } known) tolerated.AddOrUpdate(known.Item + ": " + known.Signature, 1, (_, n) => n + 1);
                else failures.Add((c, o));
                if (only is not null) output.WriteLine(c.Describe(seed));
            }
        }

        var workers = Enumerable.Range(0, Math.Max(1, Environment.ProcessorCount)).Select(_ => new Thread(Work) { IsBackground = true }).ToArray();
        foreach (var w in workers) w.Start();
        foreach (var w in workers) w.Join();
        try { Directory.Delete(root, recursive: true); } catch (IOException) { }

        var summary = Summary(seed, indices.Length, clock.Elapsed, perCommand, seconds, perKind, tolerated, hangs, failures.Count);
        output.WriteLine(summary);
        if (only is { } replayed)
        {
            var c = GuardCase.Draw(seed, replayed, models, KnownIssues.Limits, onlyCommand);
            output.WriteLine(c.Describe(seed));
        }
        if (!failures.IsEmpty)
        {
            // One line per failed case, then the first case of each distinct signature in full.
            var b = new StringBuilder(summary).AppendLine();
            var ordered = failures.OrderBy(f => f.Case.Index).ToArray();
            foreach (var (c, o) in ordered.Take(60))
                b.AppendLine(CultureInfo.InvariantCulture, $"case {c.Index}: {c.Command} on {c.Model.Name} [{string.Join(", ", c.File.Applied.Select(a => a.Kind))}]: {o.Problems[0]} | {FirstLine(o.Stderr)}");
            foreach (var group in ordered.GroupBy(f => Signature(f.Case, f.Outcome)).Take(10))
            {
                var (c, o) = group.First();
                b.AppendLine().AppendLine(CultureInfo.InvariantCulture, $"=== {group.Count()} case(s) like this: {string.Join("; ", o.Problems)}");
                b.Append(c.Describe(seed));
                b.AppendLine(CultureInfo.InvariantCulture, $"exit {o.ExitCode} after {o.Seconds:F2} s");
                b.AppendLine("--- stderr").AppendLine(Clip(o.Stderr)).AppendLine("--- stdout").AppendLine(Clip(o.Stdout));
            }
            Assert.Fail(b.ToString());
        }
        if (only is null) Assert.True(indices.Length >= DefaultCases || Env("MODALCHAIN_GUARD_CASES") is not null, "the guard runs at least 10,000 cases");
        if (only is null && onlyCommand is null) Assert.Equal(8, perCommand.Count);
    }

    private static string FirstLine(string text) =>
        Corruptions.Printable(text.Split('\n').FirstOrDefault(l => l.Contains("error", StringComparison.Ordinal)) ?? text.Split('\n')[0]);

    private static string Signature(GuardCase c, CaseOutcome o) =>
        c.Command + "|" + System.Text.RegularExpressions.Regex.Replace(o.Problems[0], @"[0-9.]+", "#") + "|" +
        (o.Stderr.Split('\n').FirstOrDefault(l => l.Contains("internal error", StringComparison.Ordinal)) ?? "");

    private static string Clip(string text) => Corruptions.Printable(text.Length > 3000 ? text[..3000] + "\n[...]" : text);

    private static string Summary(int seed, int cases, TimeSpan elapsed, ConcurrentDictionary<string, int[]> perCommand,
        ConcurrentDictionary<string, double> seconds, ConcurrentDictionary<string, int> perKind, ConcurrentDictionary<string, int> tolerated, int hangs, int failures)
    {
        var b = new StringBuilder();
        b.AppendLine(CultureInfo.InvariantCulture, $"corruption guard: seed {seed}, {cases} cases in {elapsed.TotalSeconds:F1} s on {Environment.ProcessorCount} cores; {failures} failed, {hangs} over budget");
        b.AppendLine("command      cases   exit 0  exit 1  exit 2  exit 3  exit 4   hung  seconds");
        foreach (var (command, codes) in perCommand.OrderBy(p => p.Key, StringComparer.Ordinal))
            b.AppendLine(CultureInfo.InvariantCulture, $"{command,-10} {codes.Sum(),7} {codes[0],8} {codes[1],7} {codes[2],7} {codes[3],7} {codes[4],7} {codes[5],6} {seconds.GetValueOrDefault(command),8:F1}");
        b.AppendLine("corruptions (cases using each):");
        foreach (var (kind, n) in perKind.OrderBy(p => p.Key, StringComparer.Ordinal)) b.AppendLine(CultureInfo.InvariantCulture, $"  {kind,-32} {n,6}");
        foreach (var (what, n) in tolerated) b.AppendLine(CultureInfo.InvariantCulture, $"tolerated (known, fix pending) {n} x {what}");
        return b.ToString();
    }

    private static int? Env(string name) =>
        Environment.GetEnvironmentVariable(name) is { Length: > 0 } v ? int.Parse(v, CultureInfo.InvariantCulture) : null;
}
