using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>Collects elements and produces an immutable <see cref="Network"/>; the only mutable view of a network.</summary>
public sealed class NetworkBuilder
{
    private readonly List<Mass> _masses = [];
    private readonly List<Support> _supports = [new Support(Network.Ground)];
    private readonly List<Spring> _springs = [];
    private readonly List<Damper> _dampers = [];
    private readonly List<Link> _links = [];
    private readonly List<RigidBody> _bodies = [];
    private readonly Dictionary<string, RigidBody> _bodyByName = new(StringComparer.Ordinal);
    private readonly HashSet<string> _names = [Network.Ground];
    private readonly HashSet<string> _springNames = [];
    private readonly HashSet<string> _damperNames = [];
    private readonly List<Inerter> _inerters = [];
    private readonly HashSet<string> _inerterNames = [];
    private readonly List<Transducer> _transducers = [];
    private readonly List<string> _electrical = [];

    /// <summary>Title of the network being built.</summary>
    public string Title { get; set; } = "Untitled network";

    /// <summary>The space the nodes move in; <see cref="ModelSpace.Line"/> by default.</summary>
    public ModelSpace Space { get; set; } = ModelSpace.Line;

    /// <summary>Adds a mass given as a record (location and directions included).</summary>
    public NetworkBuilder AddMass(Mass mass)
    {
        ArgumentNullException.ThrowIfNull(mass);
        Guard.NonNegative(mass.Kilograms, nameof(mass));
        foreach (var d in mass.Moves)
            if (d.IsRotation() || d == Dofs.Direction.Along)
                throw new ArgumentException($"Mass '{mass.Name}' may move only in translations of the model's space, not '{d}'.", nameof(mass));
        ClaimNodeName(mass.Name);
        _masses.Add(mass);
        return this;
    }

    /// <summary>Adds a support given as a record (location included).</summary>
    public NetworkBuilder AddSupport(Support support)
    {
        ArgumentNullException.ThrowIfNull(support);
        ClaimNodeName(support.Name);
        _supports.Add(support);
        return this;
    }

    /// <summary>Replaces ground's record (its drawing position and location); the name must stay <see cref="Network.Ground"/>.</summary>
    public NetworkBuilder PlaceGround(Support ground)
    {
        ArgumentNullException.ThrowIfNull(ground);
        if (ground.Name != Network.Ground) throw new ArgumentException("Ground keeps its name.", nameof(ground));
        _supports[0] = ground;
        return this;
    }

    /// <summary>Adds a rigid body (plane and 3d models); its points become attachable as <c>body.point</c>.</summary>
    public NetworkBuilder AddBody(RigidBody body)
    {
        ArgumentNullException.ThrowIfNull(body);
        Guard.Positive(body.Kilograms, nameof(body));
        if (Space == ModelSpace.Line) throw new ArgumentException($"Rigid body '{body.Name}' needs a plane or 3d model.", nameof(body));
        if (body.Points.Select(p => p.Name).Distinct(StringComparer.Ordinal).Count() != body.Points.Length)
            throw new ArgumentException($"Rigid body '{body.Name}' names a point twice.", nameof(body));
        ClaimNodeName(body.Name);
        _bodies.Add(body);
        _bodyByName[body.Name] = body;
        return this;
    }

    /// <summary>Adds a spring given as a record (directional components or axial included).</summary>
    public NetworkBuilder AddSpring(Spring spring)
    {
        ArgumentNullException.ThrowIfNull(spring);
        Guard.NonNegative(spring.Stiffness, nameof(spring));
        foreach (var c in spring.Components) Guard.NonNegative(c.Value, nameof(spring));
        return AddElement(_springs, _springNames, spring, spring.Name, spring.NodeA, spring.NodeB, "spring", nameof(spring));
    }

    /// <summary>Adds a damper given as a record (directional components or axial included).</summary>
    public NetworkBuilder AddDamper(Damper damper)
    {
        ArgumentNullException.ThrowIfNull(damper);
        Guard.NonNegative(damper.Coefficient, nameof(damper));
        foreach (var c in damper.Components) Guard.NonNegative(c.Value, nameof(damper));
        return AddElement(_dampers, _damperNames, damper, damper.Name, damper.NodeA, damper.NodeB, "damper", nameof(damper));
    }

    /// <summary>Adds a mass.</summary>
    /// <param name="name">Unique name.</param>
    /// <param name="kilograms">Mass in kg, non-negative and finite; 0 declares a massless node.</param>
    /// <param name="position">Optional drawing position in m.</param>
    public NetworkBuilder AddMass(string name, double kilograms, DrawingPosition? position = null)
    {
        Guard.NonNegative(kilograms, nameof(kilograms));
        ClaimNodeName(name);
        _masses.Add(new Mass(name, kilograms, position));
        return this;
    }

