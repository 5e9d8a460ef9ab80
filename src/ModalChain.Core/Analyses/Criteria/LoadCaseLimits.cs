using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>Evaluates vibration limits against the combination of load cases at their operating points.</summary>
/// <remarks>
/// Each case gives one component per running speed (<see cref="LoadCaseAnalysis.Components"/>); the components'
/// amplitudes in the limit's measure (peak |Q_k|, or r.m.s. |Q_k|/√2) are combined by the stated
/// <see cref="CaseCombination"/>. For a model without cases the same measures are combined as
/// <see cref="VibrationLimitCheck"/> does: peak by the sum, r.m.s. by the root sum of squares.
/// </remarks>
public static class LoadCaseLimits
{
    /// <summary>The sentence given when no case has a load with a running speed.</summary>
    public const string NoOperatingPoint =
        "no load case has a load with a running speed ('speed:' of a load under 'loads:'), so there is no operating point to check";

    /// <summary>Evaluates <paramref name="limits"/> against the combination of <paramref name="cases"/>.</summary>
    public static LimitOutcome Evaluate(DampedSystem system, LoadCaseSelection cases, IReadOnlyList<VibrationLimit> limits)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(cases);
        ArgumentNullException.ThrowIfNull(limits);
        if (limits.Count == 0) return new LimitOutcome([], []);
        var points = MeasuredResponse.Resolve(system.Model.Network, limits.Select(l => l.At));
        var components = LoadCaseAnalysis.Components(system, cases, MeasuredResponse.Dofs(points.Values));
        var evaluated = ImmutableArray.CreateBuilder<LimitResult>();
        var missing = ImmutableArray.CreateBuilder<(VibrationLimit, string)>();
        foreach (var limit in limits)
        {
            if (points[limit.At] is not { Point: { } point }) missing.Add((limit, points[limit.At].Reason!));
            else if (components[point.Motions[0].Terms[0].Dof].Count == 0) missing.Add((limit, NoOperatingPoint));
            else evaluated.Add(OperatingPointLimits.Evaluate(limit, point, m => Evaluate(limit, MeasuredResponse.Of(m, components), cases.Rule)));
        }
        return new LimitOutcome(evaluated.ToImmutable(), missing.ToImmutable());
    }

    /// <summary>Checks <paramref name="limit"/> against <paramref name="components"/> combined by <paramref name="rule"/>.</summary>
    public static LimitResult Evaluate(VibrationLimit limit, IReadOnlyList<CaseComponent> components, CaseCombination rule)
    {
        ArgumentNullException.ThrowIfNull(limit);
        ArgumentNullException.ThrowIfNull(components);
        var scale = limit.Measure == AmplitudeMeasure.Rms ? 1 / Math.Sqrt(2) : 1;
        var value = LoadCaseAnalysis.Combine(components.Select(c => scale * c.Peak(limit.Quantity)), rule);
        return new LimitResult(limit, value, (limit.Value - value) / limit.Value);
    }

    /// <summary>The components as plain harmonic components (machine zones and floor curves combine them by r.m.s., their published measure).</summary>
    public static IReadOnlyDictionary<string, List<HarmonicComponent>> AsHarmonic(IReadOnlyDictionary<string, List<CaseComponent>> components)
    {
        ArgumentNullException.ThrowIfNull(components);
        return components.ToDictionary(p => p.Key, p => p.Value.Select(c => new HarmonicComponent(c.SpeedHz, c.Displacement)).ToList());
    }
}
