using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Io.Model;

/// <summary>The model's operating points as the commands and the report read them from a document.</summary>
public static class OperatingLoads
{
    /// <summary>The loads whose running speeds are the operating points: those of the load cases swept, else those the 'harmonic' section selects, else all of them.</summary>
    public static IReadOnlyList<Load> Of(ModelDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        var all = document.Structure.Loads;
        if (document.Cases is { } cases)
        {
            var inCases = cases.Cases.SelectMany(c => c.Loads).ToHashSet();
            return [.. all.Where(l => inCases.Contains(l.Name))];
        }
        var selected = document.Harmonic?.Loads;
        return selected is { IsDefaultOrEmpty: false } names ? [.. all.Where(l => names.Contains(l.Name))] : all;
    }

    /// <summary>Excitation frequencies in Hz an absorber's mode is chosen by: running speeds × orders of criteria.separation and the loads' own running speeds.</summary>
    public static ImmutableArray<double> AbsorberExcitations(ModelDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        var fromCriteria = document.Criteria.Separation is { } sep ? sep.Excitations().Select(e => e.FrequencyHz) : [];
        var fromLoads = Of(document).Where(l => l.SpeedHz is > 0).Select(l => l.SpeedHz!.Value);
        return [.. fromCriteria.Concat(fromLoads).Distinct()];
    }
}
