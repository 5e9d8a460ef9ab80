using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>The outcome of every criterion a model states: separation, the limits evaluated, and those that could not be.</summary>
/// <param name="Separation">The separation check, or null when the model states none.</param>
/// <param name="Limits">The vibration-limit checks evaluated.</param>
/// <param name="NotEvaluated">Criteria that could not be evaluated, each with the reason.</param>
public sealed record CheckOutcome(SeparationResult? Separation, IReadOnlyList<LimitResult> Limits, IReadOnlyList<(string Criterion, string Reason)> NotEvaluated)
{
    /// <summary>Machine vibration zone checks, one per criterion and mass, in file order.</summary>
    public ImmutableArray<MachineZoneResult> Zones { get; init; } = [];

    /// <summary>Floor criterion checks, one per criterion and mass, in file order.</summary>
    public ImmutableArray<FloorResult> Floors { get; init; } = [];

    /// <summary>The rule that combined the load cases for the limits, or null when the model has no load cases.</summary>
    public CaseCombination? Combination { get; init; }

    /// <summary>True when every criterion was evaluated and passes.</summary>
    public bool AllPass => (Separation?.Passes ?? true) && Limits.All(l => l.Passes) && NotEvaluated.Count == 0
        && Zones.All(z => z.Passes) && Floors.All(f => f.Passes);
}

/// <summary>Evaluates every criterion of a model: the one place both <c>modalchain check</c> and the report use.</summary>
public static class CriteriaCheck
{
    /// <summary>Separation against the undamped natural frequencies; vibration limits, machine zones and floor curves at the operating points.</summary>
    /// <param name="system">The assembled model; its modes give the natural frequencies.</param>
    /// <param name="criteria">The criteria the model states.</param>
    /// <param name="operatingLoads">The loads whose running speeds are the operating points of the limits.</param>
    /// <param name="cases">The load cases when the model has them: limits are then checked against their combination by its rule, and zones and floors see each case's components apart.</param>
    public static CheckOutcome Evaluate(DampedSystem system, CriteriaSet criteria, IReadOnlyList<Load> operatingLoads, LoadCaseSelection? cases = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(criteria);
        ArgumentNullException.ThrowIfNull(operatingLoads);
        var separation = criteria.Separation is { } s
            ? SeparationCheck.Evaluate([.. system.Modes.Modes.Select(m => m.NaturalFrequencyHz)], s)
            : null;
        var limits = criteria.Limits.IsDefaultOrEmpty
            ? new LimitOutcome([], [])
            : cases is not null ? LoadCaseLimits.Evaluate(system, cases, criteria.Limits)
            : OperatingPointLimits.Evaluate(system, operatingLoads, criteria.Limits);
        var notEvaluated = limits.NotEvaluated.Select(n => ($"limit {n.Limit.Describe()}", n.Reason)).ToList();

        var zones = ImmutableArray.CreateBuilder<MachineZoneResult>();
        var floors = ImmutableArray.CreateBuilder<FloorResult>();
        var network = system.Model.Network;
        var named = criteria.Zones.SelectMany(z => z.At).Concat(criteria.Floors.SelectMany(f => f.At)).ToList();
        if (named.Count > 0)
        {
            var components = cases is null
                ? OperatingPointLimits.Components(system, operatingLoads, [.. named.Where(network.IsMass)])
                : LoadCaseLimits.AsHarmonic(LoadCaseAnalysis.Components(system, cases, [.. named.Where(network.IsMass)])) is var byCase && byCase.Values.Any(c => c.Count > 0) ? byCase : null;
            foreach (var zone in criteria.Zones)
                foreach (var at in zone.At)
                    if (components?.GetValueOrDefault(at) is { } parts) zones.Add(VelocityLevels.Evaluate(zone, at, parts));
                    else notEvaluated.Add((zone.Describe(at), components is null ? (cases is null ? OperatingPointLimits.NoOperatingPoint : LoadCaseLimits.NoOperatingPoint) : $"'{at}' is not a mass of the model"));
            foreach (var floor in criteria.Floors)
                foreach (var at in floor.At)
                    if (components?.GetValueOrDefault(at) is { } parts) floors.Add(VelocityLevels.Evaluate(floor, at, parts));
                    else notEvaluated.Add((floor.Describe(at), components is null ? (cases is null ? OperatingPointLimits.NoOperatingPoint : LoadCaseLimits.NoOperatingPoint) : $"'{at}' is not a mass of the model"));
        }
        return new CheckOutcome(separation, limits.Evaluated, notEvaluated)
        {
            Combination = cases?.Rule,
            Zones = zones.ToImmutable(),
            Floors = floors.ToImmutable(),
        };
    }
}
