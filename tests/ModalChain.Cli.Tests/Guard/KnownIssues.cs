namespace ModalChain.Cli.Tests.Guard;

/// <summary>How far the hostile corruptions go while a known fix has not landed.</summary>
/// <param name="MaxNesting">Deepest nesting generated.</param>
/// <param name="MaxAliasLevels">Most levels of an alias bomb.</param>
/// <param name="MaxAliasFan">Most aliases per level of an alias bomb.</param>
/// <param name="DeviceFiles">Whether /dev/zero is given as the model.</param>
/// <param name="FifoWait">How long a FIFO case may block before the guard opens the FIFO's other end (null: the full budget).</param>
internal sealed record HazardLimits(int MaxNesting, int MaxAliasLevels, int MaxAliasFan, bool DeviceFiles, TimeSpan? FifoWait);

/// <summary>One finding that another helper is fixing: the guard tolerates only its signature until the fix lands.</summary>
/// <param name="Item">The item of issue 12 it belongs to.</param>
/// <param name="Signature">What is tolerated, in words.</param>
/// <param name="Matches">Whether a failed case shows exactly this signature.</param>
internal sealed record KnownIssue(string Item, string Signature, Func<GuardCase, CaseOutcome, bool> Matches);

/// <summary>
/// The allow-list of the guard: a short, explicit list of findings being fixed elsewhere. Remove an entry as soon
/// as its fix is merged; the guard then holds the fix. Nothing else is tolerated.
/// </summary>
internal static class KnownIssues
{
    /// <summary>
    /// Hostile inputs a fix is pending for: a stack overflow (deep nesting) or an out-of-memory (a device file) would
    /// take the whole test host down, which no allow-list can tolerate, so they are generated only up to these sizes.
    /// </summary>
    public static HazardLimits Limits { get; } = new(MaxNesting: 1_000, MaxAliasLevels: 10, MaxAliasFan: 10, DeviceFiles: false, FifoWait: TimeSpan.FromSeconds(1));

    public static IReadOnlyList<KnownIssue> All { get; } =
    [
        new("12.5 (h-io)", "a FIFO given as the model or as a table file blocks the read: a hang",
            (c, o) => o.Hung && c.Special is SpecialFile.Fifo or SpecialFile.TableFifo),
        // Arrived with the merge of h-modal's topology/flexibility solve; e.g. seed 20261202 case 5799 (a spring of 1e-300 kN/mm).
        new("12.1 (h-modal)", "modes or check exits 4 (IndexOutOfRangeException) on a spring stiffness of an extreme number such as 1e-300 kN/mm",
            (c, o) => c.Command is "modes" or "check" && o.ExitCode == 4 && o.Stderr.Contains("IndexOutOfRangeException", StringComparison.Ordinal)
                && c.File.Applied.Any(a => a.Kind == "extreme number")),
    ];

    public static KnownIssue? Tolerating(GuardCase c, CaseOutcome o) => All.FirstOrDefault(k => k.Matches(c, o));
}
