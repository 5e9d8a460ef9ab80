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
        var nodes = new NodeIndex(network);
        var sets = new DisjointSets(nodes.Count);
        // All supports form one component: anything connected to any of them is held.
        var ground = nodes.Of(Network.Ground);
        for (var s = 1; s < network.Supports.Length; s++) sets.Join(nodes.Of(network.Supports[s].Name), ground);
        foreach (var spring in network.Springs)
            if (spring.Stiffness > 0) sets.Join(nodes.Of(spring.NodeA), nodes.Of(spring.NodeB));
        foreach (var link in network.Links)
            for (var i = 1; i < link.Masses.Length; i++) sets.Join(nodes.Of(link.Masses[i]), nodes.Of(link.Masses[0]));
        // A node a transducer eliminates has no DOF of its own: a spring at it acts on its terms, which it joins.
        var elimination = Assembly.ConstraintElimination.Of(network);
        if (elimination is not null)
            foreach (var e in elimination.Nodes)
                if (network.Springs.Any(s => s.Stiffness > 0 && (s.NodeA == e.Node || s.NodeB == e.Node)))
                    foreach (var (term, _) in e.Terms) sets.Join(nodes.Of(term), nodes.Of(e.Node));

        // Groups in the order of their first mass, each in mass order.
        var held = sets.Find(ground);
        var groupOfRoot = new Dictionary<int, int>();
        var groups = new List<ImmutableArray<string>.Builder>();
        for (var m = 0; m < network.Masses.Length; m++)
        {
            var root = sets.Find(m);
            if (root == held || (elimination is not null && elimination.IsEliminated(network.Masses[m].Name))) continue;
            if (!groupOfRoot.TryGetValue(root, out var g))
            {
                groupOfRoot.Add(root, g = groups.Count);
                groups.Add(ImmutableArray.CreateBuilder<string>());
            }
            groups[g].Add(network.Masses[m].Name);
        }
        var result = ImmutableArray.CreateBuilder<ImmutableArray<string>>(groups.Count);
        foreach (var g in groups) result.Add(g.ToImmutable());
        return result.MoveToImmutable();
    }

    /// <summary>
    /// The electrical side of a line model's transducers: each transducer's branch terminals and every node joined to
    /// them by springs, dampers or inerters, in network order (masses, then supports). Empty without transducers.
    /// </summary>
    /// <remarks>
    /// Ground is shared by both sides and never on it. A support reached (a voltage source) is on the electrical side
    /// but the search does not go on through it, and it never enters a transducer's mechanical terminal: the
    /// transducers themselves are the only coupling between the sides, so the search never crosses to the mechanical
    /// one. <see cref="NetworkBuilder.Build"/> marks these nodes electrical (<see cref="Network.ElectricalNodes"/>).
    /// </remarks>
    /// <param name="masses">Mass names in network order.</param>
    /// <param name="supports">Support names, ground first.</param>
    /// <param name="edges">Ends of every spring, damper and inerter.</param>
    /// <param name="transducers">The transducers.</param>
    public static ImmutableArray<string> ElectricalSide(IReadOnlyList<string> masses, IReadOnlyList<string> supports,
        IEnumerable<(string A, string B)> edges, IReadOnlyList<Transducer> transducers)
    {
        ArgumentNullException.ThrowIfNull(masses);
        ArgumentNullException.ThrowIfNull(supports);
        ArgumentNullException.ThrowIfNull(edges);
        ArgumentNullException.ThrowIfNull(transducers);
        if (transducers.Count == 0) return [];
        var isSupport = supports.ToHashSet(StringComparer.Ordinal);
        var mechanical = transducers.SelectMany(t => new[] { t.NodeA, t.NodeB }).ToHashSet(StringComparer.Ordinal);
        var neighbours = new Dictionary<string, List<string>>(StringComparer.Ordinal);
        foreach (var (a, b) in edges)
        {
            (neighbours.TryGetValue(a, out var la) ? la : neighbours[a] = []).Add(b);
            (neighbours.TryGetValue(b, out var lb) ? lb : neighbours[b] = []).Add(a);
        }
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var queue = new Queue<string>(transducers.SelectMany(t => new[] { t.BranchA, t.BranchB }));
        while (queue.TryDequeue(out var node))
        {
            if (node == Network.Ground || mechanical.Contains(node) || !seen.Add(node) || isSupport.Contains(node)) continue;
            foreach (var next in neighbours.GetValueOrDefault(node) ?? []) queue.Enqueue(next);
        }
        return [.. masses.Concat(supports).Where(seen.Contains)];
    }

    /// <summary>
    /// The groups of <see cref="UnsupportedGroups"/> made of electrical nodes only: circuit node groups that no inductor
    /// (spring) joins to a support or to a mechanical node. Each has a root at 0 that only sets a constant flux level
    /// (a flux linkage is defined up to a constant where no inductor fixes it), not a motion.
    /// </summary>
    public static ImmutableArray<ImmutableArray<string>> FluxLevelGroups(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.ElectricalNodes.IsEmpty || network.Space != ModelSpace.Line) return [];
        return [.. UnsupportedGroups(network).Where(g => g.All(network.IsElectrical))];
    }

    /// <summary>
    /// The groups of <see cref="UnsupportedGroups"/> that hold a mechanical node: each has a rigid-body mode. The others
    /// are <see cref="FluxLevelGroups"/>, which only set a flux level.
    /// </summary>
    public static ImmutableArray<ImmutableArray<string>> RigidBodyGroups(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var groups = UnsupportedGroups(network);
        return network.ElectricalNodes.IsEmpty ? groups : [.. groups.Where(g => !g.All(network.IsElectrical))];
    }

    /// <summary>The number of <see cref="FluxLevelGroups"/>: the zero roots that set a flux level and are left out of the complex roots.</summary>
    public static int FluxLevelCount(Network network) => FluxLevelGroups(network).Length;

    /// <summary>Masses (and, in plane and 3d models, bodies) that no spring of positive stiffness touches, neither directly nor through a link.</summary>
    public static ImmutableArray<string> MassesWithoutSpring(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (network.Space != ModelSpace.Line)
        {
            var reached = network.Springs.Where(HasStiffness).SelectMany(s => new[] { NodeOf(network, s.NodeA), NodeOf(network, s.NodeB) }).ToHashSet();
            return [.. network.Masses.Select(m => m.Name).Concat(network.Bodies.Select(b => b.Name)).Where(n => !reached.Contains(n))];
        }
        var nodes = new NodeIndex(network);
        var touched = new bool[nodes.Count];
        foreach (var s in network.Springs)
            if (s.Stiffness > 0) touched[nodes.Of(s.NodeA)] = touched[nodes.Of(s.NodeB)] = true;
        // A link whose masses are partly touched makes them all touched, which may complete another link: repeat to the end.
        for (var grew = true; grew;)
        {
            grew = false;
            foreach (var link in network.Links)
            {
                var (any, all) = (false, true);
                foreach (var m in link.Masses) (any, all) = (any || touched[nodes.Of(m)], all && touched[nodes.Of(m)]);
                if (!any || all) continue;
                foreach (var m in link.Masses) touched[nodes.Of(m)] = true;
                grew = true;
            }
        }
        var result = ImmutableArray.CreateBuilder<string>();
        for (var m = 0; m < network.Masses.Length; m++)
            if (!touched[m] && !Assembly.ConstraintElimination.IsEliminated(network, network.Masses[m].Name)) result.Add(network.Masses[m].Name);
        return result.ToImmutable();
    }

    /// <summary>Above this ratio of the stiffest to the softest spring a model carries a warning.</summary>
    public const double WarnedStiffnessRatio = 1e8;

    /// <summary>The springs stiffer than <see cref="WarnedStiffnessRatio"/> times the softest one, with that ratio; empty when none.</summary>
    /// <remarks>Springs between two supports, or between two masses of one link, carry no force and are left out.
    /// In plane and 3d models each spring's scale is <see cref="Spring.Stiffness"/> (its largest translational component or its axial value); springs with rotational components only do not count.</remarks>
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
        var nodes = new NodeIndex(network);
        var linked = new DisjointSets(nodes.Count);
        foreach (var link in network.Links)
            for (var i = 1; i < link.Masses.Length; i++) linked.Join(nodes.Of(link.Masses[i]), nodes.Of(link.Masses[0]));
        var positive = new List<Spring>(network.Springs.Length);
        foreach (var s in network.Springs)
        {
            if (!(s.Stiffness > 0)) continue;
            // An inductor's analogue spring (1/L in N/m standing for 1/H) is no stiffness of the structure.
            if (network.IsElectricalElement(s.NodeA, s.NodeB)) continue;
            var (a, b) = (nodes.Of(s.NodeA), nodes.Of(s.NodeB));
            var (aIsSupport, bIsSupport) = (nodes.IsSupport(a), nodes.IsSupport(b));
            if (aIsSupport && bIsSupport) continue;
            if (!aIsSupport && !bIsSupport && linked.Find(a) == linked.Find(b)) continue;
            positive.Add(s);
        }
        return Spread([.. positive]);
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

    /// <summary>Masses numbered 0..n−1 in network order, then supports (ground first).</summary>
    private sealed class NodeIndex
    {
        private readonly Dictionary<string, int> _index;
        private readonly int _masses;

        public NodeIndex(Network network)
        {
            _masses = network.Masses.Length;
            _index = new Dictionary<string, int>(_masses + network.Supports.Length, StringComparer.Ordinal);
            foreach (var m in network.Masses) _index.Add(m.Name, _index.Count);
            foreach (var s in network.Supports) _index.Add(s.Name, _index.Count);
        }

        public int Count => _index.Count;

        public int Of(string node) => _index[node];

        public bool IsSupport(int node) => node >= _masses;
    }

    /// <summary>Union–find with path halving: which nodes a chain of joins connects.</summary>
    private sealed class DisjointSets
    {
        private readonly int[] _parent;

        public DisjointSets(int count)
        {
            _parent = new int[count];
            for (var i = 0; i < count; i++) _parent[i] = i;
        }

        public int Find(int x)
        {
            while (_parent[x] != x) x = _parent[x] = _parent[_parent[x]];
            return x;
        }

        public void Join(int a, int b) => _parent[Find(a)] = Find(b);
    }
}
