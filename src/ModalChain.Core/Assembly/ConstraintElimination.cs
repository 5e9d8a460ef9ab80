using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Core.Assembly;

/// <summary>One coordinate removed by a transducer's constraint, written in the coordinates that remain.</summary>
/// <param name="Transducer">The transducer whose constraint removes it.</param>
/// <param name="Node">The eliminated node: the transducer's electrical terminal n1, or n2 when n1 is a support.</param>
/// <param name="Terms">
/// x_Node = Σ Weight·x_term over masses and supports that are not eliminated (weights 1 or ±Bl, Bl in T·m; a weight on
/// a mechanical displacement in m gives a flux linkage in V·s).
/// </param>
public sealed record EliminatedNode(Transducer Transducer, string Node, ImmutableArray<(string Node, double Weight)> Terms);

/// <summary>
/// Exact elimination of the transducer constraints λ_n1 − λ_n2 = Bl·(x_a − x_b) by congruence: x_full = T q.
/// </summary>
/// <remarks>
/// Each transducer removes one coordinate: its electrical terminal n1 (λ_n1 = λ_n2 + Bl·x_a − Bl·x_b), or n2 when n1
/// is a support (λ_n2 = λ_n1 − Bl·x_a + Bl·x_b); a term on a node another transducer already removed is replaced by
/// that node's terms, so every eliminated node is written in the coordinates that remain. Mechanical coordinates are
/// never removed. With T the map from the remaining coordinates (and the supports) to every node, the reduced matrices
/// are TᵀMT, TᵀCT, TᵀKT and the loads TᵀF: each element of value k between ends whose motions are the rows t_A, t_B of T
/// adds k (t_A − t_B)ᵀ(t_A − t_B), and a mass m on an eliminated node adds m t_eᵀ t_e. The constraint does no work
/// (its reactions μ on n1, −μ on n2, −Bl·μ on a and +Bl·μ on b have zero power on every motion that satisfies it), so
/// energy is conserved by construction and the matrices stay symmetric; μ is the port current the transducer drives
/// out of n1 into the circuit. A support in an eliminated node's terms enters the support columns (K_fp, C_fp) like
/// any element end on a support, so a prescribed support motion loads the free coordinates through them.
/// </remarks>
public sealed class ConstraintElimination
{
    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<Network, ConstraintElimination> Table = new();

    private readonly Dictionary<string, EliminatedNode> _byNode;

    private ConstraintElimination(ImmutableArray<EliminatedNode> nodes)
    {
        Nodes = nodes;
        _byNode = nodes.ToDictionary(e => e.Node, StringComparer.Ordinal);
    }

    /// <summary>The eliminated nodes, one per transducer in declaration order.</summary>
    public ImmutableArray<EliminatedNode> Nodes { get; }

    /// <summary>The elimination of <paramref name="network"/>'s transducers (built once per network), or null when it has none.</summary>
    /// <exception cref="ArgumentException">Transducers the builder would have refused (see <see cref="Problem"/>).</exception>
    public static ConstraintElimination? Of(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        return network.Transducers.IsDefaultOrEmpty ? null : Table.GetValue(network, Build);
    }

    /// <summary>True when <paramref name="node"/> is eliminated by a transducer of <paramref name="network"/>.</summary>
    public static bool IsEliminated(Network network, string node) => Of(network) is { } e && e.IsEliminated(node);

    /// <summary>True when <paramref name="node"/> is eliminated.</summary>
    public bool IsEliminated(string node) => _byNode.ContainsKey(node);

    /// <summary>The eliminated node <paramref name="node"/>, or null when it is kept.</summary>
    public EliminatedNode? Find(string node) => _byNode.GetValueOrDefault(node);

    /// <summary>Appends weight·x_node written in kept nodes (the node itself when it is kept).</summary>
    public void AddTerms(string node, double weight, List<(string Node, double Weight)> into)
    {
        ArgumentNullException.ThrowIfNull(into);
        if (_byNode.TryGetValue(node, out var e))
            foreach (var (n, w) in e.Terms) into.Add((n, weight * w));
        else into.Add((node, weight));
    }

    /// <summary>The value at <paramref name="node"/> (displacement, velocity or acceleration, real or complex) from the values at kept nodes.</summary>
    public T Value<T>(string node, Func<string, T> kept) where T : System.Numerics.INumberBase<T>
    {
        ArgumentNullException.ThrowIfNull(kept);
        if (!_byNode.TryGetValue(node, out var e)) return kept(node);
        var sum = T.Zero;
        foreach (var (n, w) in e.Terms) sum += T.CreateChecked(w) * kept(n);
        return sum;
    }

