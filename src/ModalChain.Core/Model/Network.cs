using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>A point on the drawing plane, in metres; used only to draw the network, never in the mechanics.</summary>
/// <param name="X">Horizontal drawing coordinate in m.</param>
/// <param name="Y">Vertical drawing coordinate in m.</param>
public readonly record struct DrawingPosition(double X, double Y);

/// <summary>Where an element end or a load attaches.</summary>
/// <param name="Node">The mass, support or body it belongs to.</param>
/// <param name="Point">The body's point name; null for a mass, a support or a body's centre of mass.</param>
/// <param name="Location">The body point's (or centre of mass's) location in m; null for masses and supports (see their own locations).</param>
public sealed record Attachment(string Node, string? Point, Point3? Location);

/// <summary>A lumped mass that moves in the network's direction of motion.</summary>
/// <param name="Name">Unique name of the mass within its network.</param>
/// <param name="Kilograms">Mass in kg; non-negative and finite. 0 is a massless node (line models): a point where springs, dampers and inerters meet, with no inertia of its own.</param>
/// <param name="Position">Optional drawing position in m.</param>
public sealed record Mass(string Name, double Kilograms, DrawingPosition? Position = null)
{
    /// <summary>Location in global axes, m: mechanical data in plane and 3d models (null in line models).</summary>
    public Point3? Location { get; init; }

    /// <summary>
    /// The translations this mass moves in (plane and 3d models); empty means every translation of the model's space.
    /// Never a rotation: a point mass has no rotary inertia (use a rigid body).
    /// </summary>
    public ImmutableArray<Dofs.Direction> Moves { get; init; } = [];
}

/// <summary>A fixed or prescribed-motion point of the network; <see cref="Network.Ground"/> always exists.</summary>
/// <param name="Name">Unique name of the support.</param>
/// <param name="Position">Optional drawing position in m.</param>
public sealed record Support(string Name, DrawingPosition? Position = null)
{
    /// <summary>Location in global axes, m: mechanical data in plane and 3d models (null in line models).</summary>
    public Point3? Location { get; init; }
}

/// <summary>A linear spring between two nodes (masses or supports).</summary>
/// <param name="Name">Unique name of the spring within its network.</param>
/// <param name="NodeA">First end: a mass or support name.</param>
/// <param name="NodeB">Second end: a mass or support name, different from <paramref name="NodeA"/>.</param>
/// <param name="Stiffness">Stiffness in N/m; non-negative and finite.</param>
/// <remarks>
/// Ends are node names, or <c>body.point</c> for a point of a rigid body. In a line model <paramref name="Stiffness"/>
/// acts along the line of motion. In plane and 3d models the spring acts either along the line between its ends
/// (<see cref="Axial"/>, stiffness <paramref name="Stiffness"/>) or per global direction (<see cref="Components"/>,
/// translations in N/m and rotations in N·m/rad), and <paramref name="Stiffness"/> is then the largest translational
/// component, kept as the spring's scale for warnings and tables.
/// </remarks>
public sealed record Spring(string Name, string NodeA, string NodeB, double Stiffness)
{
    /// <summary>Stiffness per global direction in plane and 3d models; empty in line models and for axial springs.</summary>
    public ImmutableArray<DirectionalValue> Components { get; init; } = [];

    /// <summary>True when <see cref="Spring.Stiffness"/> acts along the line between the ends' locations (plane and 3d models).</summary>
    public bool Axial { get; init; }
}

/// <summary>A linear viscous damper between two nodes (masses or supports).</summary>
/// <param name="Name">Unique name of the damper within its network.</param>
/// <param name="NodeA">First end: a mass or support name.</param>
/// <param name="NodeB">Second end: a mass or support name, different from <paramref name="NodeA"/>.</param>
/// <param name="Coefficient">Damping coefficient in N·s/m; non-negative and finite.</param>
/// <remarks>Directions work as for <see cref="Spring"/>: <see cref="Components"/> in N·s/m and N·m·s/rad, or <see cref="Axial"/>.</remarks>
public sealed record Damper(string Name, string NodeA, string NodeB, double Coefficient)
{
    /// <summary>Damping coefficient per global direction in plane and 3d models; empty in line models and for axial dampers.</summary>
    public ImmutableArray<DirectionalValue> Components { get; init; } = [];

    /// <summary>True when <see cref="Damper.Coefficient"/> acts along the line between the ends' locations.</summary>
    public bool Axial { get; init; }
}

