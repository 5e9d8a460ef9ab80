using System.Globalization;
using ModalChain.Core.Model;

namespace ModalChain.Reports.Sections;

/// <summary>How many elements of each kind a network holds, as the model summary states them.</summary>
/// <param name="Bodies">Rigid bodies (plane and 3d models).</param>
/// <param name="Masses">Entries of <see cref="Network.Masses"/>: point masses, massless nodes (a mount's inner node among them) and electrical nodes.</param>
/// <param name="Springs">Springs, a mount's springs included.</param>
/// <param name="Dampers">Dampers, a mount's damper included.</param>
/// <param name="Inerters">Inerters.</param>
/// <param name="Mounts">Mounts written by name, counted by the inner node each one adds (see <see cref="MountExpansion"/>).</param>
/// <param name="Transducers">Transducers (line models).</param>
public sealed record ModelCounts(int Bodies, int Masses, int Springs, int Dampers, int Inerters, int Mounts, int Transducers)
{
    private static readonly string InnerSuffix = MountExpansion.InnerNode("");

    /// <summary>The counts of <paramref name="network"/>.</summary>
    public static ModelCounts Of(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return new ModelCounts(network.Bodies.Length, network.Masses.Length, network.Springs.Length, network.Dampers.Length,
            network.Inerters.Length, network.Masses.Count(m => m.Kilograms == 0 && m.Name.EndsWith(InnerSuffix, StringComparison.Ordinal)),
            network.Transducers.Length);
    }

    /// <summary>
    /// One phrase for a figure's header: "2 masses, 3 springs, 1 damper", with bodies first in plane and 3d models and
    /// inerters, mounts and transducers after, each only when the model has one.
    /// </summary>
    public string Phrase(bool withBodies)
    {
        var parts = new List<string>();
        if (withBodies) parts.Add(Count(Bodies, "body", "bodies"));
        parts.Add(Count(Masses, "mass", "masses"));
        parts.Add(Count(Springs, "spring", "springs"));
        parts.Add(Count(Dampers, "damper", "dampers"));
        if (Inerters > 0) parts.Add(Count(Inerters, "inerter", "inerters"));
        if (Mounts > 0) parts.Add(Count(Mounts, "mount", "mounts"));
        if (Transducers > 0) parts.Add(Count(Transducers, "transducer", "transducers"));
        return string.Join(", ", parts);
    }

    /// <summary>The facts-table row for the elements beyond masses, springs and dampers; null when the model has none of them.</summary>
    public (string Name, string Value)? ExtraFact()
    {
        if (Inerters == 0 && Mounts == 0 && Transducers == 0) return null;
        var value = string.Create(CultureInfo.InvariantCulture, $"{Inerters}, {Mounts}, {Transducers}");
        if (Mounts > 0) value += " (each mount is also counted as the massless node, springs and damper it expands into)";
        return ("Inerters, mounts, transducers", value);
    }

    private static string Count(int n, string one, string many) => n.ToString(CultureInfo.InvariantCulture) + " " + (n == 1 ? one : many);
}
