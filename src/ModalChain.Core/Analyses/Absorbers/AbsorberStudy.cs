using System.Globalization;
using ModalChain.Core.Analyses.Modal;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Absorbers;

/// <summary>An absorber sized, optionally refined, and judged on the full model: what <c>tune</c> prints and reports show.</summary>
/// <param name="Design">The design retained (the closed form, or the optimised one when it is better).</param>
/// <param name="Method">"den-hartog", "warburton" or "optimal".</param>
/// <param name="Names">Names of the absorber's mass, spring and damper in the model with the absorber attached.</param>
/// <param name="Assessment">Peaks before and after, stroke and mistuning on the full model.</param>
/// <param name="Improvement">For the optimal method: the improvement over the closed form, in words; otherwise null.</param>
public sealed record TunedAbsorber(AbsorberDesign Design, string Method, AbsorberNames Names, AbsorberAssessment Assessment, string? Improvement);

/// <summary>Sizes an absorber from a request and judges it on the full model (the one path shared by <c>tune</c> and the report).</summary>
public static class AbsorberStudy
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Designs, optionally optimises, and assesses the absorber of <paramref name="request"/>.</summary>
    /// <param name="structure">The model (SI).</param>
    /// <param name="modal">Its modes (mass-normalised shapes).</param>
    /// <param name="request">A request with no <see cref="AbsorberTuning.Problems"/>.</param>
    /// <param name="optimal">True to refine the closed form numerically on the full model.</param>
    /// <param name="operatingLoads">Loads whose running speeds give the stroke in operation.</param>
    public static TunedAbsorber Run(StructuralModel structure, ModalResult modal, AbsorberRequest request, bool optimal, IReadOnlyList<Load> operatingLoads)
    {
        ArgumentNullException.ThrowIfNull(structure);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(operatingLoads);
        var closedForm = AbsorberTuning.Design(modal, request);
        var names = AbsorberTuning.FreeNames(structure.Network, closedForm.Host);
        var design = closedForm;
        string? improvement = null;
        var method = request.Target == AbsorberTarget.Force ? "den-hartog" : "warburton";
        if (optimal)
        {
            var closedPeak = AbsorberPerformance.WorstPeak(AbsorberPerformance.With(structure, closedForm, names), closedForm).Peak;
            var (optimised, evaluations) = AbsorberPerformance.Optimise(structure, closedForm, names);
            var optimisedPeak = AbsorberPerformance.WorstPeak(AbsorberPerformance.With(structure, optimised, names), optimised).Peak;
            if (optimisedPeak <= closedPeak) design = optimised with { ChosenBy = closedForm.ChosenBy };
            improvement = string.Create(Inv,
                $"worst host peak {Math.Min(optimisedPeak, closedPeak):G6} against {closedPeak:G6} with the closed form ({100 * (1 - Math.Min(optimisedPeak, closedPeak) / closedPeak):F2} % lower; {evaluations} response evaluations)");
            method = "optimal";
        }
        var assessment = AbsorberPerformance.Assess(structure, design, names) with
        {
            OperatingStroke = AbsorberPerformance.OperatingStroke(structure, design, names, operatingLoads),
        };
        return new TunedAbsorber(design, method, names, assessment, improvement);
    }
}