/// <summary>An inerter between two nodes: a two-terminal element whose force is b·(ẍ_a − ẍ_b).</summary>
/// <param name="Name">Unique name of the inerter within its network.</param>
/// <param name="NodeA">First end: a mass or support name (or a body, or <c>body.point</c>, in plane and 3d models).</param>
/// <param name="NodeB">Second end, different from <paramref name="NodeA"/>.</param>
/// <param name="Inertance">Inertance b in kg; non-negative and finite.</param>
/// <remarks>
/// It adds b to M exactly as a spring adds k to K: b on both ends' diagonals and −b off the diagonal; an end on a
/// fixed support drops its row (the grounded terminal adds b to the other end's apparent mass), and an end on a
/// moving support loads the other end by b·ü_support. Ends are node names, or <c>body.point</c> in plane and 3d
/// models, where the inerter acts either along the line between its ends (<see cref="Axial"/>, inertance
/// <paramref name="Inertance"/>) or per global direction (<see cref="Components"/>, translations in kg and rotations
/// in kg·m²/rad), and <paramref name="Inertance"/> is then the largest translational component.
/// </remarks>
public sealed record Inerter(string Name, string NodeA, string NodeB, double Inertance)
{
    /// <summary>Inertance per global direction in plane and 3d models; empty in line models and for axial inerters.</summary>
    public ImmutableArray<DirectionalValue> Components { get; init; } = [];

    /// <summary>True when <see cref="Inerter.Inertance"/> acts along the line between the ends' locations (plane and 3d models).</summary>
    public bool Axial { get; init; }
}

/// <summary>Masses tied rigidly together: they move as one, share one degree of freedom and their masses add.</summary>
/// <param name="Name">Unique name of the link within its network.</param>
/// <param name="Masses">The masses tied, at least two, all different; never a support.</param>
/// <remarks>
/// A link is the exact form of a connection much stiffer than the rest of the network (a bolted flange, a stiff
/// frame), which as a very stiff spring costs accuracy in the eigen solve.
/// </remarks>
public sealed record Link(string Name, ImmutableArray<string> Masses);

/// <summary>An immutable lumped network of masses, springs and dampers moving in one direction.</summary>
/// <remarks>
/// Build one with <see cref="NetworkBuilder"/>, which checks the references between elements.
/// Every quantity is in SI units. Supports are fixed unless an analysis prescribes their motion.
/// </remarks>
public sealed record Network
{
    /// <summary>The reserved name of the fixed support that every network has.</summary>
    public const string Ground = "ground";

    internal Network(string title, ImmutableArray<Mass> masses, ImmutableArray<Support> supports,
        ImmutableArray<Spring> springs, ImmutableArray<Damper> dampers)
    {
        Title = title;
        Masses = masses;
        Supports = supports;
        Springs = springs;
        Dampers = dampers;
    }

    /// <summary>Human-readable title of the model.</summary>
    public string Title { get; }

    /// <summary>The masses, in declaration order; this order numbers the degrees of freedom.</summary>
    public ImmutableArray<Mass> Masses { get; }

    /// <summary>The supports, <see cref="Ground"/> first.</summary>
    public ImmutableArray<Support> Supports { get; }

    /// <summary>The springs, in declaration order.</summary>
    public ImmutableArray<Spring> Springs { get; }

    /// <summary>The discrete viscous dampers, in declaration order.</summary>
    public ImmutableArray<Damper> Dampers { get; }

    /// <summary>The rigid links between masses, in declaration order; linked masses share one degree of freedom.</summary>
    public ImmutableArray<Link> Links { get; internal init; } = [];

    /// <summary>The inerters, in declaration order; they put inertance into M, off its diagonal between two moving nodes.</summary>
    public ImmutableArray<Inerter> Inerters { get; internal init; } = [];

    /// <summary>The transducers (line models only), in declaration order; each removes one electrical coordinate (see <see cref="Transducer"/>).</summary>
    public ImmutableArray<Transducer> Transducers { get; internal init; } = [];

    /// <summary>
    /// The nodes that are electrical circuit nodes (a circuit model's, or a <c>circuit:</c> section's inside a line
    /// model), in declaration order: masses (capacitance in F to ground, or massless) and supports (held by a voltage
    /// source) whose coordinate is the node flux linkage in V·s, so their velocity is a voltage in V (see
    /// <see cref="CircuitAnalogy"/>). Empty for a purely mechanical network.
    /// </summary>
    public ImmutableArray<string> ElectricalNodes { get; internal init; } = [];