    /// <summary>
    /// Why <paramref name="next"/> cannot join <paramref name="earlier"/> transducers, or null when it can: both branch
    /// terminals on supports, the chosen terminal also a mechanical terminal, in a link, or already eliminated or named
    /// by an earlier transducer.
    /// </summary>
    /// <param name="earlier">The transducers already accepted, in order.</param>
    /// <param name="next">The transducer to add.</param>
    /// <param name="isSupport">True for a support name.</param>
    /// <param name="isLinked">True for a mass in a link.</param>
    public static string? Problem(IReadOnlyList<Transducer> earlier, Transducer next, Func<string, bool> isSupport, Func<string, bool> isLinked)
    {
        ArgumentNullException.ThrowIfNull(earlier);
        ArgumentNullException.ThrowIfNull(next);
        ArgumentNullException.ThrowIfNull(isSupport);
        ArgumentNullException.ThrowIfNull(isLinked);
        var eliminated = earlier.Select(t => Chosen(t, isSupport)).ToHashSet(StringComparer.Ordinal);
        var named = earlier.SelectMany(t => new[] { t.NodeA, t.NodeB, t.BranchA, t.BranchB }).ToHashSet(StringComparer.Ordinal);
        if (isSupport(next.BranchA) && isSupport(next.BranchB))
            return $"transducer '{next.Name}' has both branch terminals on supports ('{next.BranchA}', '{next.BranchB}'): the coil would be shorted by ideal sources and hold its mechanical pair rigidly; connect at least one terminal to an electrical node";
        var chosen = Chosen(next, isSupport);
        if (chosen == next.NodeA || chosen == next.NodeB)
            return $"transducer '{next.Name}' names '{chosen}' both as a branch terminal and as a mechanical terminal";
        if (eliminated.Contains(chosen))
            return $"transducer '{next.Name}' would eliminate the coordinate of '{chosen}', which an earlier transducer already eliminates (two transducers on the same branch terminal); give each transducer a branch terminal of its own";
        if (named.Contains(chosen))
            return $"transducer '{next.Name}' would eliminate the coordinate of '{chosen}', which an earlier transducer names as a terminal; list this transducer first or give it a branch terminal of its own";
        if (isLinked(chosen))
            return $"transducer '{next.Name}' would eliminate the coordinate of '{chosen}', which is tied by a link";
        return null;
    }

    /// <summary>The node a transducer eliminates: n1 unless it is a support, else n2.</summary>
    private static string Chosen(Transducer t, Func<string, bool> isSupport) => isSupport(t.BranchA) ? t.BranchB : t.BranchA;

    private static ConstraintElimination Build(Network network)
    {
        var accepted = new List<Transducer>();
        var linked = network.Links.SelectMany(l => l.Masses).ToHashSet(StringComparer.Ordinal);
        var nodes = ImmutableArray.CreateBuilder<EliminatedNode>();
        var byNode = new Dictionary<string, EliminatedNode>(StringComparer.Ordinal);
        foreach (var t in network.Transducers)
        {
            if (Problem(accepted, t, network.IsSupport, linked.Contains) is { } problem) throw new ArgumentException(problem, nameof(network));
            accepted.Add(t);
            var bl = t.ForceFactor;
            var (node, raw) = network.IsSupport(t.BranchA)
                ? (t.BranchB, new[] { (t.BranchA, 1.0), (t.NodeA, -bl), (t.NodeB, bl) })
                : (t.BranchA, new[] { (t.BranchB, 1.0), (t.NodeA, bl), (t.NodeB, -bl) });
            var terms = new List<(string, double)>();
            foreach (var (n, w) in raw)
            {
                if (byNode.TryGetValue(n, out var earlier))
                    foreach (var (m, v) in earlier.Terms) terms.Add((m, w * v));
                else terms.Add((n, w));
            }
            var e = new EliminatedNode(t, node, [.. terms]);
            nodes.Add(e);
            byNode.Add(node, e);
        }
        return new ConstraintElimination(nodes.ToImmutable());
    }

    /// <summary>
    /// Adds value·uuᵀ as coordinate entries, u = t_A − t_B over indices from <paramref name="index"/> (an index below 0, a
    /// fixed support, drops out): the congruence-mapped matrix of a two-end element of value <paramref name="value"/>.
    /// </summary>
    internal void AddTwoEnd(List<(int, int, double)> entries, Func<string, int> index, string nodeA, string nodeB, double value)
    {
        var u = new List<(string Node, double Weight)>(8);
        AddTerms(nodeA, 1, u);
        AddTerms(nodeB, -1, u);
        AddOuter(entries, index, u, value);
    }

    /// <summary>Adds value·t tᵀ for the row t of <paramref name="node"/> (a mass on an eliminated node).</summary>
    internal void AddOneEnd(List<(int, int, double)> entries, Func<string, int> index, string node, double value)
    {
        var u = new List<(string Node, double Weight)>(4);
        AddTerms(node, 1, u);
        AddOuter(entries, index, u, value);
    }

    /// <summary>The row t_A − t_B over indices from <paramref name="index"/> (fixed supports, index below 0, left out).</summary>
    internal (int Index, double Weight)[] Row(Func<string, int> index, string nodeA, string nodeB)
    {
        var u = new List<(string Node, double Weight)>(8);
        AddTerms(nodeA, 1, u);
        AddTerms(nodeB, -1, u);
        return [.. u.Select(t => (index(t.Node), t.Weight)).Where(t => t.Item1 >= 0)];
    }

    /// <summary>True when a spring of <paramref name="network"/> has an end this elimination removes.</summary>
    internal bool TouchesSpring(Network network) => network.Springs.Any(s => IsEliminated(s.NodeA) || IsEliminated(s.NodeB));

    private static void AddOuter(List<(int, int, double)> entries, Func<string, int> index, List<(string Node, double Weight)> u, double value)
    {
        // Repeated indices are fine: the double loop over the list gives the outer product of the summed vector.
        var mapped = new (int Index, double Weight)[u.Count];
        for (var k = 0; k < u.Count; k++) mapped[k] = (index(u[k].Node), u[k].Weight);
        foreach (var (i, wi) in mapped)
        {
            if (i < 0 || wi == 0) continue;
            foreach (var (j, wj) in mapped)
                if (j >= 0 && wj != 0) entries.Add((i, j, value * wi * wj));
        }
    }
}
