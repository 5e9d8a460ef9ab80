using ModalChain.Core.Dofs;
using ModalChain.Core.Model;

namespace ModalChain.Cli.Commands;

/// <summary>Output names on line, plane and 3d models: which names match nothing, and how to say so.</summary>
internal static class SpatialSupport
{
    /// <summary>
    /// The output names of <paramref name="names"/> that match nothing: in line models names that are not masses; in plane and 3d
    /// models names that are neither a DOF label (<c>skid.z</c>) nor a mass or body (which stands for all its DOFs).
    /// </summary>
    public static string[] UnknownOutputs(Network network, IEnumerable<string> names)
    {
        if (network.Space == ModelSpace.Line) return [.. names.Where(o => !network.IsMass(o))];
        var dofs = DofMap.For(network);
        return [.. names.Where(o => dofs.OutputLabels(o).IsEmpty)];
    }

    /// <summary>"is not a mass" (line models) or "is not a DOF label (skid.z), mass or body" (plane and 3d), plural for several.</summary>
    public static string NotOutputs(Network network, int count) => network.Space == ModelSpace.Line
        ? count == 1 ? "is not a mass" : "are not masses"
        : count == 1 ? "is not a DOF label (such as 'mass.z'), mass or body" : "are not DOF labels (such as 'mass.z'), masses or bodies";

}
