using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Harmonic;

/// <summary>How the responses of several load cases are combined at their operating points.</summary>
/// <remarks>
/// Each case contributes one steady harmonic component per running speed of its loads. Components of different
/// cases come from machines whose phases are unrelated, so they are never added as complex amplitudes, even at a
/// shared speed; a rule combines their amplitudes a_k instead.
/// </remarks>
public enum CaseCombination
{
    /// <summary>Σ a_k: the sum of the components' amplitudes, an upper bound of the peak of their sum (reached when the crests coincide).</summary>
    Sum,

    /// <summary>√(Σ a_k²): the square root of the sum of squares, exactly the r.m.s. value of the sum when a_k are r.m.s. values at distinct frequencies.</summary>
    Rms,
}

/// <summary>The load cases a harmonic run sweeps and the rule that combines them.</summary>
/// <param name="Cases">The cases, in the order they were written; at least one.</param>
/// <param name="Rule">How the cases are combined at the operating points.</param>
public sealed record LoadCaseSelection(ImmutableArray<LoadCase> Cases, CaseCombination Rule)
{
    /// <summary>The word naming <paramref name="rule"/> in the model file and every output: "sum" or "rms".</summary>
    public static string Name(CaseCombination rule) => rule == CaseCombination.Sum ? "sum" : "rms";

    /// <summary>A sentence stating what <paramref name="rule"/> computes, printed beside every combined value.</summary>
    public static string Describe(CaseCombination rule) => rule == CaseCombination.Sum
        ? "sum: the amplitudes of the cases' components at their running speeds are added, an upper bound of the peak (the crests of components at different frequencies coincide at some instant, or nearly)"
        : "rms: the square root of the sum of squares of the components' amplitudes, the exact r.m.s. value of the total for components at distinct frequencies (peak values so combined are √2 × that r.m.s., not a bound)";
}

/// <summary>One steady harmonic component of a mass's motion: one case at one of its running speeds.</summary>
/// <param name="Case">Name of the load case.</param>
/// <param name="SpeedHz">Running speed in Hz of the case's loads that produce it.</param>
/// <param name="Displacement">Complex displacement amplitude in m (x(t) = Re(X e^{iωt})).</param>
public readonly record struct CaseComponent(string Case, double SpeedHz, Complex Displacement)
{
    /// <summary>Peak amplitude of <paramref name="quantity"/>: |X|·ω^p with p = 0, 1, 2 (m, m/s, m/s²).</summary>
    public double Peak(ResponseQuantity quantity)
    {
        var omega = 2 * Math.PI * SpeedHz;
        return Displacement.Magnitude * quantity switch
        {
            ResponseQuantity.Displacement => 1,
            ResponseQuantity.Velocity => omega,
            _ => omega * omega,
        };
    }
}

/// <summary>The components of one mass's motion at every case's operating points and their combination.</summary>
/// <param name="Dof">Name of the mass.</param>
/// <param name="Components">One per case and running speed, in case order then ascending speed.</param>
public sealed record CombinedResponse(string Dof, ImmutableArray<CaseComponent> Components)
{
    /// <summary>The combined peak amplitude of <paramref name="quantity"/> by <paramref name="rule"/> (SI).</summary>
    public double Peak(ResponseQuantity quantity, CaseCombination rule) => LoadCaseAnalysis.Combine(Components.Select(c => c.Peak(quantity)), rule);

    /// <summary>The combined r.m.s. amplitude of <paramref name="quantity"/> by <paramref name="rule"/> (SI): the rule applied to the components' r.m.s. values, peak/√2.</summary>
    public double Rms(ResponseQuantity quantity, CaseCombination rule) => LoadCaseAnalysis.Combine(Components.Select(c => c.Peak(quantity) / Math.Sqrt(2)), rule);
}

/// <summary>One load case's sweep: exactly the sweep of its loads alone.</summary>
/// <param name="Case">The case.</param>
/// <param name="Result">The sweep with the operating points at the case's running speeds.</param>
public sealed record CaseSweep(LoadCase Case, HarmonicResult Result);

/// <summary>The sweeps of several load cases and their combination at the operating points.</summary>
/// <param name="Cases">One sweep per case, in case order.</param>
/// <param name="Rule">The combination rule.</param>
/// <param name="Combined">Per output mass, the components at every case's operating points.</param>
/// <param name="Notes">Facts about the combination a reviewer should read (cases without a running speed).</param>
public sealed record LoadCaseResult(ImmutableArray<CaseSweep> Cases, CaseCombination Rule, ImmutableArray<CombinedResponse> Combined, ImmutableArray<string> Notes);