    /// <summary>Adds a massless node of a line model: a mass of 0 kg where springs, dampers and inerters meet (plane and 3d
    /// models add a <see cref="Mass"/> record of 0 kg with its location and translations).</summary>
    /// <param name="name">Unique name.</param>
    /// <param name="position">Optional drawing position in m.</param>
    public NetworkBuilder AddNode(string name, DrawingPosition? position = null) => AddMass(name, 0, position);

    /// <summary>Adds a support (a node that does not move unless an analysis prescribes its motion).</summary>
    public NetworkBuilder AddSupport(string name, DrawingPosition? position = null)
    {
        ClaimNodeName(name);
        _supports.Add(new Support(name, position));
        return this;
    }

    /// <summary>Sets the drawing position of ground.</summary>
    public NetworkBuilder PlaceGround(DrawingPosition position)
    {
        _supports[0] = _supports[0] with { Position = position };
        return this;
    }

    /// <summary>Adds a spring of stiffness <paramref name="stiffness"/> in N/m between two existing nodes.</summary>
    public NetworkBuilder AddSpring(string name, string nodeA, string nodeB, double stiffness)
    {
        Guard.NonNegative(stiffness, nameof(stiffness));
        return AddElement(_springs, _springNames, new Spring(name, nodeA, nodeB, stiffness), name, nodeA, nodeB, "spring", nameof(name));
    }

    /// <summary>Adds a viscous damper of coefficient <paramref name="coefficient"/> in N·s/m between two existing nodes.</summary>
    public NetworkBuilder AddDamper(string name, string nodeA, string nodeB, double coefficient)
    {
        Guard.NonNegative(coefficient, nameof(coefficient));
        return AddElement(_dampers, _damperNames, new Damper(name, nodeA, nodeB, coefficient), name, nodeA, nodeB, "damper", nameof(name));
    }

    /// <summary>Adds an inerter of inertance <paramref name="inertance"/> in kg between two existing masses or supports of a line model.</summary>
    public NetworkBuilder AddInerter(string name, string nodeA, string nodeB, double inertance)
    {
        Guard.NonNegative(inertance, nameof(inertance));
        if (Space != ModelSpace.Line && inertance > 0)
            throw new ArgumentException($"Inerter '{name}' in a plane or 3d model needs directional components or 'axial': add it as a record.", nameof(name));
        return AddInerter(new Inerter(name, nodeA, nodeB, inertance));
    }

    /// <summary>Adds an inerter given as a record (directional components or axial included, in plane and 3d models).</summary>
    public NetworkBuilder AddInerter(Inerter inerter)
    {
        ArgumentNullException.ThrowIfNull(inerter);
        Guard.NonNegative(inerter.Inertance, nameof(inerter));
        foreach (var c in inerter.Components) Guard.NonNegative(c.Value, nameof(inerter));
        if (Space == ModelSpace.Line && (inerter.Axial || !inerter.Components.IsDefaultOrEmpty))
            throw new ArgumentException($"Inerter '{inerter.Name}' has directions, which need a plane or 3d model.", nameof(inerter));
        CheckEnds(inerter.Name, inerter.NodeA, inerter.NodeB);
        if (!_inerterNames.Add(inerter.Name))
            throw new ArgumentException($"An inerter named '{inerter.Name}' already exists.", nameof(inerter));
        _inerters.Add(inerter);
        return this;
    }

    /// <summary>Adds an ideal electrodynamic transducer of force factor <paramref name="forceFactor"/> in T·m (line models only).</summary>
    /// <param name="name">Unique transducer name.</param>
    /// <param name="nodeA">Mechanical terminal a (mass or support).</param>
    /// <param name="nodeB">Mechanical terminal b (mass or support).</param>
    /// <param name="branchA">Electrical terminal n1 (a mass standing for an electrical node, or a support).</param>
    /// <param name="branchB">Electrical terminal n2.</param>
    /// <param name="forceFactor">Bl in T·m, positive and finite.</param>
    /// <exception cref="ArgumentException">
    /// Unknown or repeated terminals, a plane or 3d model, or terminals <see cref="Assembly.ConstraintElimination"/> cannot
    /// eliminate (see <see cref="Assembly.ConstraintElimination.Problem"/>).
    /// </exception>
    public NetworkBuilder AddTransducer(string name, string nodeA, string nodeB, string branchA, string branchB, double forceFactor)
    {
        Guard.Positive(forceFactor, nameof(forceFactor));
        if (Space != ModelSpace.Line) throw new ArgumentException($"Transducer '{name}' needs a line model.", nameof(name));
        CheckEnds(name, nodeA, nodeB);
        CheckEnds(name, branchA, branchB);
        if (_transducers.Any(t => t.Name == name))
            throw new ArgumentException($"A transducer named '{name}' already exists.", nameof(name));
        var transducer = new Transducer(name, nodeA, nodeB, branchA, branchB, forceFactor);
        var supports = _supports.Select(s => s.Name).ToHashSet(StringComparer.Ordinal);
        var linked = _links.SelectMany(l => l.Masses).ToHashSet(StringComparer.Ordinal);
        if (Assembly.ConstraintElimination.Problem(_transducers, transducer, supports.Contains, linked.Contains) is { } problem)
            throw new ArgumentException(problem, nameof(branchA));
        _transducers.Add(transducer);
        return this;
    }

