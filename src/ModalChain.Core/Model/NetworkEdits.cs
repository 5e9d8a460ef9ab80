using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>Copies of a network with one value changed or elements added, for studies and absorber design.</summary>
/// <remarks>The originals are never modified; every copy keeps the element order, so DOF numbering is stable.</remarks>
public static class NetworkEdits
{
    /// <summary>A copy in which mass <paramref name="name"/> weighs <paramref name="kilograms"/> kg.</summary>
    public static Network WithMassValue(this Network network, string name, double kilograms)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.Positive(kilograms, nameof(kilograms));
        var i = IndexOf(network.Masses, m => m.Name == name, "mass", name);
        return Copy(network, masses: network.Masses.SetItem(i, network.Masses[i] with { Kilograms = kilograms }));
    }

    /// <summary>A copy in which rigid body <paramref name="name"/> weighs <paramref name="kilograms"/> kg; its centre of mass and inertia are kept.</summary>
    public static Network WithBodyMass(this Network network, string name, double kilograms)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.Positive(kilograms, nameof(kilograms));
        var i = IndexOf(network.Bodies, b => b.Name == name, "body", name);
        return Copy(network, bodies: network.Bodies.SetItem(i, network.Bodies[i] with { Kilograms = kilograms }));
    }

    /// <summary>A copy in which spring <paramref name="name"/> has stiffness <paramref name="stiffness"/> N/m.</summary>
    /// <remarks>
    /// A per-direction spring (plane and 3d models) has its scale, the largest translational component, set to
    /// <paramref name="stiffness"/> and every component, rotations included, multiplied by the same factor.
    /// </remarks>
    /// <exception cref="ArgumentException">A per-direction spring whose scale is 0 (no translational stiffness above zero) asked for a non-zero value.</exception>
    public static Network WithSpringStiffness(this Network network, string name, double stiffness)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(stiffness, nameof(stiffness));
        var i = IndexOf(network.Springs, s => s.Name == name, "spring", name);
        var spring = network.Springs[i];
        var components = Scaled(spring.Components, spring.Stiffness, stiffness, "spring", name);
        return Copy(network, springs: network.Springs.SetItem(i, spring with { Stiffness = stiffness, Components = components }));
    }

    /// <summary>A copy in which per-direction spring <paramref name="name"/> has <paramref name="value"/> (N/m, or N·m/rad for a rotation) in <paramref name="direction"/>; its other directions are kept.</summary>
    /// <exception cref="ArgumentException">The spring has no component in <paramref name="direction"/>.</exception>
    public static Network WithSpringComponent(this Network network, string name, Dofs.Direction direction, double value)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(value, nameof(value));
        var i = IndexOf(network.Springs, s => s.Name == name, "spring", name);
        var spring = network.Springs[i];
        var components = WithComponent(spring.Components, direction, value, "spring", name);
        return Copy(network, springs: network.Springs.SetItem(i, spring with { Stiffness = Scale(components), Components = components }));
    }

    /// <summary>A copy in which damper <paramref name="name"/> has coefficient <paramref name="coefficient"/> N·s/m.</summary>
    /// <remarks>A per-direction damper has every component scaled in proportion, as <see cref="WithSpringStiffness"/> does.</remarks>
    public static Network WithDamperCoefficient(this Network network, string name, double coefficient)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(coefficient, nameof(coefficient));
        var i = IndexOf(network.Dampers, d => d.Name == name, "damper", name);
        var damper = network.Dampers[i];
        var components = Scaled(damper.Components, damper.Coefficient, coefficient, "damper", name);
        return Copy(network, dampers: network.Dampers.SetItem(i, damper with { Coefficient = coefficient, Components = components }));
    }

    /// <summary>A copy in which per-direction damper <paramref name="name"/> has <paramref name="value"/> (N·s/m, or N·m·s/rad for a rotation) in <paramref name="direction"/>.</summary>
    public static Network WithDamperComponent(this Network network, string name, Dofs.Direction direction, double value)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(value, nameof(value));
        var i = IndexOf(network.Dampers, d => d.Name == name, "damper", name);
        var damper = network.Dampers[i];
        var components = WithComponent(damper.Components, direction, value, "damper", name);
        return Copy(network, dampers: network.Dampers.SetItem(i, damper with { Coefficient = Scale(components), Components = components }));
    }

    /// <summary>A copy in which inerter <paramref name="name"/> has inertance <paramref name="inertance"/> kg.</summary>
    /// <remarks>A per-direction inerter (plane and 3d models) has every component scaled in proportion, as <see cref="WithSpringStiffness"/> does; an axial one has its axial inertance set.</remarks>
    /// <exception cref="ArgumentException">A per-direction inerter whose scale is 0 asked for a non-zero value.</exception>
    public static Network WithInerterInertance(this Network network, string name, double inertance)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(inertance, nameof(inertance));
        var i = IndexOf(network.Inerters, b => b.Name == name, "inerter", name);
        var inerter = network.Inerters[i];
        var components = Scaled(inerter.Components, inerter.Inertance, inertance, "inerter", name);
        return Copy(network, inerters: network.Inerters.SetItem(i, inerter with { Inertance = inertance, Components = components }));
    }

    /// <summary>A copy in which per-direction inerter <paramref name="name"/> has <paramref name="value"/> (kg, or kg·m²/rad for a rotation) in <paramref name="direction"/>; its other directions are kept.</summary>
    /// <exception cref="ArgumentException">The inerter has no component in <paramref name="direction"/>.</exception>
    public static Network WithInerterComponent(this Network network, string name, Dofs.Direction direction, double value)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(value, nameof(value));
        var i = IndexOf(network.Inerters, b => b.Name == name, "inerter", name);
        var inerter = network.Inerters[i];
        var components = WithComponent(inerter.Components, direction, value, "inerter", name);
        return Copy(network, inerters: network.Inerters.SetItem(i, inerter with { Inertance = Scale(components), Components = components }));
    }

    /// <summary>A copy in which transducer <paramref name="name"/> has force factor <paramref name="forceFactor"/> T·m (above zero).</summary>
    /// <remarks>The transducer's ends and branch are kept, so the same electrical coordinate is eliminated and the DOF numbering is unchanged.</remarks>
    public static Network WithTransducerForceFactor(this Network network, string name, double forceFactor)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.Positive(forceFactor, nameof(forceFactor));
        var i = IndexOf(network.Transducers, t => t.Name == name, "transducer", name);
        return Copy(network, transducers: network.Transducers.SetItem(i, network.Transducers[i] with { ForceFactor = forceFactor }));
    }

    /// <summary>The scale of per-direction values: the largest translational one (0 when there is none), as the model reader sets it.</summary>
    private static double Scale(ImmutableArray<DirectionalValue> components) =>
        components.Where(c => !c.Direction.IsRotation()).Select(c => c.Value).DefaultIfEmpty(0).Max();

    private static ImmutableArray<DirectionalValue> Scaled(ImmutableArray<DirectionalValue> components, double from, double to, string kind, string name)
    {
        if (components.IsDefaultOrEmpty || from == to) return components;
        if (!(from > 0))
        {
            if (to == 0) return components;
            throw new ArgumentException($"The {kind} '{name}' has no translational value above zero to scale; set one direction instead.", nameof(name));
        }
        var factor = to / from;
        return [.. components.Select(c => c with { Value = c.Value * factor })];
    }

    private static ImmutableArray<DirectionalValue> WithComponent(ImmutableArray<DirectionalValue> components, Dofs.Direction direction, double value, string kind, string name)
    {
        for (var j = 0; j < (components.IsDefault ? 0 : components.Length); j++)
            if (components[j].Direction == direction) return components.SetItem(j, new DirectionalValue(direction, value));
        throw new ArgumentException($"The {kind} '{name}' has no value in direction {direction}.", nameof(direction));
    }

    /// <summary>A copy with elements appended after the existing ones; references and names are checked as by <see cref="NetworkBuilder"/>.</summary>
    public static Network WithAdded(this Network network, IEnumerable<Mass> masses, IEnumerable<Spring> springs, IEnumerable<Damper> dampers)
    {
        ArgumentNullException.ThrowIfNull(network);
        var builder = new NetworkBuilder { Title = network.Title, Space = network.Space };
        foreach (var m in network.Masses.Concat(masses)) builder.AddMass(m);
        foreach (var s in network.Supports.Skip(1)) builder.AddSupport(s);
        builder.PlaceGround(network.Supports[0]);
        foreach (var b in network.Bodies) builder.AddBody(b);
        foreach (var s in network.Springs.Concat(springs)) builder.AddSpring(s);
        foreach (var d in network.Dampers.Concat(dampers)) builder.AddDamper(d);
        foreach (var l in network.Links) builder.AddLink(l.Name, [.. l.Masses]);
        var built = builder.Build();
        // Keep the original element records (and anything a later version adds to them) for the old part.
        return Copy(network,
            masses: [.. network.Masses, .. built.Masses.Skip(network.Masses.Length)],
            springs: [.. network.Springs, .. built.Springs.Skip(network.Springs.Length)],
            dampers: [.. network.Dampers, .. built.Dampers.Skip(network.Dampers.Length)]);
    }

    private static Network Copy(Network n, ImmutableArray<Mass>? masses = null, ImmutableArray<Spring>? springs = null,
        ImmutableArray<Damper>? dampers = null, ImmutableArray<RigidBody>? bodies = null, ImmutableArray<Inerter>? inerters = null,
        ImmutableArray<Transducer>? transducers = null) =>
        new(n.Title, masses ?? n.Masses, n.Supports, springs ?? n.Springs, dampers ?? n.Dampers)
        {
            Links = n.Links, Space = n.Space, Bodies = bodies ?? n.Bodies, Inerters = inerters ?? n.Inerters,
            Transducers = transducers ?? n.Transducers, ElectricalNodes = n.ElectricalNodes,
        };

    private static int IndexOf<T>(ImmutableArray<T> items, Func<T, bool> match, string kind, string name)
    {
        for (var i = 0; i < items.Length; i++)
            if (match(items[i])) return i;
        throw new ArgumentException($"The network has no {kind} named '{name}'.", nameof(name));
    }
}
