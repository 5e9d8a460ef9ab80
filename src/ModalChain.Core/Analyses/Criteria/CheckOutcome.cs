using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>The outcome of every criterion a model states: separation, the limits evaluated, and those that could not be.</summary>
/// <param name="Separation">The separation check, or null when the model states none.</param>
/// <param name="Limits">The vibration-limit checks evaluated.</param>
/// <param name="NotEvaluated">Criteria that could not be evaluated, each with the reason.</param>
public sealed record CheckOutcome(SeparationResult? Separation, IReadOnlyList<LimitResult> Limits, IReadOnlyList<(string Criterion, string Reason)> NotEvaluated)
{
    /// <summary>True when every criterion was evaluated and passes.</summary>
    public bool AllPass => (Separation?.Passes ?? true) && Limits.All(l => l.Passes) && NotEvaluated.Count == 0;
}

/// <summary>Evaluates every criterion of a model: the one place both <c>modalchain check</c> and the report use.</summary>
public static class CriteriaCheck
{
    /// <summary>Separation against the undamped natural frequencies, and vibration limits at the operating points.</summary>
    /// <param name="system">The assembled model; its modes give the natural frequencies.</param>
    /// <param name="criteria">The criteria the model states.</param>
    /// <param name="operatingLoads">The loads whose running speeds are the operating points of the limits.</param>
    public static CheckOutcome Evaluate(DampedSystem system, CriteriaSet criteria, IReadOnlyList<Load> operatingLoads)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(criteria);
        ArgumentNullException.ThrowIfNull(operatingLoads);
        var separation = criteria.Separation is { } s
            ? SeparationCheck.Evaluate([.. system.Modes.Modes.Select(m => m.NaturalFrequencyHz)], s)
            : null;
        var limits = criteria.Limits.IsDefaultOrEmpty
            ? new LimitOutcome([], [])
            : OperatingPointLimits.Evaluate(system, operatingLoads, criteria.Limits);
        return new CheckOutcome(separation, limits.Evaluated,
            [.. limits.NotEvaluated.Select(n => ($"limit {n.Limit.Describe()}", n.Reason))]);
    }
}
