using ModalChain.Core.Analyses.Transient;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary>What each command does not yet do on plane and 3d models, said before any work (exit 2) instead of failing later.</summary>
internal static class SpatialSupport
{
    /// <summary>
    /// The message refusing <paramref name="command"/> on <paramref name="document"/>, or null when the command runs on it
    /// (always for line models). modes, validate, harmonic, transient, check and report run on plane and 3d models; tune runs
    /// with a host that names a point and a translation; study is refused.
    /// </summary>
    public static string? Refusal(ModelDocument document, string command)
    {
        var network = document.Network;
        if (network.Space == ModelSpace.Line) return null;
        var space = network.Space == ModelSpace.Plane ? "plane" : "3d";
        return command switch
        {
            "study" => $"{document.File}: parameter studies ('study') are not supported for {space} models yet: stepping a spring's stiffness per direction and tracking coupled modes is not implemented",
            _ => null,
        };
    }

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
