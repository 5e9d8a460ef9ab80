using System.Collections.Immutable;
using System.Globalization;

namespace ModalChain.Core.Model;

/// <summary>Connectivity facts about a network that a reviewer should hear about before trusting its modes.</summary>
public static class Topology
{
    /// <summary>Groups of masses that no chain of springs (and links) joins to any support; each group has a rigid-body mode.</summary>
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
        foreach (var b in network.Bodies) parent[b.Name] = b.Name;
        // All supports form one component: anything connected to any of them is held.
        foreach (var s in network.Supports.Skip(1)) parent[Find(s.Name)] = Find(Network.Ground);
        // An end written 'body.point' belongs to its body.
        string Node(string end) => network.Bodies.IsDefaultOrEmpty ? end : network.Resolve(end)?.Node ?? end;
        foreach (var spring in network.Springs.Where(s => s.Stiffness > 0))
            parent[Find(Node(spring.NodeA))] = Find(Node(spring.NodeB));
        foreach (var link in network.Links)
            foreach (var m in link.Masses.Skip(1))
                parent[Find(m)] = Find(link.Masses[0]);

        var held = Find(Network.Ground);
        return [.. network.Masses
            .Where(m => Find(m.Name) != held)
            .GroupBy(m => Find(m.Name))
            .Select(g => g.Select(m => m.Name).ToImmutableArray())];
    }

    /// <summary>Masses that no spring of positive stiffness touches, neither directly nor through a link.</summary>
    public static ImmutableArray<string> MassesWithoutSpring(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var touched = network.Springs.Where(s => s.Stiffness > 0).SelectMany(s => new[] { s.NodeA, s.NodeB }).ToHashSet();
        for (var grew = true; grew;)
        {
            grew = false;
            foreach (var link in network.Links.Where(l => l.Masses.Any(touched.Contains) && !l.Masses.All(touched.Contains)))
            {
                touched.UnionWith(link.Masses);
                grew = true;
            }
        }
        return [.. network.Masses.Where(m => !touched.Contains(m.Name)).Select(m => m.Name)];
    }

    /// <summary>Above this ratio of the stiffest to the softest spring a model carries a warning.</summary>
    public const double WarnedStiffnessRatio = 1e8;

    /// <summary>The springs stiffer than <see cref="WarnedStiffnessRatio"/> times the softest one, with that ratio; empty when none.</summary>
    public static (double Ratio, Spring? Softest, ImmutableArray<Spring> Stiff) StiffnessSpread(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var dofs = Dofs.DofMap.ForScalarNetwork(network);
        var positive = network.Springs.Where(s => s.Stiffness > 0 && !(network.IsSupport(s.NodeA) && network.IsSupport(s.NodeB))
            && (dofs.IndexOf(s.NodeA) < 0 || dofs.IndexOf(s.NodeA) != dofs.IndexOf(s.NodeB))).ToArray();
        if (positive.Length < 2) return (1, null, []);
        var softest = positive.MinBy(s => s.Stiffness)!;
        var ratio = positive.Max(s => s.Stiffness) / softest.Stiffness;
        return (ratio, softest, [.. positive.Where(s => s.Stiffness > softest.Stiffness * WarnedStiffnessRatio).OrderByDescending(s => s.Stiffness)]);
    }

    /// <summary>The warning for springs whose stiffnesses span more than <see cref="WarnedStiffnessRatio"/>, or null.</summary>
    public static string? StiffnessRatioWarning(Network network)
    {
        var (ratio, softest, stiff) = StiffnessSpread(network);
        if (stiff.IsEmpty || softest is null) return null;
        var stiffest = stiff[0];
        var names = string.Join(", ", stiff.Select(s => $"'{s.Name}'"));
        // A subnormal stiffness makes the ratio overflow: say so in words, never "Infinity".
        var span = double.IsFinite(ratio) ? string.Create(CultureInfo.InvariantCulture, $"{ratio:0.###e+0}") : "beyond 1e+308";
        var lost = double.IsFinite(ratio) ? string.Create(CultureInfo.InvariantCulture, $"about {Math.Log10(Math.Sqrt(ratio)):0} digits") : "every digit";
        return string.Create(CultureInfo.InvariantCulture,
            $"spring stiffnesses span a ratio of {span} ('{stiffest.Name}' {stiffest.Stiffness:G4} N/m against '{softest.Name}' {softest.Stiffness:G4} N/m): the low modes are solved from the flexibility to keep their relative accuracy, but intermediate modes and residuals lose {lost}; a spring that stiff usually stands for a rigid connection: consider tying its masses with 'links:' (or, for a spring to a support, declaring the mass a support) instead of {names}");
    }
}
