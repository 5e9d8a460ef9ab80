using System.Collections.Immutable;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;

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
    /// <summary>Above this many DOFs a check solves only the modes below twice the highest frequency it looks at.</summary>
    public const int LowestModesFromDofs = 300;

    /// <summary>Assembles <paramref name="model"/> with the undamped modes a check of <paramref name="criteria"/> needs.</summary>
    /// <remarks>
    /// Every mode up to <see cref="LowestModesFromDofs"/> DOFs. Above, the modes below twice the highest frequency the
    /// check looks at: the upper band edges (1 + m)·f_e of the separation criterion and the running speeds of the
    /// operating loads (at least one mode). A mode above that is more than 50 % clear of every band, so it can govern
    /// only when every mode solved is clearer still; the limits are direct solves at the operating points and need no
    /// mode. With a sparse model the modes come from the sparse solver, so no dense n×n matrix is formed.
    /// </remarks>
    public static DampedSystem Assemble(StructuralModel model, CriteriaSet criteria, IReadOnlyList<Load> operatingLoads,
        SolverChoice choice = SolverChoice.Auto)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(criteria);
        ArgumentNullException.ThrowIfNull(operatingLoads);
        if (model.Network.Masses.Length <= LowestModesFromDofs) return DampedSystem.Build(model, new ModalOptions(Choice: choice));
        var bands = criteria.Separation is { } s ? s.Excitations().Select(e => (1 + s.Margin) * e.FrequencyHz) : [];
        var top = bands.Concat(operatingLoads.Select(l => l.SpeedHz ?? 0)).DefaultIfEmpty(0).Max();
        var modes = top > 0 ? ModalAnalysis.Solve(model.Network, new ModalOptions(Choice: choice, BelowFrequencyHz: 2 * top)) : null;
        if (modes is null || modes.Modes.IsEmpty) modes = ModalAnalysis.Solve(model.Network, new ModalOptions(1, Choice: choice));
        return DampedSystem.Build(model, modes, choice);
    }

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
            ? SeparationCheck.Evaluate([.. system.Modes.Modes.Select(m => m.NaturalFrequencyHz)], s, SeparationCheck.ExemptShares(system.Modes, s.Exempt))
            : null;
        var limits = criteria.Limits.IsDefaultOrEmpty
            ? new LimitOutcome([], [])
            : cases is not null ? LoadCaseLimits.Evaluate(system, cases, criteria.Limits)
            : OperatingPointLimits.Evaluate(system, operatingLoads, criteria.Limits);
        var notEvaluated = limits.NotEvaluated.Select(n => ($"limit {n.Limit.Describe()}", n.Reason)).ToList();

        var zones = ImmutableArray.CreateBuilder<MachineZoneResult>();
        var floors = ImmutableArray.CreateBuilder<FloorResult>();
        var named = criteria.Zones.SelectMany(z => z.At).Concat(criteria.Floors.SelectMany(f => f.At)).ToList();
        if (named.Count > 0)
        {
            var points = MeasuredResponse.Resolve(system.Model.Network, named);
            var dofs = MeasuredResponse.Dofs(points.Values);
            var components = cases is null
                ? OperatingPointLimits.Components(system, operatingLoads, dofs)
                : LoadCaseLimits.AsHarmonic(LoadCaseAnalysis.Components(system, cases, dofs)) is var byCase && byCase.Values.Any(c => c.Count > 0) ? byCase : null;
            var noOperatingPoint = cases is null ? OperatingPointLimits.NoOperatingPoint : LoadCaseLimits.NoOperatingPoint;
            foreach (var zone in criteria.Zones)
                foreach (var at in zone.At)
                    if (points[at] is not { Point: { } point }) notEvaluated.Add((zone.Describe(at), points[at].Reason!));
                    else if (components is null) notEvaluated.Add((zone.Describe(at), noOperatingPoint));
                    else
                    {
                        var (result, label) = MeasuredResponse.Largest(point, m => VelocityLevels.Evaluate(zone, at, MeasuredResponse.Of(m, components)), r => r.RmsVelocity);
                        zones.Add(point.TakesLargest ? result with { MeasuredAt = label } : result);
                    }
            foreach (var floor in criteria.Floors)
                foreach (var at in floor.At)
                    if (points[at] is not { Point: { } point }) notEvaluated.Add((floor.Describe(at), points[at].Reason!));
                    else if (components is null) notEvaluated.Add((floor.Describe(at), noOperatingPoint));
                    else
                    {
                        // The direction nearest to failing governs: the smallest reserve over the bands, the largest level where none is compared.
                        var (result, label) = MeasuredResponse.Largest(point, m => VelocityLevels.Evaluate(floor, at, MeasuredResponse.Of(m, components)),
                            r => r.Bands.IsEmpty ? double.NegativeInfinity : -r.Reserve);
                        floors.Add(point.TakesLargest ? result with { MeasuredAt = label } : result);
                    }
        }
        return new CheckOutcome(separation, limits.Evaluated, notEvaluated)
        {
            Combination = cases?.Rule,
            Zones = zones.ToImmutable(),
            Floors = floors.ToImmutable(),
        };
    }
}