    /// <summary>Marks an existing mass, massless node or support (not ground) as an electrical circuit node (see <see cref="Network.ElectricalNodes"/>).</summary>
    /// <param name="node">The node's name.</param>
    public NetworkBuilder MarkElectrical(string node)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(node);
        if (node == Network.Ground || !_names.Contains(node) || _bodyByName.ContainsKey(node))
            throw new ArgumentException($"'{node}' is not a mass, massless node or support of the network (ground is shared and never marked).", nameof(node));
        if (!_electrical.Contains(node)) _electrical.Add(node);
        return this;
    }

    /// <summary>Ties existing masses rigidly together: they will share one degree of freedom and their masses add.</summary>
    /// <param name="name">Unique link name.</param>
    /// <param name="masses">At least two different masses (never a support).</param>
    public NetworkBuilder AddLink(string name, params string[] masses)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        ArgumentNullException.ThrowIfNull(masses);
        if (_links.Any(l => l.Name == name))
            throw new ArgumentException($"A link named '{name}' already exists.", nameof(name));
        if (masses.Length < 2) throw new ArgumentException($"Link '{name}' needs at least two masses.", nameof(masses));
        foreach (var m in masses)
            if (!_masses.Any(x => x.Name == m))
                throw new ArgumentException($"Link '{name}' refers to '{m}', which is not a mass of the network.", nameof(masses));
        if (masses.Distinct().Count() != masses.Length)
            throw new ArgumentException($"Link '{name}' names a mass twice.", nameof(masses));
        _links.Add(new Link(name, [.. masses]));
        return this;
    }

    /// <summary>Produces the immutable network; the electrical side of its transducers (<see cref="Topology.ElectricalSide"/>) joins the nodes marked electrical.</summary>
    /// <exception cref="ArgumentException">A massless node of a plane or 3d model without a location.</exception>
    public Network Build()
    {
        if (Space != ModelSpace.Line && _masses.FirstOrDefault(m => m.Kilograms == 0 && m.Location is null) is { } massless)
            throw new ArgumentException($"Massless node '{massless.Name}' has no location; every node of a plane or 3d model needs one.");
        // The electrical side of the transducers is electrical too, so Network.IsElectrical is the one source of truth.
        var side = _transducers.Count == 0 ? [] : Topology.ElectricalSide([.. _masses.Select(m => m.Name)], [.. _supports.Select(s => s.Name)],
            _springs.Select(e => (e.NodeA, e.NodeB)).Concat(_dampers.Select(e => (e.NodeA, e.NodeB))).Concat(_inerters.Select(e => (e.NodeA, e.NodeB))),
            _transducers);
        ImmutableArray<string> electrical = [.. _electrical.Concat(side.Where(n => !_electrical.Contains(n)))];
        return new(Title, [.. _masses], [.. _supports], [.. _springs], [.. _dampers]) { Links = [.. _links], Space = Space, Bodies = [.. _bodies], Inerters = [.. _inerters], Transducers = [.. _transducers], ElectricalNodes = electrical };
    }

    /// <summary>Checks a two-node element's ends and name (unique among its kind) and appends it.</summary>
    private NetworkBuilder AddElement<T>(List<T> elements, HashSet<string> names, T element, string name, string nodeA, string nodeB,
        string kind, string parameter)
    {
        CheckEnds(name, nodeA, nodeB);
        if (!names.Add(name)) throw new ArgumentException($"A {kind} named '{name}' already exists.", parameter);
        elements.Add(element);
        return this;
    }

    private void ClaimNodeName(string name)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        if (!_names.Add(name))
            throw new ArgumentException($"A node named '{name}' already exists.", nameof(name));
    }

    private void CheckEnds(string element, string nodeA, string nodeB)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(element);
        if (!Known(nodeA)) throw new ArgumentException($"'{element}' refers to unknown node '{nodeA}'.", nameof(nodeA));
        if (!Known(nodeB)) throw new ArgumentException($"'{element}' refers to unknown node '{nodeB}'.", nameof(nodeB));
        if (nodeA == nodeB) throw new ArgumentException($"'{element}' connects '{nodeA}' to itself.", nameof(nodeB));
    }

    /// <summary>A node name, or <c>body.point</c> of a body already added.</summary>
    private bool Known(string reference)
    {
        if (_names.Contains(reference)) return true;
        var dot = reference.LastIndexOf('.');
        return dot > 0 && _bodyByName.TryGetValue(reference[..dot], out var body) && body.FindPoint(reference[(dot + 1)..]) is not null;
    }
}
