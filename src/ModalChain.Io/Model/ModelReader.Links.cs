using ModalChain.Core.Model;
using ModalChain.Io.Yaml;
using CoreNetwork = ModalChain.Core.Model.Network;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    /// <summary>Reads 'links': masses tied rigidly together, which then share one degree of freedom.</summary>
    /// <remarks>
    /// <c>links: {skid-on-frame: [skid, frame]}</c>: each entry lists two or more different masses. A support cannot be
    /// linked (it is already fixed; a mass held rigidly is better declared as a support).
    /// </remarks>
    private static List<(string Name, string[] Masses)> ReadLinks(YMapping top, ReadContext context, IReadOnlySet<string> masses, IReadOnlySet<string> nodes)
    {
        var result = new List<(string, string[])>();
        if (top["links"] is not { } node || node is YScalar { IsPlainNull: true }) return result;
        if (context.Mapping(node, "'links'") is not { } links) return result;
        foreach (var (key, value) in links.Entries)
        {
            if (!CheckName(key, context, "link")) continue;
            var what = $"link '{key.Value}'";
            context.Positions[$"links.{key.Value}"] = key.Position;
            if (value is not YSequence seq)
            {
                context.Error(value, $"{what} must list the masses it ties rigidly together, e.g. [skid, frame]");
                continue;
            }
            if (seq.Items.Length < 2)
            {
                context.Error(seq, $"{what} must list at least two masses; it lists {seq.Items.Length}");
                continue;
            }
            var names = new List<string>();
            var supports = new List<(string Name, YNode Item)>();
            var ok = true;
            foreach (var item in seq.Items)
            {
                if (context.Text(item, $"an entry of {what}") is not { } name) { ok = false; continue; }
                if (masses.Contains(name))
                {
                    if (names.Contains(name))
                    {
                        context.Error(item, $"{what} ties '{name}' to itself; list each mass once");
                        ok = false;
                    }
                    else names.Add(name);
                }
                else if (nodes.Contains(name))
                {
                    supports.Add((name, item));
                    ok = false;
                }
                else
                {
                    context.Error(item, $"{what} refers to unknown mass '{name}'{ReadContext.Suggest(name, masses)}; declare it under 'masses'");
                    ok = false;
                }
            }
            if (supports.Count >= 2)
                context.Error(supports[1].Item, $"{what} ties two supports ('{supports[0].Name}' and '{supports[1].Name}'); supports are fixed already, a link ties masses");
            else if (supports.Count == 1)
                context.Error(supports[0].Item, $"{what} names the support '{supports[0].Name}'; a link ties masses only: to hold a mass rigidly, declare it under 'supports' instead");
            if (ok) result.Add((key.Value, [.. names]));
        }
        return result;
    }

    /// <summary>Warns about springs and dampers whose two ends a link ties together: they carry no force.</summary>
    private static void WarnAboutLinkedElements(CoreNetwork network, ReadContext context)
    {
        if (network.Links.IsEmpty) return;
        var dofs = Core.Dofs.DofMap.ForScalarNetwork(network);
        bool Inside(string a, string b) => dofs.IndexOf(a) is var i and >= 0 && i == dofs.IndexOf(b);
        foreach (var s in network.Springs.Where(s => Inside(s.NodeA, s.NodeB)))
            if (context.Positions.TryGetValue($"springs.{s.Name}", out var at))
                context.Warning(at, $"spring '{s.Name}' joins '{s.NodeA}' and '{s.NodeB}', which a link ties rigidly: it carries no force and is left out");
        foreach (var d in network.Dampers.Where(d => Inside(d.NodeA, d.NodeB)))
            if (context.Positions.TryGetValue($"dampers.{d.Name}", out var at))
                context.Warning(at, $"damper '{d.Name}' joins '{d.NodeA}' and '{d.NodeB}', which a link ties rigidly: it carries no force and is left out");
    }
}
