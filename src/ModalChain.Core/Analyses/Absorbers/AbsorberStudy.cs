using System.Collections.Immutable;
using System.Globalization;
using ModalChain.Core.Analyses.Harmonic;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>An absorber sized, optionally refined, and judged on the full model: what <c>tune</c> prints and reports show.</summary>
/// <param name="Design">The design retained (the closed form, or the optimised one when it is better).</param>
/// <param name="Method">The method actually used: "den-hartog", "warburton", "optimal" or "running-speed".</param>
/// <param name="Names">Names of the absorber's mass, spring and damper in the model with the absorber attached.</param>
/// <param name="Assessment">Peaks before and after, stroke and mistuning on the full model.</param>
/// <param name="Improvement">For the optimal and running-speed methods: the improvement over the closed form, in words; otherwise null.</param>
public sealed record TunedAbsorber(AbsorberDesign Design, string Method, AbsorberNames Names, AbsorberAssessment Assessment, string? Improvement)
{
    /// <summary>The method actually used, in words (which closed form, or what was minimised and from where).</summary>
    public string MethodDescription { get; init; } = "";

    /// <summary>Facts a user must read before trusting the design: neighbouring modes, an absorber moved off the target mode, peaks on a band edge, a worse response at a running speed.</summary>
    public ImmutableArray<string> Warnings { get; init; } = [];
}

