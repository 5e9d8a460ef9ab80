using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Criteria;

/// <summary>The outcome of the vibration limits of a model: those evaluated and those that could not be, with the reason.</summary>
/// <param name="Evaluated">One result per limit that was evaluated, in the order given.</param>
/// <param name="NotEvaluated">Limits that could not be evaluated, each with a sentence saying why.</param>
public sealed record LimitOutcome(ImmutableArray<LimitResult> Evaluated, ImmutableArray<(VibrationLimit Limit, string Reason)> NotEvaluated);

/// <summary>Evaluates vibration limits on the steady-state response at the operating points: each running speed of the loads.</summary>
/// <remarks>
/// The loads that carry a running speed are grouped by speed; each group acts together at its own frequency
/// (HarmonicAnalysis.Sweep, direct method, with the model's damping), and the groups' responses at one mass are
/// combined as harmonics at distinct frequencies by <see cref="VibrationLimitCheck"/>.
/// </remarks>
public static class OperatingPointLimits
{
    /// <summary>Evaluates <paramref name="limits"/> for <paramref name="loads"/> (those with a speed) on <paramref name="system"/>.</summary>
    public static LimitOutcome Evaluate(DampedSystem system, IReadOnlyList<Load> loads, IReadOnlyList<VibrationLimit> limits)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(loads);
        ArgumentNullException.ThrowIfNull(limits);
        if (limits.Count == 0) return new LimitOutcome([], []);
        if (!loads.Any(l => l.SpeedHz is > 0))
            return new LimitOutcome([], [.. limits.Select(l => (l, NoOperatingPoint))]);

        var points = MeasuredResponse.Resolve(system.Model.Network, limits.Select(l => l.At));
        var components = Components(system, loads, MeasuredResponse.Dofs(points.Values))!;
        var evaluated = ImmutableArray.CreateBuilder<LimitResult>();
        var missing = ImmutableArray.CreateBuilder<(VibrationLimit, string)>();
        foreach (var limit in limits)
        {
            if (points[limit.At] is not { Point: { } point }) missing.Add((limit, points[limit.At].Reason!));
            else evaluated.Add(Evaluate(limit, point, m => VibrationLimitCheck.Evaluate(limit, MeasuredResponse.Of(m, components))));
        }
        return new LimitOutcome(evaluated.ToImmutable(), missing.ToImmutable());
    }

    /// <summary>
    /// The result of <paramref name="limit"/> at <paramref name="point"/>: of its one motion, or of the motion with the
    /// largest value when the point is measured in several directions (named in <see cref="LimitResult.MeasuredAt"/>).
    /// </summary>
    internal static LimitResult Evaluate(VibrationLimit limit, MeasuringPoint point, Func<MeasuredMotion, LimitResult> evaluate)
    {
        var (result, label) = MeasuredResponse.Largest(point, evaluate, r => r.Value);
        return point.TakesLargest ? result with { MeasuredAt = label } : result;
    }

    /// <summary>The sentence given when the loads have no running speed, so there is no operating point.</summary>
    public const string NoOperatingPoint =
        "the model has no load with a running speed ('speed:' of a load under 'loads:'), so it has no operating point to check";

    /// <summary>
    /// The steady harmonic components of the displacement of each of <paramref name="masses"/> at the operating points,
    /// one per running speed (ascending); null when no load has a running speed.
    /// </summary>
    public static IReadOnlyDictionary<string, List<HarmonicComponent>>? Components(DampedSystem system, IReadOnlyList<Load> loads, IReadOnlyList<string> masses)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(loads);
        ArgumentNullException.ThrowIfNull(masses);
        var groups = loads.Where(l => l.SpeedHz is > 0).GroupBy(l => l.SpeedHz!.Value).OrderBy(g => g.Key).ToList();
        if (groups.Count == 0) return null;
        var outputs = masses.Distinct().ToArray();
        var components = outputs.ToDictionary(o => o, _ => new List<HarmonicComponent>());
        if (outputs.Length > 0)
            foreach (var group in groups)
            {
                var response = HarmonicAnalysis.Sweep(system, [group.Key], [.. group], outputs, HarmonicMethod.Direct);
                foreach (var o in outputs) components[o].Add(new HarmonicComponent(group.Key, response.ResponseOf(o)!.Displacement[0]));
            }
        return components;
    }

    /// <summary>The smallest reserve over <paramref name="limits"/> (a fraction; −∞ when one cannot be evaluated).</summary>
    public static double WorstReserve(DampedSystem system, IReadOnlyList<Load> loads, IReadOnlyList<VibrationLimit> limits)
    {
        var outcome = Evaluate(system, loads, limits);
        if (!outcome.NotEvaluated.IsEmpty) return double.NegativeInfinity;
        return outcome.Evaluated.IsEmpty ? double.PositiveInfinity : outcome.Evaluated.Min(r => r.Reserve);
    }
}
