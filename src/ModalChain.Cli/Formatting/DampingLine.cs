using System.Globalization;
using ModalChain.Core.Assembly;

namespace ModalChain.Cli.Formatting;

/// <summary>The "Damping:" line of the harmonic and transient tables: what damping the model declares, in one line.</summary>
internal static class DampingLine
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The model's damping for a frequency-domain table: the loss factor counts, and the first modal ratios follow.</summary>
    public static string ForSweep(DampedSystem system)
    {
        var parts = Parts(system, lossFactorNote: "");
        if (parts.Count == 0) return "none";
        // The condensed undamped modes of a model with first-order states have no damping ratio (docs/methods.md).
        if (system.HasFirstOrderStates) return string.Join(", ", parts) + Classical(system) + "; massless nodes with damping are first-order states (their damped roots: `modes`)";
        var ratios = system.ModalDampingRatios.Where(double.IsFinite).Select(z => (100 * z).ToString("F2", Inv) + " %").Take(6);
        return string.Join(", ", parts) + Classical(system) + "; modal ratios " + string.Join(", ", ratios);
    }

    /// <summary>The model's damping for a time-history table: a loss factor has no time-domain form and says so.</summary>
    public static string ForHistory(DampedSystem system)
    {
        var parts = Parts(system, lossFactorNote: " (not used in time histories)");
        return parts.Count == 0 ? "none" : string.Join(", ", parts) + Classical(system);
    }

    private static List<string> Parts(DampedSystem system, string lossFactorNote)
    {
        var d = system.Model.Damping;
        var parts = new List<string>();
        if (system.Model.Network.Dampers.Length > 0) parts.Add($"{system.Model.Network.Dampers.Length} discrete damper(s)");
        if (!d.ModalRatios.IsDefaultOrEmpty) parts.Add("modal " + string.Join("/", d.ModalRatios.Select(z => (100 * z).ToString("G3", Inv) + " %")));
        if (d.Rayleigh is { } r) parts.Add(string.Create(Inv, $"Rayleigh a0 = {r.MassCoefficient:G4} 1/s, a1 = {r.StiffnessCoefficient:G4} s"));
        if (d.LossFactor > 0) parts.Add(string.Create(Inv, $"loss factor {d.LossFactor:G3}") + lossFactorNote);
        return parts;
    }

    private static string Classical(DampedSystem system) => system.IsClassical ? "" : " (not classical)";
}
