using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>Connectivity facts about a network that a reviewer should hear about before trusting its modes.</summary>
public static class Topology
{
    /// <summary>Groups of masses that no chain of springs joins to any support; each group has a rigid-body mode.</summary>
    public static ImmutableArray<ImmutableArray<string>> UnsupportedGroups(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var parent = new Dictionary<string, string>();
        string Find(string x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        foreach (var m in network.Masses) parent[m.Name] = m.Name;
        foreach (var s in network.Supports) parent[s.Name] = s.Name;
        // All supports form one component: anything connected to any of them is held.
        foreach (var s in network.Supports.Skip(1)) parent[Find(s.Name)] = Find(Network.Ground);
        foreach (var spring in network.Springs.Where(s => s.Stiffness > 0))
            parent[Find(spring.NodeA)] = Find(spring.NodeB);

        var held = Find(Network.Ground);
        return [.. network.Masses
            .Where(m => Find(m.Name) != held)
            .GroupBy(m => Find(m.Name))
            .Select(g => g.Select(m => m.Name).ToImmutableArray())];
    }

    /// <summary>Masses that no spring of positive stiffness touches.</summary>
    public static ImmutableArray<string> MassesWithoutSpring(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var touched = network.Springs.Where(s => s.Stiffness > 0).SelectMany(s => new[] { s.NodeA, s.NodeB }).ToHashSet();
        return [.. network.Masses.Where(m => !touched.Contains(m.Name)).Select(m => m.Name)];
    }
}
