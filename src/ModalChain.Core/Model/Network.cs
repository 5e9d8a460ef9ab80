using System.Collections.Immutable;

namespace ModalChain.Core.Model;

/// <summary>A point on the drawing plane, in metres; used only to draw the network, never in the mechanics.</summary>
/// <param name="X">Horizontal drawing coordinate in m.</param>
/// <param name="Y">Vertical drawing coordinate in m.</param>
public readonly record struct DrawingPosition(double X, double Y);

/// <summary>A lumped mass that moves in the network's direction of motion.</summary>
/// <param name="Name">Unique name of the mass within its network.</param>
/// <param name="Kilograms">Mass in kg; positive and finite.</param>
/// <param name="Position">Optional drawing position in m.</param>
public sealed record Mass(string Name, double Kilograms, DrawingPosition? Position = null);

/// <summary>A fixed or prescribed-motion point of the network; <see cref="Network.Ground"/> always exists.</summary>
/// <param name="Name">Unique name of the support.</param>
/// <param name="Position">Optional drawing position in m.</param>
public sealed record Support(string Name, DrawingPosition? Position = null);

/// <summary>A linear spring between two nodes (masses or supports).</summary>
/// <param name="Name">Unique name of the spring within its network.</param>
/// <param name="NodeA">First end: a mass or support name.</param>
/// <param name="NodeB">Second end: a mass or support name, different from <paramref name="NodeA"/>.</param>
/// <param name="Stiffness">Stiffness in N/m; non-negative and finite.</param>
public sealed record Spring(string Name, string NodeA, string NodeB, double Stiffness);

/// <summary>A linear viscous damper between two nodes (masses or supports).</summary>
/// <param name="Name">Unique name of the damper within its network.</param>
/// <param name="NodeA">First end: a mass or support name.</param>
/// <param name="NodeB">Second end: a mass or support name, different from <paramref name="NodeA"/>.</param>
/// <param name="Coefficient">Damping coefficient in N·s/m; non-negative and finite.</param>
public sealed record Damper(string Name, string NodeA, string NodeB, double Coefficient);

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

    /// <summary>Sum of all masses in kg.</summary>
    public double TotalMass => Masses.Sum(m => m.Kilograms);

    /// <summary>True when <paramref name="node"/> names a support (including ground).</summary>
    public bool IsSupport(string node) => NodeNames.Of(this).Supports.Contains(node);

    /// <summary>True when <paramref name="node"/> names a mass.</summary>
    public bool IsMass(string node) => NodeNames.Of(this).Masses.Contains(node);

    /// <summary>Returns a copy with the masses in another order (same elements otherwise).</summary>
    /// <param name="order">A permutation of 0..n−1: entry i is the old index of the new i-th mass.</param>
    public Network WithMassOrder(IReadOnlyList<int> order)
    {
        Guard.Permutation(order, Masses.Length, nameof(order));
        return new Network(Title, [.. order.Select(i => Masses[i])], Supports, Springs, Dampers) { Links = Links };
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
    }

    public HashSet<string> Masses { get; }

    public HashSet<string> Supports { get; }

    public static NodeNames Of(Network network) => Table.GetValue(network, n => new NodeNames(n));
}
