using System.Collections.Immutable;
using ModalChain.Core.Model;

namespace ModalChain.Reports.Drawing;

/// <summary>The direction along which a network is drawn; mode displacements are drawn across it.</summary>
public enum ChainAxis
{
    /// <summary>Ground at the bottom, masses stacked upwards; displacements drawn horizontally.</summary>
    Vertical,

    /// <summary>Ground at the left, masses to the right; displacements drawn vertically.</summary>
    Horizontal,
}

/// <summary>Kind of a two-node element in a drawing.</summary>
public enum ElementKind
{
    Spring,
    Damper,

    /// <summary>An inerter, drawn as a flywheel: a disc with crossed spokes between two rods.</summary>
    Inerter,

    /// <summary>A transducer, drawn between its mechanical pair as a magnet and a coil with a dashed line to its electrical branch.</summary>
    Transducer,
}

/// <summary>One end of a drawn element: a mass (moves with it) or a fixed anchor point in drawing metres.</summary>
/// <param name="Mass">The mass name, or null for a support end.</param>
/// <param name="Anchor">For a support end, where its symbol is drawn (m, y up); unused for a mass end.</param>
public readonly record struct ElementEnd(string? Mass, Point Anchor)
{
    /// <summary>For a support end, the support's name (a voltage source's node on the electrical side); null for a mass end.</summary>
    public string? Support { get; init; }
}

/// <summary>A spring, damper, inerter or transducer as drawn.</summary>
/// <param name="Name">Element name.</param>
/// <param name="Kind">Spring, damper, inerter or transducer.</param>
/// <param name="A">First end (a transducer's mechanical terminal a).</param>
/// <param name="B">Second end.</param>
/// <param name="Value">Stiffness in N/m, coefficient in N·s/m, inertance in kg or force factor in T·m.</param>
/// <param name="ParallelIndex">Index among elements joining the same two ends (drawn side by side).</param>
/// <param name="ParallelCount">Number of elements joining the same two ends.</param>
public sealed record DrawnElement(string Name, ElementKind Kind, ElementEnd A, ElementEnd B, double Value, int ParallelIndex, int ParallelCount)
{
    /// <summary>
    /// True when the element is written from the other end than the first element of its parallel group (a spring
    /// ground→table beside a transducer table→ground), so its sideways offset is turned round to keep the group apart.
    /// </summary>
    public bool Reversed { get; init; }

    /// <summary>
    /// True for a spring, damper or inerter with an end on an electrical node (<see cref="Network.IsElectrical"/>): by the
    /// analogy an inductor (stiffness 1/L), a resistor (coefficient 1/R) or a capacitor (inertance C in F). False for a
    /// transducer, which always joins the two sides.
    /// </summary>
    public bool Electrical { get; init; }

    /// <summary>A transducer's branch terminals that are drawn nodes (its electrical nodes; a support terminal is left out); empty for other kinds.</summary>
    public ImmutableArray<string> Branch { get; init; } = [];
}