/// <summary>Sizes an absorber from a request and judges it on the full model (the one path shared by <c>tune</c> and the report).</summary>
public static class AbsorberStudy
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Designs, optionally optimises, and assesses the absorber of <paramref name="request"/>.</summary>
    /// <param name="structure">The model (SI).</param>
    /// <param name="modal">Its modes (mass-normalised shapes).</param>
    /// <param name="request">A request with no <see cref="AbsorberTuning.Problems"/>.</param>
    /// <param name="optimal">True to refine the closed form numerically on the full model (band target); the running-speed target is always numerical.</param>
    /// <param name="operatingLoads">Loads whose running speeds give the stroke in operation (used when <paramref name="cases"/> is null).</param>
    /// <param name="cases">The model's load cases and their rule, or null: when set, the stroke in operation is each case's on its own, combined by the rule.</param>
    public static TunedAbsorber Run(StructuralModel structure, ModalResult modal, AbsorberRequest request, bool optimal, IReadOnlyList<Load> operatingLoads, LoadCaseSelection? cases = null)
    {
        ArgumentNullException.ThrowIfNull(structure);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(operatingLoads);
        var closedForm = AbsorberTuning.Design(modal, request);
        var names = AbsorberTuning.FreeNames(structure.Network, closedForm.Host);
        var design = closedForm;
        string? improvement = null;
        string method, description;
        if (request.Target == AbsorberTarget.RunningSpeed)
        {
            // The classical design to beat: Den Hartog's fixed points for the same mass.
            var denHartog = AbsorberTuning.Design(modal, request with { Target = AbsorberTarget.Force });
            var dhValue = AbsorberPerformance.SpeedObjective(AbsorberPerformance.With(structure, denHartog, names), closedForm);
            var (found, value, evaluations) = AbsorberPerformance.OptimiseForSpeed(structure, closedForm, denHartog, names);
            design = found;
            method = "running-speed";
            var speeds = string.Join(", ", closedForm.ExcitationsHz.Select(f => f.ToString("G6", Inv)));
            description = string.Create(Inv, $"minimum of the worst host response at the running speed(s) {speeds} Hz ± {request.SpeedTolerance * 100:G3} % on the full model")
                + ", searched from the undamped absorber tuned to the speed (Den Hartog 1956 §3.2) and Den Hartog's fixed points";
            improvement = string.Create(Inv,
                $"worst host amplification over the speed band {value:G6} against {dhValue:G6} with Den Hartog's fixed points ({evaluations} response evaluations)");
        }
        else
        {
            method = request.Target == AbsorberTarget.Force ? "den-hartog" : "warburton";
            description = ClosedFormName(request.Target);
            if (optimal)
            {
                var closedPeak = AbsorberPerformance.DesignPeak(AbsorberPerformance.BandPeak(AbsorberPerformance.With(structure, closedForm, names), closedForm));
                var (optimised, evaluations) = AbsorberPerformance.Optimise(structure, closedForm, names);
                var optimisedPeak = AbsorberPerformance.DesignPeak(AbsorberPerformance.BandPeak(AbsorberPerformance.With(structure, optimised, names), optimised));
                var better = optimisedPeak <= closedPeak;
                if (better)
                {
                    design = optimised with { ChosenBy = closedForm.ChosenBy };
                    method = "optimal";
                    description = "minimum of the worst host peak in the controlled mode's band on the full model, searched from " + ClosedFormName(request.Target);
                }
                else description += " (the numerical search found nothing better, so the closed form is kept)";
                improvement = string.Create(Inv,
                    $"worst host peak {Math.Min(optimisedPeak, closedPeak):G6} against {closedPeak:G6} with the closed form ({100 * (1 - Math.Min(optimisedPeak, closedPeak) / closedPeak):F2} % lower; {evaluations} response evaluations)");
            }
        }
        var assessment = AbsorberPerformance.Assess(structure, design, names) with
        {
            OperatingStroke = cases is null
                ? AbsorberPerformance.OperatingStroke(structure, design, names, operatingLoads)
                : AbsorberPerformance.OperatingStroke(structure, design, names, cases),
            OperatingStrokeBasis = cases is null ? AbsorberPerformance.LoadsBasis : AbsorberPerformance.CasesBasis(cases),
        };
        return new TunedAbsorber(design, method, names, assessment, improvement)
        {
            MethodDescription = description,
            Warnings = Warnings(design, assessment),
        };
    }

    /// <summary>The closed form used for <paramref name="target"/>, in words.</summary>
    public static string ClosedFormName(AbsorberTarget target) => target switch
    {
        AbsorberTarget.Force => "Den Hartog's fixed points (closed form, Den Hartog 1956)",
        AbsorberTarget.BaseAcceleration => "Warburton's closed form for harmonic base acceleration (Warburton 1982)",
        AbsorberTarget.RandomForce => "Warburton's closed form for a white-noise force (Warburton 1982)",
        _ => "the undamped absorber tuned to the running speed (Den Hartog 1956 §3.2)",
    };

    private static ImmutableArray<string> Warnings(AbsorberDesign d, AbsorberAssessment a)
    {
        var warnings = ImmutableArray.CreateBuilder<string>();
        foreach (var n in a.Neighbours)
            warnings.Add(string.Create(Inv,
                $"mode {n.ModeNumber} at {n.FrequencyHz:F3} Hz lies within the band {a.BandHz.Low:F3}-{a.BandHz.High:F3} Hz of mode {d.ModeNumber} ({d.ModeFrequencyHz:F3} Hz): its peaks are told apart by mode shape and left out of the peak after; " +
                $"the absorber does not control mode {n.ModeNumber} (its peak {Number(n.PeakBefore)} before, {Number(n.PeakAfter)} after)"));
        var owner = AbsorberPerformance.ModeOf(d, d.FrequencyHz);
        if (owner != d.ModeNumber)
            warnings.Add(string.Create(Inv,
                $"the absorber is tuned to {d.FrequencyHz:F3} Hz, in the band of mode {owner} ({d.ModelFrequenciesHz[owner - 1]:F3} Hz), not of mode {d.ModeNumber} it was sized for ({d.ModeFrequencyHz:F3} Hz)"));
        if (a.PeakAfterMode != d.ModeNumber)
            warnings.Add($"the peak after belongs to mode {a.PeakAfterMode}, not to mode {d.ModeNumber}");
        if (a.PeakBeforeRisingAt != SweepEdge.None)
            warnings.Add($"without the absorber the response of mode {d.ModeNumber} is still rising at the {Edge(a.PeakBeforeRisingAt)} of the band {Range(a)}: the peak shown is the largest inside it");
        if (a.PeakAfterRisingAt != SweepEdge.None)
            warnings.Add($"with the absorber the response of mode {d.ModeNumber} is still rising at the {Edge(a.PeakAfterRisingAt)} of the band {Range(a)}: its peak lies outside the band, and the peak shown is the largest inside it");
        if (a.PeakAfter > a.PeakBefore)
            warnings.Add(string.Create(Inv, $"the peak in the band is higher with the absorber ({Number(a.PeakAfter)}) than without ({Number(a.PeakBefore)}): starting, stopping or a change of speed passes through it"));
        foreach (var s in a.AtSpeeds.Where(s => s.After > s.Before))
            warnings.Add(string.Create(Inv, $"at the excitation {s.FrequencyHz:G6} Hz the host responds more with the absorber ({Number(s.After)}) than without ({Number(s.Before)})"));
        return warnings.ToImmutable();

        static string Edge(SweepEdge e) => e == SweepEdge.Start ? "low end" : "high end";
        static string Range(AbsorberAssessment a) => string.Create(Inv, $"{a.BandHz.Low:F3}-{a.BandHz.High:F3} Hz");
        static string Number(double v) => double.IsNaN(v) ? "none in the band" : double.IsFinite(v) ? v.ToString("G4", Inv) : "unbounded";
    }
}
