using ModalChain.Core.Model;
using ModalChain.Io.Model;

namespace ModalChain.Cli.Commands;

/// <summary>The operating points of a model, as every command that needs them selects them.</summary>
internal static class OperatingPoints
{
    /// <summary>The loads whose running speeds are the operating points (see <see cref="ModelDocument.OperatingLoads"/>).</summary>
    public static IReadOnlyList<Load> Loads(ModelDocument document) => document.OperatingLoads;
}
