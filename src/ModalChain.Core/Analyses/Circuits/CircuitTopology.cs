using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Analyses.Circuits;

/// <summary>Topological checks of a circuit that its analyses need (on the analogue network's first-order form).</summary>
public static class CircuitTopology
{
    /// <summary>
    /// Groups of nodes the analyses cannot take: capacitor-joined nodes with no capacitor to ground or to a source
    /// node, and resistor-joined capacitor-free nodes with no resistor to the rest. Each group is listed by its node names
    /// in declaration order, with the kind of element it lacks ("capacitor" or "resistor").
    /// </summary>
    public static IReadOnlyList<(ImmutableArray<string> Nodes, string Lacks)> UnsupportedGroups(CircuitAnalogy analogy)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        var circuit = analogy.Circuit;
        var result = new List<(ImmutableArray<string>, string)>();
        var order = circuit.Nodes.Select((name, i) => (name, i)).ToDictionary(t => t.name, t => t.i, StringComparer.Ordinal);
        bool IsRole(string node, CircuitNodeRole role) => node != Circuit.Ground && analogy.RoleOf(analogy.IndexOf(node)) == role;
        void Check(IEnumerable<(string A, string B)> edges, CircuitNodeRole role, string lacks)
        {
            var parent = new Dictionary<string, string>(StringComparer.Ordinal);
            string Find(string x) { while (parent[x] != x) x = parent[x] = parent[parent[x]]; return x; }
            foreach (var node in circuit.Nodes.Where(n => IsRole(n, role))) parent[node] = node;
            var anchored = new HashSet<string>(StringComparer.Ordinal);
            var list = edges.ToList();
            foreach (var (a, b) in list)
                if (IsRole(a, role) && IsRole(b, role)) parent[Find(a)] = Find(b);
            foreach (var (a, b) in list)
            {
                if (IsRole(a, role) && !IsRole(b, role)) anchored.Add(Find(a));
                if (IsRole(b, role) && !IsRole(a, role)) anchored.Add(Find(b));
            }
            foreach (var group in parent.Keys.GroupBy(Find).Where(grp => !anchored.Contains(grp.Key)))
                result.Add(([.. group.OrderBy(n => order[n])], lacks));
        }
        Check(circuit.Capacitors.Select(e => (e.NodeA, e.NodeB)), CircuitNodeRole.Massive, "capacitor");
        Check(circuit.Resistors.Select(e => (e.NodeA, e.NodeB)), CircuitNodeRole.Massless, "resistor");
        return result;
    }

    /// <summary>
    /// The number of zero roots of the free circuit: one per group of free nodes that no inductor path ties to ground or
    /// to a source node (its flux level is arbitrary), and one more per group that neither an inductor nor a resistor
    /// path ties to them (its voltage level is arbitrary too: a charge that stays).
    /// </summary>
    public static int ZeroRootCount(CircuitAnalogy analogy) => FluxLevelCount(analogy) + VoltageLevelCount(analogy);

    /// <summary>
    /// The zero roots that only the flux coordinate has: one per group of free nodes that no inductor path ties to ground
    /// or to a source node. Shifting the group's fluxes by a constant changes no voltage (λ̇) and no current (inductor
    /// currents depend on flux differences within the group, resistor and capacitor currents on λ̇ and λ̈), so no voltage
    /// or current shows these roots: they are not roots of the circuit and are not listed.
    /// </summary>
    public static int FluxLevelCount(CircuitAnalogy analogy)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        return FloatingGroups(analogy, [.. analogy.Circuit.Inductors.Select(e => (e.NodeA, e.NodeB))]);
    }

    /// <summary>
    /// The DC levels: one per group of free nodes that neither an inductor nor a resistor path ties to ground or to a
    /// source node. Its voltage may stay at any constant (a charge its capacitors keep): a zero root the voltages show.
    /// </summary>
    public static int VoltageLevelCount(CircuitAnalogy analogy)
    {
        ArgumentNullException.ThrowIfNull(analogy);
        var circuit = analogy.Circuit;
        return FloatingGroups(analogy, [.. circuit.Inductors.Select(e => (e.NodeA, e.NodeB)).Concat(circuit.Resistors.Select(e => (e.NodeA, e.NodeB)))]);
    }

    private static int FloatingGroups(CircuitAnalogy analogy, List<(string A, string B)> edges)
    {
        var free = analogy.FreeCount;
        var parent = Enumerable.Range(0, free).ToArray();
        int Find(int x) { while (parent[x] != x) x = parent[x] = parent[parent[x]]; return x; }
        int At(string node) => node == Circuit.Ground ? -1 : analogy.IndexOf(node);
        foreach (var (a, b) in edges)
        {
            var (i, j) = (At(a), At(b));
            if (i >= 0 && i < free && j >= 0 && j < free) parent[Find(i)] = Find(j);
        }
        var anchored = new HashSet<int>();
        foreach (var (a, b) in edges)
        {
            var (i, j) = (At(a), At(b));
            var iFree = i >= 0 && i < free;
            var jFree = j >= 0 && j < free;
            if (iFree && !jFree) anchored.Add(Find(i));
            if (jFree && !iFree) anchored.Add(Find(j));
        }
        return Enumerable.Range(0, free).Select(Find).Distinct().Count(r => !anchored.Contains(r));
    }
}
