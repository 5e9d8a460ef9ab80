using System.Collections.Immutable;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>Judges an absorber on the full network (all modes, the model's own damping) and refines its tuning numerically.</summary>
/// <remarks>
/// The measure is the host's dynamic amplification |x_host|·K/|F| for a harmonic force F at the host, with K = M ω_p²
/// the modal stiffness of the controlled mode (M its modal mass at the host), so that for a one-mass primary it is
/// the classical |X₁|k/F of Den Hartog (1956). Its worst value over the band [0.5 f_p, 1.5 f_p] is found by a
/// refined sweep whose every local maximum is then refined by golden-section search.
/// The optimal tuning minimises that worst peak over the absorber's frequency and damping ratio (its mass is fixed by
/// μ), by the Nelder–Mead simplex method (Nelder &amp; Mead 1965) on (ln f_a, ln ζ_a) from the closed form.
/// </remarks>
public static class AbsorberPerformance
{
    /// <summary>Frequency errors of the mistuning table: ±5 % and ±10 %.</summary>
    public static readonly ImmutableArray<double> MistuningErrors = [-0.10, -0.05, 0.05, 0.10];

    private const int BandPoints = 240;

    /// <summary>The band searched for peaks around the controlled mode, Hz.</summary>
    public static (double Low, double High) Band(AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(design);
        return (0.5 * design.ModeFrequencyHz, 1.5 * design.ModeFrequencyHz);
    }

    /// <summary>Worst amplification of the host over the band for <paramref name="model"/> (with or without an absorber).</summary>
    /// <remarks>
    /// A tuned absorber leaves two (or more) nearly equal peaks, and an optimiser will exploit any peak that is only
    /// sampled: HarmonicAnalysis.PeakResponse refines every local maximum of its sweep and returns the largest.
    /// </remarks>
    /// <returns>The amplification and its frequency in Hz; +∞ when the response is unbounded (an undamped resonance in the band).</returns>
    public static (double Peak, double FrequencyHz) WorstPeak(StructuralModel model, AbsorberDesign design)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(design);
        var (lo, hi) = Band(design);
        var system = DampedSystem.Build(model);
        var peak = HarmonicAnalysis.PeakResponse(system, [UnitForce(design.Host)], design.Host, lo, hi, BandPoints);
        return (peak.Magnitude * ModalStiffness(design), peak.FrequencyHz);
    }

    /// <summary>Peaks before and after, stroke at the worst frequency and the mistuning table of <paramref name="design"/> on <paramref name="model"/>.</summary>
    /// <remarks>The peak before is +∞ when the controlled mode has no damping in the model (an unbounded resonance).</remarks>
    public static AbsorberAssessment Assess(StructuralModel model, AbsorberDesign design, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(names);
        var before = SafePeak(model, design);
        var withAbsorber = With(model, design, names);
        var after = WorstPeak(withAbsorber, design);
        var stroke = double.NaN;
        if (double.IsFinite(after.Peak))
        {
            var response = HarmonicAnalysis.Sweep(DampedSystem.Build(withAbsorber), [after.FrequencyHz], [UnitForce(design.Host)],
                [design.Host, names.Mass], HarmonicMethod.Direct);
            stroke = (response.ResponseOf(names.Mass)!.Displacement[0] - response.ResponseOf(design.Host)!.Displacement[0]).Magnitude;
        }
        var mistuning = MistuningErrors.Select(e =>
            new MistuningPoint(e, WorstPeak(With(model, design.Retuned(design.FrequencyHz * (1 + e), design.DampingRatio), names), design).Peak));
        return new AbsorberAssessment(Band(design), before.Peak, after.Peak, after.FrequencyHz, stroke, [.. mistuning]);
    }

    /// <summary>The absorber frequency and damping ratio that minimise the worst host peak, from <paramref name="start"/>.</summary>
    /// <returns>The refined design and the number of response evaluations used.</returns>
    public static (AbsorberDesign Design, int Evaluations) Optimise(StructuralModel model, AbsorberDesign start, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(start);
        ArgumentNullException.ThrowIfNull(names);
        var evaluations = 0;
        double Objective(double[] p)
        {
            evaluations++;
            var d = start.Retuned(start.FrequencyHz * Math.Exp(p[0]), start.DampingRatio * Math.Exp(p[1]));
            var peak = WorstPeak(With(model, d, names), start).Peak;
            return double.IsFinite(peak) ? peak : double.MaxValue;
        }
        var best = NelderMead(Objective, [0, 0], [0.02, 0.2], relativeTolerance: 1e-9, maxEvaluations: 400);
        var design = start.Retuned(start.FrequencyHz * Math.Exp(best[0]), start.DampingRatio * Math.Exp(best[1]));
        return (design, evaluations);
    }

    /// <summary>The absorber's stroke (peak relative displacement to the host, m) under the model's own loads at their running speeds.</summary>
    /// <remarks>Loads are grouped by speed as for vibration limits; strokes at distinct speeds add as a peak bound Σ|X_a − X_h|. NaN when no load has a speed.</remarks>
    public static double OperatingStroke(StructuralModel model, AbsorberDesign design, AbsorberNames names, IReadOnlyList<Load> loads)
    {
        ArgumentNullException.ThrowIfNull(loads);
        var groups = loads.Where(l => l.SpeedHz is > 0).GroupBy(l => l.SpeedHz!.Value).ToList();
        if (groups.Count == 0) return double.NaN;
        var system = DampedSystem.Build(With(model, design, names));
        var stroke = 0.0;
        foreach (var g in groups)
        {
            var r = HarmonicAnalysis.Sweep(system, [g.Key], [.. g], [design.Host, names.Mass], HarmonicMethod.Direct);
            stroke += (r.ResponseOf(names.Mass)!.Displacement[0] - r.ResponseOf(design.Host)!.Displacement[0]).Magnitude;
        }
        return stroke;
    }

    /// <summary><paramref name="model"/> with the absorber of <paramref name="design"/> attached.</summary>
    public static StructuralModel With(StructuralModel model, AbsorberDesign design, AbsorberNames names)
    {
        ArgumentNullException.ThrowIfNull(model);
        return model with { Network = AbsorberTuning.Attach(model.Network, design, names) };
    }

    private static (double Peak, double FrequencyHz) SafePeak(StructuralModel model, AbsorberDesign design)
    {
        // An undamped controlled mode has an unbounded resonance: say so rather than report the largest sampled value.
        var ratios = DampedSystem.Build(model).ModalDampingRatios;
        var ratio = design.ModeNumber <= ratios.Length ? ratios[design.ModeNumber - 1] : double.NaN;
        if (!(ratio > 0)) return (double.PositiveInfinity, design.ModeFrequencyHz);
        try { return WorstPeak(model, design); }
        catch (NumericalFailureException) { return (double.PositiveInfinity, design.ModeFrequencyHz); }
    }

    private static double ModalStiffness(AbsorberDesign d) => d.ModalMass * Math.Pow(2 * Math.PI * d.ModeFrequencyHz, 2);

    private static ForceLoad UnitForce(string host) => new("unit force at the host", host, 1, 0);

    /// <summary>Nelder–Mead simplex minimisation (Nelder &amp; Mead 1965) with the standard coefficients 1, 2, ½, ½.</summary>
    internal static double[] NelderMead(Func<double[], double> f, double[] start, double[] steps, double relativeTolerance, int maxEvaluations)
    {
        var n = start.Length;
        var simplex = new double[n + 1][];
        var values = new double[n + 1];
        simplex[0] = (double[])start.Clone();
        for (var i = 0; i < n; i++)
        {
            simplex[i + 1] = (double[])start.Clone();
            simplex[i + 1][i] += steps[i];
        }
        var used = 0;
        for (var i = 0; i <= n; i++) { values[i] = f(simplex[i]); used++; }
        while (used < maxEvaluations)
        {
            var order = Enumerable.Range(0, n + 1).OrderBy(i => values[i]).ToArray();
            simplex = [.. order.Select(i => simplex[i])];
            values = [.. order.Select(i => values[i])];
            if (Math.Abs(values[n] - values[0]) <= relativeTolerance * Math.Abs(values[0])
                && simplex.All(x => x.Zip(simplex[0]).All(p => Math.Abs(p.First - p.Second) < 1e-9))) break;
            var centroid = new double[n];
            for (var i = 0; i < n; i++) for (var j = 0; j < n; j++) centroid[j] += simplex[i][j] / n;
            double[] Along(double t) => [.. centroid.Select((c, j) => c + t * (simplex[n][j] - c))];
            var reflected = Along(-1);
            var fr = f(reflected); used++;
            if (fr < values[0])
            {
                var expanded = Along(-2);
                var fe = f(expanded); used++;
                if (fe < fr) { simplex[n] = expanded; values[n] = fe; }
                else { simplex[n] = reflected; values[n] = fr; }
            }
            else if (fr < values[n - 1]) { simplex[n] = reflected; values[n] = fr; }
            else
            {
                var contracted = fr < values[n] ? Along(-0.5) : Along(0.5);
                var fc = f(contracted); used++;
                if (fc < Math.Min(fr, values[n])) { simplex[n] = contracted; values[n] = fc; }
                else
                {
                    for (var i = 1; i <= n; i++)
                    {
                        simplex[i] = [.. simplex[i].Select((x, j) => simplex[0][j] + 0.5 * (x - simplex[0][j]))];
                        values[i] = f(simplex[i]); used++;
                    }
                }
            }
        }
        return simplex[Enumerable.Range(0, n + 1).MinBy(i => values[i])];
    }
}
