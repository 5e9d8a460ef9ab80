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
