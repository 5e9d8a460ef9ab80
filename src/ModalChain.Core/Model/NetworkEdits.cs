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

    /// <summary>A copy in which spring <paramref name="name"/> has stiffness <paramref name="stiffness"/> N/m.</summary>
    public static Network WithSpringStiffness(this Network network, string name, double stiffness)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(stiffness, nameof(stiffness));
        var i = IndexOf(network.Springs, s => s.Name == name, "spring", name);
        return Copy(network, springs: network.Springs.SetItem(i, network.Springs[i] with { Stiffness = stiffness }));
    }

    /// <summary>A copy in which damper <paramref name="name"/> has coefficient <paramref name="coefficient"/> N·s/m.</summary>
    public static Network WithDamperCoefficient(this Network network, string name, double coefficient)
    {
        ArgumentNullException.ThrowIfNull(network);
        Guard.NonNegative(coefficient, nameof(coefficient));
        var i = IndexOf(network.Dampers, d => d.Name == name, "damper", name);
        return Copy(network, dampers: network.Dampers.SetItem(i, network.Dampers[i] with { Coefficient = coefficient }));
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
        ImmutableArray<Damper>? dampers = null) =>
        new(n.Title, masses ?? n.Masses, n.Supports, springs ?? n.Springs, dampers ?? n.Dampers) { Links = n.Links, Space = n.Space, Bodies = n.Bodies, Inerters = n.Inerters };

    private static int IndexOf<T>(ImmutableArray<T> items, Func<T, bool> match, string kind, string name)
    {
        for (var i = 0; i < items.Length; i++)
            if (match(items[i])) return i;
        throw new ArgumentException($"The network has no {kind} named '{name}'.", nameof(name));
    }
}
