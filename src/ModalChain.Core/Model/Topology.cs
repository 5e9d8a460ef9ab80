using System.Collections.Immutable;
using System.Globalization;

namespace ModalChain.Core.Model;

/// <summary>Connectivity facts about a network that a reviewer should hear about before trusting its modes.</summary>
public static class Topology
{
    /// <summary>Groups of masses that no chain of springs (and links) joins to any support; each group has a rigid-body mode.</summary>
    /// <remarks>
    /// In plane and 3d models rigid bodies are nodes too (listed after the masses of their group) and an end on
    /// <c>body.point</c> belongs to its body. There the groups say only which nodes no spring reaches at all: a node
    /// held in one direction may still be free in others, so the count of rigid-body modes comes from the null space
    /// of K (see <c>SpatialModes</c>), not from these groups.
    /// </remarks>
    public static ImmutableArray<ImmutableArray<string>> UnsupportedGroups(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != ModelSpace.Line) return SpatialUnsupportedGroups(network);
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
        foreach (var link in network.Links)
            foreach (var m in link.Masses.Skip(1))
                parent[Find(m)] = Find(link.Masses[0]);

        var held = Find(Network.Ground);
        return [.. network.Masses
            .Where(m => Find(m.Name) != held)
            .GroupBy(m => Find(m.Name))
            .Select(g => g.Select(m => m.Name).ToImmutableArray())];
    }

    /// <summary>Masses (and, in plane and 3d models, bodies) that no spring of positive stiffness touches, neither directly nor through a link.</summary>
    public static ImmutableArray<string> MassesWithoutSpring(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != ModelSpace.Line)
        {
            var reached = network.Springs.Where(HasStiffness).SelectMany(s => new[] { NodeOf(network, s.NodeA), NodeOf(network, s.NodeB) }).ToHashSet();
            return [.. network.Masses.Select(m => m.Name).Concat(network.Bodies.Select(b => b.Name)).Where(n => !reached.Contains(n))];
        }
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
    /// <remarks>In plane and 3d models each spring's scale is <see cref="Spring.Stiffness"/> (its largest translational component or its axial value); springs with rotational components only do not count.</remarks>
    public static (double Ratio, Spring? Softest, ImmutableArray<Spring> Stiff) StiffnessSpread(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != ModelSpace.Line)
        {
            var counted = network.Springs.Where(s => s.Stiffness > 0
                && !(network.IsSupport(NodeOf(network, s.NodeA)) && network.IsSupport(NodeOf(network, s.NodeB)))
                && NodeOf(network, s.NodeA) != NodeOf(network, s.NodeB)).ToArray();
            return Spread(counted);
        }
        var dofs = Dofs.DofMap.ForScalarNetwork(network);
        var positive = network.Springs.Where(s => s.Stiffness > 0 && !(network.IsSupport(s.NodeA) && network.IsSupport(s.NodeB))
            && (dofs.IndexOf(s.NodeA) < 0 || dofs.IndexOf(s.NodeA) != dofs.IndexOf(s.NodeB))).ToArray();
        return Spread(positive);
    }

    private static (double Ratio, Spring? Softest, ImmutableArray<Spring> Stiff) Spread(Spring[] positive)
    {
        if (positive.Length < 2) return (1, null, []);
        var softest = positive.MinBy(s => s.Stiffness)!;
        var ratio = positive.Max(s => s.Stiffness) / softest.Stiffness;
        return (ratio, softest, [.. positive.Where(s => s.Stiffness > softest.Stiffness * WarnedStiffnessRatio).OrderByDescending(s => s.Stiffness)]);
    }

    /// <summary>The node an element end belongs to: the body of <c>body.point</c>, else the name itself.</summary>
    private static string NodeOf(Network network, string reference) => network.Resolve(reference)?.Node ?? reference;

    private static bool HasStiffness(Spring s) => s.Stiffness > 0 || s.Components.Any(c => c.Value > 0);

    private static ImmutableArray<ImmutableArray<string>> SpatialUnsupportedGroups(Network network)
    {
        var nodes = network.Masses.Select(m => m.Name).Concat(network.Bodies.Select(b => b.Name)).ToArray();
        var parent = nodes.Concat(network.Supports.Select(s => s.Name)).ToDictionary(x => x, x => x, StringComparer.Ordinal);
        string Find(string x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        foreach (var s in network.Supports.Skip(1)) parent[Find(s.Name)] = Find(Network.Ground);
        foreach (var spring in network.Springs.Where(HasStiffness))
            parent[Find(NodeOf(network, spring.NodeA))] = Find(NodeOf(network, spring.NodeB));
        var held = Find(Network.Ground);
        return [.. nodes.Where(x => Find(x) != held).GroupBy(Find).Select(g => g.ToImmutableArray())];
    }

    /// <summary>The warning for springs whose stiffnesses span more than <see cref="WarnedStiffnessRatio"/>, or null.</summary>
    public static string? StiffnessRatioWarning(Network network)
    {
        var (ratio, softest, stiff) = StiffnessSpread(network);
        if (stiff.IsEmpty || softest is null) return null;
        var stiffest = stiff[0];
        var names = string.Join(", ", stiff.Select(s => $"'{s.Name}'"));
        if (network.Space != ModelSpace.Line) return Analyses.Modal.SpatialModes.SpreadWarning(ratio, stiffest, softest, names);
        // A subnormal stiffness makes the ratio overflow: say so in words, never "Infinity".
        var span = double.IsFinite(ratio) ? string.Create(CultureInfo.InvariantCulture, $"{ratio:0.###e+0}") : "beyond 1e+308";
        var lost = double.IsFinite(ratio) ? string.Create(CultureInfo.InvariantCulture, $"about {Math.Log10(Math.Sqrt(ratio)):0} digits") : "every digit";
        return string.Create(CultureInfo.InvariantCulture,
            $"spring stiffnesses span a ratio of {span} ('{stiffest.Name}' {stiffest.Stiffness:G4} N/m against '{softest.Name}' {softest.Stiffness:G4} N/m): the low modes are solved from the flexibility to keep their relative accuracy, but intermediate modes and residuals lose {lost}; a spring that stiff usually stands for a rigid connection: consider tying its masses with 'links:' (or, for a spring to a support, declaring the mass a support) instead of {names}");
    }
}
