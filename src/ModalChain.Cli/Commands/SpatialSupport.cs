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
    /// (always for line models). modes, validate, harmonic and report run on plane and 3d models; transient runs free
    /// vibration and loads that carry a direction; check runs separation criteria; study runs; tune is refused.
    /// </summary>
    public static string? Refusal(ModelDocument document, string command)
    {
        var network = document.Network;
        if (network.Space == ModelSpace.Line) return null;
        var space = network.Space == ModelSpace.Plane ? "plane" : "3d";
        return command switch
        {
            "tune" => $"{document.File}: absorber design ('tune') is not supported for {space} models yet: a tuned mass acts along one line, and choosing its direction on a rigid body is not implemented; design it on a line model of the host's dominant motion",
            "check" when !document.Criteria.Limits.IsDefaultOrEmpty || !document.Criteria.Zones.IsDefaultOrEmpty || !document.Criteria.Floors.IsDefaultOrEmpty =>
                $"{document.File}: vibration limits, machine zones and floor criteria are not supported for {space} models yet (they name a mass but not the direction to check); only the 'separation' criterion is checked on {space} models",
            "transient" when document.TimedLoads.FirstOrDefault(Undirected) is { } load =>
                $"{document.File}: load '{load.Name}' has a 'time' function, but timed loads of {space} models are not read with a direction yet; run the harmonic response, or a transient from 'initial' conditions only",
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

    private static bool Undirected(TransientExcitation load) => load switch
    {
        ForceHistory f => f.Direction == Direction.Along,
        SupportAccelerationHistory s => s.Direction == Direction.Along,
        _ => false,
    };
}
