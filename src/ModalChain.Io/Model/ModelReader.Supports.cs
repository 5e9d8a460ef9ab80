using System.Collections.Immutable;
using ModalChain.Core.Model;
using ModalChain.Io.Yaml;

namespace ModalChain.Io.Model;

public static partial class ModelReader
{
    /// <summary>Reads 'supports': named points that springs and dampers may connect to and base-motion loads may move.</summary>
    /// <remarks>
    /// <c>supports: {plinth: {at: [0, -0.5]}, roof-beam: }</c>. Ground always exists and is not declared. A support
    /// is fixed unless a base-motion load moves it.
    /// </remarks>
    private static void ReadSupports(YMapping top, ReadContext context, NetworkBuilder builder, HashSet<string> nodes, SpatialNodes? spatial)
    {
        if (top["supports"] is not { } node || node is YScalar { IsPlainNull: true }) return;
        if (context.Mapping(node, "'supports'") is not { } supports) return;
        foreach (var (key, value) in supports.Entries)
        {
            if (!CheckName(key, context, "support")) continue;
            var what = $"support '{key.Value}'";
            if (nodes.Contains(key.Value))
            {
                context.Error(key, $"{what} has the name of a mass; masses and supports share one set of node names");
                continue;
            }
            context.Positions[$"supports.{key.Value}"] = key.Position;
            if (spatial is not null)
            {
                // Known as a node even when its location is wrong, so elements that name it add no second error.
                nodes.Add(key.Value);
                var location = ReadSupportLocation(key, value, spatial.Space, context);
                spatial.Supports[key.Value] = location;
                if (location is { } p && !context.HasErrors)
                    builder.AddSupport(new Support(key.Value, new DrawingPosition(p.X, p.Z)) { Location = p });
                continue;
            }
            DrawingPosition? at = null;
            if (value is not YScalar { IsPlainNull: true })
            {
                if (context.Mapping(value, what) is not { } entry) continue;
                context.RejectUnknownKeys(entry, what, "at");
                if (entry["at"] is { } atNode) at = ReadPosition(atNode, context, what);
            }
            nodes.Add(key.Value);
            if (!context.HasErrors) builder.AddSupport(key.Value, at);
        }
    }

    /// <summary>The keys of a top-level mapping section, or none; used to check references even when other sections have errors.</summary>
    // A hash set in document order: a 100,000-mass model names as many keys, which an immutable set took 0.15 s to hold.
    private static HashSet<string> DeclaredNames(YMapping top, string section)
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        if (top[section] is YMapping m)
            foreach (var (key, _) in m.Walk()) names.Add(key.Value);
        return names;
    }
}
