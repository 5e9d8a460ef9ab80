using ModalChain.Core.Analyses.Criteria;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary>Steady-state responses at the model's operating points, for vibration limits.</summary>
internal static class OperatingPoints
{
    /// <summary>Evaluates <paramref name="limits"/>; those that cannot be evaluated are returned with the reason.</summary>
    public static (List<LimitResult> Evaluated, List<(string Criterion, string Reason)> NotEvaluated) EvaluateLimits(
        ModelDocument document, IReadOnlyList<VibrationLimit> limits)
    {
        var evaluated = new List<LimitResult>();
        var missing = new List<(string, string)>();
        foreach (var limit in limits)
            missing.Add(($"limit {limit.Describe()}",
                "vibration limits need the steady-state harmonic response at the operating points, which this build does not compute yet"));
        return (evaluated, missing);
    }
}
