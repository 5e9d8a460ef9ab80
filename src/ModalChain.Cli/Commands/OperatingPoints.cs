using ModalChain.Core.Analyses.Criteria;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary>Steady-state responses at the model's operating points, for vibration limits.</summary>
internal static class OperatingPoints
{
    /// <summary>The loads whose running speeds are the operating points: those the 'harmonic' section selects, else all of them.</summary>
    public static IReadOnlyList<Load> Loads(ModelDocument document) => OperatingLoads.Of(document);

    /// <summary>Evaluates <paramref name="limits"/>; those that cannot be evaluated are returned with the reason.</summary>
    public static (List<LimitResult> Evaluated, List<(string Criterion, string Reason)> NotEvaluated) EvaluateLimits(
        ModelDocument document, IReadOnlyList<VibrationLimit> limits)
    {
        if (limits.Count == 0) return ([], []);
        var outcome = OperatingPointLimits.Evaluate(DampedSystem.Build(document.Structure), Loads(document), limits);
        return ([.. outcome.Evaluated], [.. outcome.NotEvaluated.Select(n => ($"limit {n.Limit.Describe()}", n.Reason))]);
    }
}