/// <summary>Sweeps each load case on its own and combines the cases at their operating points by a stated rule.</summary>
/// <remarks>
/// Case c is swept exactly as <see cref="HarmonicAnalysis.Solve(DampedSystem, HarmonicSpec)"/> with its loads alone.
/// At each running speed Ω of a case the loads of that case running at Ω act together (complex sum) and give one
/// component X_c(Ω) per mass. A quantity with peak amplitudes a_k = |X_k|·Ω_k^p of the components (p = 0, 1, 2 for
/// displacement, velocity, acceleration) combines to Σ a_k by the sum rule and √(Σ a_k²) by the rms rule; r.m.s.
/// amplitudes use a_k/√2. For components at distinct frequencies q(t) = Σ a_k cos(Ω_k t + φ_k) has mean square
/// Σ a_k²/2 exactly, and |q(t)| ≤ Σ a_k at every instant, so the sum rule bounds the peak from above.
/// </remarks>
public static class LoadCaseAnalysis
{
    /// <summary>Sweeps every case of <paramref name="cases"/> with the frequencies, outputs and method of <paramref name="spec"/> (its 'loads' ignored).</summary>
    public static LoadCaseResult Solve(DampedSystem system, HarmonicSpec spec, LoadCaseSelection cases)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(cases);
        if (cases.Cases.IsDefaultOrEmpty) throw new ArgumentException("A load case selection needs at least one case.", nameof(cases));
        var sweeps = ImmutableArray.CreateBuilder<CaseSweep>();
        foreach (var c in cases.Cases)
        {
            if (c.Loads.IsDefaultOrEmpty) throw new ArgumentException($"Load case '{c.Name}' has no loads.", nameof(cases));
            sweeps.Add(new CaseSweep(c, HarmonicAnalysis.Solve(system, spec with { Loads = c.Loads })));
        }
        var outputs = sweeps[0].Result.Responses.Select(r => r.Dof).ToArray();
        var combined = outputs.Select(dof => new CombinedResponse(dof,
            [.. sweeps.SelectMany(s => s.Result.OperatingPoints.Select(op =>
                new CaseComponent(s.Case.Name, op.SpeedHz, op.Response.ResponseOf(dof)!.Displacement[0])))])).ToImmutableArray();
        var notes = sweeps.Where(s => s.Result.OperatingPoints.IsEmpty)
            .Select(s => $"load case '{s.Case.Name}' has no load with a running speed: it has no operating point and adds nothing to the combination")
            .ToImmutableArray();
        return new LoadCaseResult(sweeps.ToImmutable(), cases.Rule, combined, notes);
    }

    /// <summary>The components of the displacement of each of <paramref name="masses"/> at every case's operating points (direct method), one list per mass; cases without a running speed add none.</summary>
    public static IReadOnlyDictionary<string, List<CaseComponent>> Components(DampedSystem system, LoadCaseSelection cases, IReadOnlyList<string> masses)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(cases);
        ArgumentNullException.ThrowIfNull(masses);
        var outputs = masses.Distinct().ToArray();
        var components = outputs.ToDictionary(o => o, _ => new List<CaseComponent>());
        if (outputs.Length == 0) return components;
        foreach (var c in cases.Cases)
        {
            var loads = c.Loads.Select(n => system.Model.FindLoad(n) ?? throw new ArgumentException($"Load case '{c.Name}' names '{n}', which is not a load of the model.", nameof(cases))).ToArray();
            foreach (var group in loads.Where(l => l.SpeedHz is > 0).GroupBy(l => l.SpeedHz!.Value).OrderBy(g => g.Key))
            {
                var response = HarmonicAnalysis.Sweep(system, [group.Key], [.. group], outputs, HarmonicMethod.Direct);
                foreach (var o in outputs) components[o].Add(new CaseComponent(c.Name, group.Key, response.ResponseOf(o)!.Displacement[0]));
            }
        }
        return components;
    }

    /// <summary>Combines non-negative amplitudes by <paramref name="rule"/>: Σ a_k or √(Σ a_k²); 0 for none.</summary>
    public static double Combine(IEnumerable<double> amplitudes, CaseCombination rule)
    {
        ArgumentNullException.ThrowIfNull(amplitudes);
        double sum = 0, squares = 0;
        foreach (var a in amplitudes)
        {
            sum += a;
            squares += a * a;
        }
        return rule == CaseCombination.Sum ? sum : Math.Sqrt(squares);
    }

    /// <summary>Short text such as "2 load cases (exhaust-fan, supply-fan) combined by the sum rule".</summary>
    public static string Summary(LoadCaseSelection cases)
    {
        ArgumentNullException.ThrowIfNull(cases);
        return string.Create(CultureInfo.InvariantCulture,
            $"{cases.Cases.Length} load case{(cases.Cases.Length == 1 ? "" : "s")} ({string.Join(", ", cases.Cases.Select(c => c.Name))}) combined by the {LoadCaseSelection.Name(cases.Rule)} rule");
    }
}