    /// <summary>True when <paramref name="node"/> is one of <see cref="ElectricalNodes"/>.</summary>
    public bool IsElectrical(string node) => !ElectricalNodes.IsEmpty && NodeNames.Of(this).Electrical.Contains(node);

    /// <summary>
    /// True when an element between <paramref name="nodeA"/> and <paramref name="nodeB"/> is on the electrical side (an
    /// end on an electrical node): in the node flux form a spring is then an inductor, a damper a resistor and an inerter
    /// a capacitor, and its force is a current.
    /// </summary>
    public bool IsElectricalElement(string nodeA, string nodeB) => IsElectrical(nodeA) || IsElectrical(nodeB);

    /// <summary>The space the nodes move in; <see cref="ModelSpace.Line"/> unless the model declares another.</summary>
    public ModelSpace Space { get; internal init; } = ModelSpace.Line;

    /// <summary>The rigid bodies (plane and 3d models only), in declaration order, numbered after the masses.</summary>
    public ImmutableArray<RigidBody> Bodies { get; internal init; } = [];

    /// <summary>
    /// Sum of all masses and bodies in kg: the physical mass (inerters carry no mass of their own, and an electrical
    /// node's "mass" is a capacitance in F, not counted).
    /// </summary>
    public double TotalMass => Masses.Where(m => !IsElectrical(m.Name)).Sum(m => m.Kilograms) + Bodies.Sum(b => b.Kilograms);

    /// <summary>True when <paramref name="node"/> names a rigid body.</summary>
    public bool IsBody(string node) => NodeNames.Of(this).Bodies.ContainsKey(node);

    /// <summary>
    /// Where an element end or load attaches: a mass or support by name, a body's centre of mass by the body's name,
    /// or a body's point as <c>body.point</c>. Returns null when <paramref name="reference"/> names nothing.
    /// </summary>
    public Attachment? Resolve(string reference)
    {
        var names = NodeNames.Of(this);
        if (names.Masses.Contains(reference)) return new Attachment(reference, null, null);
        if (names.Supports.Contains(reference)) return new Attachment(reference, null, null);
        if (names.Bodies.TryGetValue(reference, out var body)) return new Attachment(body.Name, null, body.CentreOfMass);
        var dot = reference.LastIndexOf('.');
        if (dot > 0 && names.Bodies.TryGetValue(reference[..dot], out body) && body.FindPoint(reference[(dot + 1)..]) is { } point)
            return new Attachment(body.Name, point.Name, point.Location);
        return null;
    }

    /// <summary>True when <paramref name="node"/> names a support (including ground).</summary>
    public bool IsSupport(string node) => NodeNames.Of(this).Supports.Contains(node);

    /// <summary>True when <paramref name="node"/> names a mass.</summary>
    public bool IsMass(string node) => NodeNames.Of(this).Masses.Contains(node);

    /// <summary>Returns a copy with the masses in another order (same elements otherwise).</summary>
    /// <param name="order">A permutation of 0..n−1: entry i is the old index of the new i-th mass.</param>
    public Network WithMassOrder(IReadOnlyList<int> order)
    {
        Guard.Permutation(order, Masses.Length, nameof(order));
        return new Network(Title, [.. order.Select(i => Masses[i])], Supports, Springs, Dampers) { Links = Links, Space = Space, Bodies = Bodies, Inerters = Inerters, Transducers = Transducers, ElectricalNodes = ElectricalNodes };
    }
}

/// <summary>The node names of a network as hash sets, built once per network on first use, so look-ups cost O(1).</summary>
/// <remarks>Kept outside the record (in a weak table) so that record equality and <c>with</c> copies are unchanged.</remarks>
internal sealed class NodeNames
{
    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<Network, NodeNames> Table = new();

    private NodeNames(Network network)
    {
        Masses = network.Masses.Select(m => m.Name).ToHashSet(StringComparer.Ordinal);
        Supports = network.Supports.Select(s => s.Name).ToHashSet(StringComparer.Ordinal);
        Bodies = network.Bodies.ToDictionary(b => b.Name, StringComparer.Ordinal);
        Electrical = network.ElectricalNodes.ToHashSet(StringComparer.Ordinal);
    }

    public HashSet<string> Electrical { get; }

    public Dictionary<string, RigidBody> Bodies { get; }

    public HashSet<string> Masses { get; }

    public HashSet<string> Supports { get; }

    public static NodeNames Of(Network network) => Table.GetValue(network, n => new NodeNames(n));
}