/// <summary>Where each part of a network is drawn, in drawing metres with y upwards.</summary>
/// <param name="Masses">Mass name to position, in declaration order of the network.</param>
/// <param name="Elements">Springs, dampers, inerters, then transducers.</param>
/// <param name="Automatic">True when positions were laid out by the tool rather than taken from the model's <c>at</c>.</param>
/// <param name="Axis">The direction the network is drawn along.</param>
/// <param name="Spacing">Typical distance between neighbouring masses in m; sets symbol sizes and mode scales.</param>
public sealed record NetworkLayout(
    ImmutableArray<(string Name, Point At)> Masses,
    ImmutableArray<DrawnElement> Elements,
    bool Automatic,
    ChainAxis Axis,
    double Spacing)
{
    private const double LevelGap = 1.2;
    private const double SideGap = 1.6;

    /// <summary>The network's electrical nodes (<see cref="Network.ElectricalNodes"/>): drawn masses whose value is a capacitance in F, and supports held by a voltage source.</summary>
    public ImmutableHashSet<string> ElectricalNodes { get; init; } = [];

    /// <summary>Position of mass <paramref name="name"/>.</summary>
    public Point PositionOf(string name) => Masses.First(m => m.Name == name).At;

    /// <summary>Lays out <paramref name="network"/>: its <c>at</c> positions when every mass has a distinct one, otherwise automatically.</summary>
    /// <remarks>
    /// The automatic layout stacks masses by their distance from the supports, counted in springs and dampers
    /// (breadth-first), ground at the bottom; masses at the same distance sit side by side. Groups that no
    /// element joins to a support are stacked in columns of their own to the right.
    /// </remarks>
    public static NetworkLayout For(Network network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var given = network.Masses.Select(m => m.Position).ToArray();
        var usable = given.All(p => p is not null)
            && given.Select(p => (p!.Value.X, p.Value.Y)).Distinct().Count() == given.Length;
        var positions = usable
            ? network.Masses.Select(m => new Point(m.Position!.Value.X, m.Position.Value.Y)).ToArray()
            : AutomaticPositions(network);

        var xs = positions.Select(p => p.X).ToArray();
        var ys = positions.Select(p => p.Y).ToArray();
        var axis = ys.Max() - ys.Min() >= xs.Max() - xs.Min() ? ChainAxis.Vertical : ChainAxis.Horizontal;
        var index = network.Masses.Select((m, i) => (m.Name, i)).ToDictionary(p => p.Name, p => p.i);
        var spacing = TypicalSpacing(network, positions, index);

        var masses = network.Masses.Select((m, i) => (m.Name, positions[i])).ToImmutableArray();
        var elements = DrawnElements(network, positions, index, axis, spacing);
        return new NetworkLayout(masses, elements, !usable, axis, spacing)
        {
            ElectricalNodes = [.. network.ElectricalNodes],
        };
    }

    private static Point[] AutomaticPositions(Network network)
    {
        var neighbours = network.Masses.ToDictionary(m => m.Name, _ => new List<string>());
        foreach (var (a, b) in Links(network))
        {
            if (neighbours.TryGetValue(a, out var na)) na.Add(b);
            if (neighbours.TryGetValue(b, out var nb)) nb.Add(a);
        }
        var level = new Dictionary<string, int>();
        var column = new Dictionary<string, int>();
        var queue = new Queue<string>();
        foreach (var (a, b) in Links(network))
        {
            foreach (var (support, mass) in new[] { (a, b), (b, a) })
                if (network.IsSupport(support) && network.IsMass(mass) && level.TryAdd(mass, 1))
                {
                    column[mass] = 0;
                    queue.Enqueue(mass);
                }
        }
        var columns = 1;
        while (true)
        {
            while (queue.Count > 0)
            {
                var node = queue.Dequeue();
                foreach (var next in neighbours[node])
                    if (network.IsMass(next) && level.TryAdd(next, level[node] + 1))
                    {
                        column[next] = column[node];
                        queue.Enqueue(next);
                    }
            }
            // A part with no path to a support gets a column of its own, starting at its first declared mass.
            var loose = network.Masses.FirstOrDefault(m => !level.ContainsKey(m.Name));
            if (loose is null) break;
            level[loose.Name] = 1;
            column[loose.Name] = columns++;
            queue.Enqueue(loose.Name);
        }

        var positions = new Point[network.Masses.Length];
        var columnWidth = new double[columns];
        var rows = network.Masses.Select((m, i) => (m.Name, i)).GroupBy(p => (column[p.Name], level[p.Name])).ToArray();
        foreach (var row in rows)
            columnWidth[row.Key.Item1] = Math.Max(columnWidth[row.Key.Item1], (row.Count() - 1) * SideGap);
        var columnStart = new double[columns];
        for (var c = 1; c < columns; c++) columnStart[c] = columnStart[c - 1] + columnWidth[c - 1] / 2 + 2 * SideGap + columnWidth[c] / 2;
        foreach (var row in rows)
        {
            var members = row.ToArray();
            for (var j = 0; j < members.Length; j++)
                positions[members[j].i] = new Point(columnStart[row.Key.Item1] + (j - (members.Length - 1) / 2.0) * SideGap, row.Key.Item2 * LevelGap);
        }
        return positions;
    }

    private static IEnumerable<(string A, string B)> Links(Network network) =>
        network.Springs.Select(s => (s.NodeA, s.NodeB)).Concat(network.Dampers.Select(d => (d.NodeA, d.NodeB)))
            .Concat(network.Inerters.Select(i => (i.NodeA, i.NodeB)));

    private static double TypicalSpacing(Network network, Point[] positions, Dictionary<string, int> index)
    {
        var lengths = Links(network)
            .Where(l => index.ContainsKey(l.A) && index.ContainsKey(l.B))
            .Select(l => (positions[index[l.A]] - positions[index[l.B]]).Length)
            .Where(d => d > 0)
            .Order()
            .ToArray();
        if (lengths.Length > 0) return lengths[lengths.Length / 2];
        if (positions.Length > 1)
        {
            var extent = Math.Max(positions.Max(p => p.X) - positions.Min(p => p.X), positions.Max(p => p.Y) - positions.Min(p => p.Y));
            if (extent > 0) return extent / (positions.Length - 1);
        }
        return LevelGap;
    }

    private static ImmutableArray<DrawnElement> DrawnElements(Network network, Point[] positions, Dictionary<string, int> index, ChainAxis axis, double spacing)
    {
        // Work in (along, across) coordinates so both axes share one rule: supports sit one spacing "below" the chain.
        Point ToLocal(Point p) => axis == ChainAxis.Vertical ? new Point(p.Y, p.X) : new Point(p.X, -p.Y);
        Point FromLocal(Point q) => axis == ChainAxis.Vertical ? new Point(q.Y, q.X) : new Point(q.X, -q.Y);
        var lowest = positions.Min(p => ToLocal(p).X);
        var supportsByName = network.Supports.ToDictionary(s => s.Name);

        ElementEnd End(string node, string other)
        {
            if (index.TryGetValue(node, out _)) return new ElementEnd(node, default);
            if (supportsByName[node].Position is { } at) return new ElementEnd(null, new Point(at.X, at.Y)) { Support = node };
            if (!index.TryGetValue(other, out var m)) return new ElementEnd(null, default) { Support = node };
            var local = ToLocal(positions[m]);
            var anchor = local.X - lowest < 0.25 * spacing
                ? new Point(lowest - spacing, local.Y)                              // on the common ground line
                : new Point(local.X - 0.7 * spacing, local.Y + 0.8 * spacing);      // a local support beside the mass
            return new ElementEnd(null, FromLocal(anchor)) { Support = node };
        }

        var raw = network.Springs.Select(s => (s.Name, Kind: ElementKind.Spring, s.NodeA, s.NodeB, Value: s.Stiffness))
            .Concat(network.Dampers.Select(d => (d.Name, Kind: ElementKind.Damper, d.NodeA, d.NodeB, Value: d.Coefficient)))
            .Concat(network.Inerters.Select(i => (i.Name, Kind: ElementKind.Inerter, i.NodeA, i.NodeB, Value: i.Inertance)))
            .Concat(network.Transducers.Select(t => (t.Name, Kind: ElementKind.Transducer, t.NodeA, t.NodeB, Value: t.ForceFactor)))
            .ToArray();
        var branches = network.Transducers.ToDictionary(t => t.Name,
            t => new[] { t.BranchA, t.BranchB }.Where(index.ContainsKey).ToImmutableArray(), StringComparer.Ordinal);
        string Key(string a, string b) => string.CompareOrdinal(a, b) < 0 ? a + "\u0001" + b : b + "\u0001" + a;
        var groups = raw.GroupBy(e => Key(e.NodeA, e.NodeB)).ToDictionary(g => g.Key, g => g.Select(e => e.Name).ToList());
        var firstA = raw.GroupBy(e => Key(e.NodeA, e.NodeB)).ToDictionary(g => g.Key, g => g.First().NodeA);
        return [.. raw.Select(e =>
        {
            var group = groups[Key(e.NodeA, e.NodeB)];
            return new DrawnElement(e.Name, e.Kind, End(e.NodeA, e.NodeB), End(e.NodeB, e.NodeA), e.Value, group.IndexOf(e.Name), group.Count)
            {
                Branch = e.Kind == ElementKind.Transducer ? branches[e.Name] : [],
                Reversed = e.NodeA != firstA[Key(e.NodeA, e.NodeB)],
                Electrical = e.Kind != ElementKind.Transducer && network.IsElectricalElement(e.NodeA, e.NodeB),
            };
        })];
    }
}
